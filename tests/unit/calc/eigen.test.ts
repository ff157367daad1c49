// Undamped modes: positive eigenvalues, M-orthogonality, and a second route through mathjs
// (standard form M^-1/2 K M^-1/2 with mathjs eigs) agreeing to 1e-9 relative.
import fc from "fast-check";
import { eigs, matrix, multiply, transpose, type Matrix as MathMatrix } from "mathjs";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput } from "@/modules/calc";
import { buildModel } from "@/modules/calc/model";
import { runSoilCase } from "@/modules/calc/soil-case";
import { arbitraryInput } from "./helpers";

/** Property tests run many full analyses; allow for a loaded machine. */
const PROPERTY_TIMEOUT_MS = 60_000;

function modelOf(doc: unknown) {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const model = buildModel(parsed.input);
  const sc = runSoilCase(model, 1);
  const M = Array.from({ length: 6 }, (_, i) => Array.from(model.massMatrix.subarray(i * 6, i * 6 + 6)));
  const k = Array.from(sc.stiffnessUsed);
  return { M, k, modes: sc.modes };
}

function symmetricEigs(A: number[][]): { values: number[]; vectors: number[][] } {
  const res = eigs(matrix(A));
  const values = (res.values as MathMatrix).toArray() as number[];
  const vectors = res.eigenvectors.map((e) => (e.vector as MathMatrix).toArray() as number[]);
  return { values, vectors };
}

describe("generalised eigenproblem K phi = w^2 M phi", () => {
  it("eigenvalues positive, shapes mass-normalised and M- and K-orthogonal (random valid blocks)", () => {
    fc.assert(
      fc.property(arbitraryInput(), (doc) => {
        const { M, k, modes } = modelOf(doc);
        expect(modes).toHaveLength(6);
        for (let a = 0; a < 6; a++) {
          const pa = modes[a]!.shape;
          expect(modes[a]!.eigenvalue).toBeGreaterThan(0);
          if (a > 0) expect(modes[a]!.frequencyHz).toBeGreaterThanOrEqual(modes[a - 1]!.frequencyHz);
          const sum = Object.values(modes[a]!.participation).reduce((s, v) => s + v, 0);
          expect(sum).toBeCloseTo(1, 12);
          for (let b = 0; b < 6; b++) {
            const pb = modes[b]!.shape;
            let mab = 0;
            let kab = 0;
            for (let i = 0; i < 6; i++) {
              kab += pa[i]! * k[i]! * pb[i]!;
              for (let j = 0; j < 6; j++) mab += pa[i]! * M[i]![j]! * pb[j]!;
            }
            expect(Math.abs(mab - (a === b ? 1 : 0))).toBeLessThan(1e-9);
            const scale = Math.max(modes[a]!.eigenvalue, modes[b]!.eigenvalue);
            expect(Math.abs(kab - (a === b ? modes[a]!.eigenvalue : 0))).toBeLessThan(1e-9 * scale);
          }
        }
      }),
      { numRuns: 60 },
    );
  }, PROPERTY_TIMEOUT_MS);

  it("mathjs route (M^-1/2 K M^-1/2, mathjs eigs) agrees with the ml-matrix route to 1e-9 relative", () => {
    fc.assert(
      fc.property(arbitraryInput(), (doc) => {
        const { M, k, modes } = modelOf(doc);
        const { values: mv, vectors: Q } = symmetricEigs(M);
        // M^-1/2 = Q diag(1 / sqrt(lambda)) Q^T, Q with the eigenvectors as columns
        const Qm = transpose(matrix(Q));
        const D = matrix(mv.map((v, i) => mv.map((_, j) => (i === j ? 1 / Math.sqrt(v) : 0))));
        const Mih = multiply(multiply(Qm, D), transpose(Qm));
        const K = matrix(k.map((v, i) => k.map((_, j) => (i === j ? v : 0))));
        const A = multiply(multiply(Mih, K), Mih).toArray() as number[][];
        const As = A.map((row, i) => row.map((v, j) => (v + A[j]![i]!) / 2));
        const lambdas = symmetricEigs(As).values.slice().sort((a, b) => a - b);
        lambdas.forEach((l, i) => {
          const mine = modes[i]!.eigenvalue;
          expect(Math.abs(l - mine)).toBeLessThanOrEqual(1e-9 * Math.abs(mine));
        });
      }),
      { numRuns: 60 },
    );
  }, PROPERTY_TIMEOUT_MS);
});
