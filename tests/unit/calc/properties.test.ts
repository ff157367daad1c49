// Property-based tests (fast-check): invariance under a common horizontal shift, mirror
// symmetry, and finite output for every valid input.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisResult } from "@/modules/calc";
import type { AnalysisInputDocument } from "@/modules/calc/schema";
import { arbitraryInput } from "./helpers";

type Doc = AnalysisInputDocument;
type V3 = [number, number, number];
type Range = [number, number];

/** Property tests run many full analyses; allow for a loaded machine. */
const PROPERTY_TIMEOUT_MS = 60_000;

function run(doc: Doc): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}

/** Applies a map to every position and every box of an input. */
function mapGeometry(doc: Doc, point: (p: V3) => V3, range: (r: Range, axis: 0 | 1 | 2) => Range): Doc {
  const box = <B extends { x: Range; y: Range; z: Range }>(b: B): B => ({ ...b, x: range(b.x, 0), y: range(b.y, 1), z: range(b.z, 2) });
  return {
    ...doc,
    block: { ...doc.block, solids: doc.block.solids.map(box) },
    machines: doc.machines.map((m) => ({
      ...m,
      cg: point(m.cg),
      ...(m.box ? { box: box(m.box) } : {}),
      rotors: (m.rotors ?? []).map((r) => ({ ...r, bearings: r.bearings.map(point) })),
    })),
    checkPoints: doc.checkPoints?.map((c) => ({ ...c, position: point(c.position) })),
  };
}

function shift(doc: Doc, dx: number, dy: number): Doc {
  const d = [dx, dy, 0];
  return mapGeometry(doc, (p) => [p[0] + dx, p[1] + dy, p[2]], (r, a) => [r[0] + d[a]!, r[1] + d[a]!]);
}

function mirror(doc: Doc, axis: 0 | 1): Doc {
  return mapGeometry(
    doc,
    (p) => p.map((v, i) => (i === axis ? -v : v)) as V3,
    (r, a) => (a === axis ? [-r[1], -r[0]] : r),
  );
}

// 1e-7 relative: lightly damped systems near resonance amplify round-off
function expectClose(a: number, b: number, scale: number, tol = 1e-7) {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(scale, 1e-300));
}

/** Compares frequencies and every amplitude (per axis, rated and over the speed range). */
function compareResponses(a: AnalysisResult, b: AnalysisResult, includeCase: (rotorIndex: number, caseName: string) => boolean) {
  a.modes.forEach((m, i) => expectClose(m.frequencyHz, b.modes[i]!.frequencyHz, m.frequencyHz));
  a.rotors.forEach((r, ri) => {
    r.cases.forEach((c, ci) => {
      if (!includeCase(ri, c.case)) return;
      const other = b.rotors[ri]!.cases[ci]!;
      const scale = Math.max(...c.points.flatMap((p) => p.displacementPeak));
      c.points.forEach((p, pi) => {
        p.displacementPeak.forEach((v, k) => expectClose(v, other.points[pi]!.displacementPeak[k]!, scale));
        expectClose(p.overSpeedRange!.displacementPeak, other.points[pi]!.overSpeedRange!.displacementPeak, scale);
      });
      expectClose(c.transmissibility, other.transmissibility, Math.max(c.transmissibility, 1e-6));
    });
  });
}

describe("a common horizontal shift of every coordinate", () => {
  it("changes no frequency or amplitude (O follows the base centroid)", () => {
    fc.assert(
      fc.property(arbitraryInput(), fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true }), (doc, dx, dy) => {
        const a = run(doc);
        const b = run(shift(doc, dx, dy));
        compareResponses(a, b, () => true);
        expectClose(a.massProperties.massRatio, b.massProperties.massRatio, a.massProperties.massRatio);
        expectClose(a.massProperties.cg[0] + dx, b.massProperties.cg[0], Math.abs(dx) + 10);
      }),
      { numRuns: 40 },
    );
  }, PROPERTY_TIMEOUT_MS);
});

describe("mirroring the block", () => {
  it("mirrors the response: same frequencies and per-axis amplitudes at mirrored points", () => {
    fc.assert(
      fc.property(arbitraryInput(), fc.constantFrom(0 as const, 1 as const), (doc, axis) => {
        const a = run(doc);
        const b = run(mirror(doc, axis));
        const rotorAxes = doc.machines.flatMap((m) => (m.rotors ?? []).map((r) => r.axis));
        // a mirror across the shaft's own plane reverses a rotating load's sense, so the rotating
        // case is compared only for rotors whose shaft lies along the mirrored axis
        compareResponses(a, b, (ri, c) => c !== "rotating" || rotorAxes[ri] === (axis === 0 ? "x" : "y"));
      }),
      { numRuns: 40 },
    );
  }, PROPERTY_TIMEOUT_MS);
});

function walkFinite(value: unknown, path: string, bad: string[]) {
  if (typeof value === "number") {
    if (!Number.isFinite(value)) bad.push(path);
  } else if (Array.isArray(value)) value.forEach((v, i) => walkFinite(v, `${path}[${i}]`, bad));
  else if (value && typeof value === "object") for (const [k, v] of Object.entries(value)) walkFinite(v, `${path}.${k}`, bad);
}

describe("finite output", () => {
  it("no NaN or Infinity anywhere in the result of any valid input", () => {
    fc.assert(
      fc.property(arbitraryInput(), (doc) => {
        const result = run(doc);
        const bad: string[] = [];
        walkFinite(result, "", bad);
        expect(bad).toEqual([]);
        expect(JSON.stringify(result)).not.toContain("null");
      }),
      { numRuns: 80 },
    );
  }, PROPERTY_TIMEOUT_MS);
});
