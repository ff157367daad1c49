// The lean complex LU of the hot loop against complex.js arithmetic (residual of S x = b).
import Complex from "complex.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ComplexSystem6 } from "@/modules/calc/complex-lu";

describe("complex 6 x 6 LU with partial pivoting", () => {
  it("solves random systems: residual |S x - b| small (complex.js multiply)", () => {
    const entry = fc.double({ min: -10, max: 10, noNaN: true });
    fc.assert(
      fc.property(fc.array(entry, { minLength: 72, maxLength: 72 }), fc.array(entry, { minLength: 12, maxLength: 12 }), (a, b) => {
        const sys = new ComplexSystem6();
        for (let i = 0; i < 36; i++) {
          sys.re[i] = a[i]!;
          sys.im[i] = a[36 + i]! + (i % 7 === 0 ? 25 : 0); // diagonally dominant in the imaginary part: regular
        }
        const S = Array.from({ length: 36 }, (_, i) => new Complex(sys.re[i]!, sys.im[i]!));
        const bRe = Float64Array.from(b.slice(0, 6));
        const bIm = Float64Array.from(b.slice(6));
        sys.factorise();
        // the multi-RHS solve: the same b twice (second slot at offset 6) and a real b = Re(b)
        const mr = new Float64Array(18);
        const mi = new Float64Array(18);
        sys.solveMany([bRe, bRe, bRe], [bIm, bIm, null], Int32Array.from([0, 6, 12]), mr, mi);
        const residual = (x: (j: number) => Complex, rhs: (i: number) => Complex) => {
          let worst = 0;
          for (let i = 0; i < 6; i++) {
            let sum = new Complex(0, 0);
            for (let j = 0; j < 6; j++) sum = sum.add(S[i * 6 + j]!.mul(x(j)));
            worst = Math.max(worst, sum.sub(rhs(i)).abs() / (1 + rhs(i).abs()));
          }
          return worst;
        };
        const full = (i: number) => new Complex(b[i]!, b[6 + i]!);
        expect(residual((j) => new Complex(mr[j]!, mi[j]!), full)).toBeLessThan(1e-7);
        expect(residual((j) => new Complex(mr[6 + j]!, mi[6 + j]!), full)).toBeLessThan(1e-7);
        expect(residual((j) => new Complex(mr[12 + j]!, mi[12 + j]!), (i) => new Complex(b[i]!, 0))).toBeLessThan(1e-7);
      }),
      { numRuns: 200 },
    );
  });

  it("pivots: a zero leading entry is handled", () => {
    const sys = new ComplexSystem6();
    // permutation-like matrix with S[0][0] = 0
    for (let i = 0; i < 6; i++) sys.re[i * 6 + ((i + 1) % 6)] = i + 1;
    const xr = new Float64Array(6);
    const xi = new Float64Array(6);
    sys.factorise();
    sys.solveMany([Float64Array.from([1, 2, 3, 4, 5, 6])], [null], Int32Array.from([0]), xr, xi);
    // row i: (i + 1) x_{i+1} = b_i
    for (let i = 0; i < 6; i++) expect(xr[(i + 1) % 6]! * (i + 1)).toBeCloseTo(i + 1, 12);
  });
});
