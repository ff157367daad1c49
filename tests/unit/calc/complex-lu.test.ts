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
        const xr = Float64Array.from(b.slice(0, 6));
        const xi = Float64Array.from(b.slice(6));
        sys.factorise();
        sys.solveInPlace(xr, xi);
        for (let i = 0; i < 6; i++) {
          let sum = new Complex(0, 0);
          for (let j = 0; j < 6; j++) sum = sum.add(S[i * 6 + j]!.mul(new Complex(xr[j]!, xi[j]!)));
          expect(sum.sub(new Complex(b[i]!, b[6 + i]!)).abs()).toBeLessThan(1e-9 * (1 + Math.hypot(b[i]!, b[6 + i]!)) * 100);
        }
      }),
      { numRuns: 200 },
    );
  });

  it("pivots: a zero leading entry is handled", () => {
    const sys = new ComplexSystem6();
    // permutation-like matrix with S[0][0] = 0
    for (let i = 0; i < 6; i++) sys.re[i * 6 + ((i + 1) % 6)] = i + 1;
    const xr = Float64Array.from([1, 2, 3, 4, 5, 6]);
    const xi = new Float64Array(6);
    sys.factorise();
    sys.solveInPlace(xr, xi);
    // row i: (i + 1) x_{i+1} = b_i
    for (let i = 0; i < 6; i++) expect(xr[(i + 1) % 6]! * (i + 1)).toBeCloseTo(i + 1, 12);
  });
});
