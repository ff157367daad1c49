// Block-sizing assistant: starting from the demo pump train that fails the mass ratio, the
// proposals pass every check when re-analysed independently by the core, they are the
// smallest of the grid, they respect the bounds and step, and applying one moves everything
// the mat carries with its top while O stays at the origin.
import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument, type AnalysisResult } from "@/modules/calc";
import { applySizingProposal, parseSizingOptions, proposeBlockSizes, proposeBlockSizesAsync, type SizingProposal, type SizingResult } from "@/modules/sizing";

const dir = path.resolve(import.meta.dirname, "../../../examples");
const load = (file: string): AnalysisInputDocument => JSON.parse(readFileSync(path.join(dir, file), "utf8"));
const demo = () => load("raw-water-pump-train.json");
const enlarged = () => load("raw-water-pump-train-enlarged.json");

/** Full analysis (the document's own 600-point sweep) as a desk would run it. */
function analyseDoc(doc: unknown, soilBand = false): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input, { soilBand });
}

/** Net concrete volume, computed here from the boxes (voids subtracted). */
function concrete(doc: AnalysisInputDocument): number {
  return doc.block.solids.reduce((sum, s) => {
    const v = (s.x[1] - s.x[0]) * (s.y[1] - s.y[0]) * (s.z[1] - s.z[0]);
    return sum + (s.void ? -v : v);
  }, 0);
}

const machineMass = (doc: AnalysisInputDocument) => doc.machines.reduce((s, m) => s + m.mass, 0);
const failing = (r: AnalysisResult) => r.checks.filter((c) => !c.pass).map((c) => c.key);

function found(out: ReturnType<typeof proposeBlockSizes>): SizingResult {
  if (!out.ok) throw new Error(JSON.stringify(out.issues));
  return out.result;
}

function applied(doc: AnalysisInputDocument, p: SizingProposal): AnalysisInputDocument {
  const out = applySizingProposal(doc, p);
  if (!out.ok) throw new Error(JSON.stringify(out.issues));
  return out.document;
}

// Bounds that hold both the demo block (7.6 x 3.2 x 1.1) and the hand-enlarged one (8.4 x 3.6 x 1.3).
const BOUNDS = {
  length: { min: 7.0, max: 8.4, step: 0.1 },
  width: { min: 3.0, max: 3.6, step: 0.1 },
  thickness: { min: 1.0, max: 1.3, step: 0.1 },
};
const inBounds = (v: number, r: { min: number; max: number }) => v >= r.min - 1e-9 && v <= r.max + 1e-9;
const onStep = (v: number, step: number) => Math.abs(v / step - Math.round(v / step)) < 1e-9;

describe("sizing the failing demo pump train", () => {
  const start = demo();
  let result: SizingResult;
  beforeAll(() => {
    result = found(proposeBlockSizes(start, { dimensions: BOUNDS }));
  });

  it("gives the same answer when run in slices that hand the thread back (the API's way)", async () => {
    let ticks = 0;
    const timer = setInterval(() => ticks++, 0);
    // a slice of 0 ms hands the thread back after every analysis
    const sliced = await proposeBlockSizesAsync(start, { dimensions: BOUNDS, requireSoilBand: true }, { sliceMs: 0 });
    clearInterval(timer);
    const whole = proposeBlockSizes(start, { dimensions: BOUNDS, requireSoilBand: true });
    expect(sliced).toEqual(whole);
    // the other work (the timer) ran while the search was going on
    expect(ticks).toBeGreaterThan(0);
    // two full searches with the band required; since issue 18 item 7 each analysis of the pump
    // train also combines the motor and pump (and checks the combination at three soil cases),
    // which took the test past vitest's 5 s default on this machine (about 3 s before)
  }, 30_000);

  it("starts from a block that fails only the mass ratio", () => {
    expect(failing(analyseDoc(start))).toEqual(["mass-ratio"]);
  });

  it("proposes a block that passes every nominal check when re-analysed independently (the band is not required here)", () => {
    expect(result.found).toBe(true);
    expect(result.proposals.length).toBeGreaterThan(0);
    for (const p of result.proposals) {
      const doc = applied(start, p);
      const again = analyseDoc(doc, true);
      const nominal = again.checks.filter((c) => !c.soilCase);
      expect(nominal.filter((c) => !c.pass)).toEqual([]);
      expect(nominal.length).toBe(analyseDoc(start).checks.length);
      expect(again.massProperties.massRatio).toBeCloseTo(p.massRatio, 9);
      expect(concrete(doc)).toBeCloseTo(p.concreteVolume, 9);
      // the lowest frequency ratio is the rated speed over the highest mode
      const rpm = 1785;
      expect(p.lowestFrequencyRatio).toBeCloseTo(rpm / 60 / Math.max(...again.modes.map((m) => m.frequencyHz)), 6);
      expect(p.governing.margin).toBeGreaterThanOrEqual(0);
    }
  });

  it("is no larger than the hand-enlarged block, and no smaller grid block reaches the mass ratio", () => {
    const big = enlarged();
    const mat = big.block.solids[0]!;
    // the enlarged block is itself a candidate of the grid, so the search could have chosen it
    expect(inBounds(mat.x[1] - mat.x[0], BOUNDS.length) && inBounds(mat.y[1] - mat.y[0], BOUNDS.width) && inBounds(mat.z[1] - mat.z[0], BOUNDS.thickness)).toBe(true);
    const best = result.proposals[0]!;
    expect(best.concreteVolume).toBeLessThanOrEqual(concrete(big));
    // minimality: every combination of the grid with less concrete has a mass ratio under 3
    // (contract: block mass over machine mass), so it cannot pass
    const others = concrete(start) - (7.6 * 3.2 * 1.1);
    const rho = start.block.concreteDensity;
    let smaller = 0;
    for (let l = 70; l <= 84; l++)
      for (let w = 30; w <= 36; w++)
        for (let t = 10; t <= 13; t++) {
          const v = (l / 10) * (w / 10) * (t / 10) + others;
          if (v < best.concreteVolume - 1e-9) {
            smaller++;
            expect((rho * v) / machineMass(start)).toBeLessThan(3);
          }
        }
    expect(smaller).toBeGreaterThan(0);
    expect(result.failures[0]?.id).toBe("mass-ratio");
    // so the smallest passing block sits on the mass-ratio limit, which governs it
    expect(best.governing.id).toBe("mass-ratio");
    expect(best.governing.margin).toBeCloseTo(best.massRatio / 3 - 1, 12);
  });

  it("respects the bounds and the step, orders the proposals by volume and counts its analyses", () => {
    expect(result.proposals).toHaveLength(3);
    for (const p of result.proposals) {
      for (const key of ["length", "width", "thickness"] as const) {
        expect(inBounds(p.dimensions[key], BOUNDS[key])).toBe(true);
        expect(onStep(p.dimensions[key], BOUNDS[key].step)).toBe(true);
      }
      const d = p.dimensions;
      expect(p.concreteVolume).toBeCloseTo(d.length * d.width * d.thickness + concrete(start) - 7.6 * 3.2 * 1.1, 9);
    }
    const volumes = result.proposals.map((p) => p.concreteVolume);
    expect(volumes).toEqual([...volumes].sort((a, b) => a - b));
    expect(result.proposals.map((p) => p.rank)).toEqual([1, 2, 3]);
    expect(result.analysesRun).toBe(result.candidates.analysed);
    expect(result.analysesRun).toBeGreaterThanOrEqual(3);
    expect(result.capped).toBe(false);
    expect(result.candidates.total).toBe(15 * 7 * 4);
  });

  it("keeps a dimension that is not allowed to change", () => {
    const only = found(proposeBlockSizes(start, { dimensions: { thickness: { min: 1.0, max: 1.6 } } }));
    expect(only.proposals.length).toBeGreaterThan(0);
    for (const p of only.proposals) {
      expect(p.dimensions.length).toBeCloseTo(7.6, 12);
      expect(p.dimensions.width).toBeCloseTo(3.2, 12);
      expect(p.dimensions.thickness).toBeGreaterThan(1.1);
    }
  });
});

describe("applying a proposal", () => {
  const start = demo();

  it("keeps the machines, bearings and plinths at their height above the mat top and O at the origin", () => {
    const result = found(proposeBlockSizes(start, { dimensions: BOUNDS }));
    const thicker = result.proposals.find((p) => p.dimensions.thickness > 1.1 + 1e-9);
    expect(thicker).toBeDefined();
    const before = structuredClone(start);
    const doc = applied(start, thicker!);
    expect(start).toEqual(before); // the given document is not changed
    const top0 = start.block.solids[0]!.z[1];
    const mat = doc.block.solids[0]!;
    const d = thicker!.dimensions;
    expect(mat.x).toEqual([-d.length / 2, d.length / 2]);
    expect(mat.y).toEqual([-d.width / 2, d.width / 2]);
    expect(mat.z).toEqual([0, d.thickness]);
    const top = mat.z[1];
    doc.machines.forEach((m, i) => {
      const m0 = start.machines[i]!;
      expect(m.cg[2] - top).toBeCloseTo(m0.cg[2] - top0, 9);
      expect(m.cg[0]).toBeCloseTo(m0.cg[0], 9);
      m.rotors!.forEach((r, j) => r.bearings.forEach((b, k) => expect(b[2] - top).toBeCloseTo(m0.rotors![j]!.bearings[k]![2] - top0, 9)));
    });
    doc.block.solids.slice(1).forEach((s, i) => {
      const s0 = start.block.solids[i + 1]!;
      expect(s.z[0] - top).toBeCloseTo(s0.z[0] - top0, 9);
      expect(s.z[1] - s.z[0]).toBeCloseTo(s0.z[1] - s0.z[0], 9);
    });
    // the check point at the mat corner stays at the corner
    expect(doc.checkPoints![1]!.position).toEqual([d.length / 2, d.width / 2, top]);
    const r = analyseDoc(doc);
    expect(r.massProperties.origin).toEqual([0, 0, 0]);
    expect(r.warnings.some((w) => w.includes("base contact area"))).toBe(false);
  });

  it("centred on the load, leaves no eccentricity beyond the millimetre of placement", () => {
    const load = found(proposeBlockSizes(start, { dimensions: BOUNDS, centre: "load" }));
    const p = load.proposals[0]!;
    expect(p.placement.mode).toBe("load");
    const doc = applied(start, p);
    const r = analyseDoc(doc);
    const [lx, ly] = r.massProperties.baseDimensions!;
    // O is at the origin and the combined cg is within 0.5 mm of it in plan (placement rounding)
    for (const v of r.massProperties.origin!) expect(Math.abs(v)).toBeLessThan(1e-9);
    expect(Math.abs(r.massProperties.eccentricity[0] * lx)).toBeLessThanOrEqual(0.0005 + 1e-9);
    expect(Math.abs(r.massProperties.eccentricity[1] * ly)).toBeLessThanOrEqual(0.0005 + 1e-9);
    const current = analyseDoc(applied(start, { ...p, placement: { ...p.placement, mode: "current" } }));
    expect(Math.abs(current.massProperties.eccentricity[0] * lx)).toBeGreaterThan(0.0005);
    // the machines keep their distance from each other
    expect(doc.machines[1]!.cg[0] - doc.machines[0]!.cg[0]).toBeCloseTo(start.machines[1]!.cg[0] - start.machines[0]!.cg[0], 9);
  });

  it("refuses dimensions that cannot hold the plinths and the drain pit, naming the dimension", () => {
    const out = applySizingProposal(start, { dimensions: { length: 6.5, width: 3.2, thickness: 0.3 }, placement: { mode: "current" } });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.issues.map((i) => `${i.in}:${i.path}`)).toEqual(["proposal:dimensions.length", "proposal:dimensions.thickness"]);
  });
});

describe("when nothing in the bounds passes", () => {
  it("returns no proposal and names the mass ratio, confirmed by the core on the largest block", () => {
    const start = demo();
    const tight = { length: { min: 7.0, max: 7.6 }, width: { min: 3.0, max: 3.2 }, thickness: { min: 1.0, max: 1.1 } };
    const r = found(proposeBlockSizes(start, { dimensions: tight }));
    expect(r.found).toBe(false);
    expect(r.proposals).toEqual([]);
    const fitting = r.candidates.total - r.candidates.doNotFit;
    expect(r.failures[0]).toMatchObject({ id: "mass-ratio", candidates: fitting });
    expect(r.message).toMatch(/mass ratio/);
    expect(r.nearest?.failing.map((c) => c.id)).toEqual(["mass-ratio"]);
    expect(r.nearest?.dimensions).toEqual({ length: 7.6, width: 3.2, thickness: 1.1 });
    expect(r.nearest?.failing[0]!.value).toBeLessThan(3);
    expect(r.nearest?.failing[0]!.margin).toBeCloseTo(r.nearest!.failing[0]!.value / 3 - 1, 12);
    expect(r.analysesRun).toBe(1);
  });

  it("says when nothing in the bounds can hold the plinths and the drain pit", () => {
    const r = found(proposeBlockSizes(demo(), { dimensions: { length: { min: 5, max: 6.5 } } }));
    expect(r.found).toBe(false);
    expect(r.candidates.doNotFit).toBe(r.candidates.total);
    expect(r.analysesRun).toBe(0);
    expect(r.minimumFit.length).toBeCloseTo(7.0, 9); // drain pit edge at x = 3.5 about a centre at 0
    expect(r.message).toMatch(/at least 7\.000 m/);
  });

  it("reports when the analysis cap stops the search", () => {
    const r = found(
      proposeBlockSizes(demo(), {
        dimensions: { length: { min: 7.0, max: 7.2 }, width: { min: 3.0, max: 3.2 }, thickness: { min: 1.4, max: 1.8 } },
        requireSoilBand: true,
        maxAnalyses: 2,
      }),
    );
    expect(r.analysesRun).toBe(2);
    expect(r.capped).toBe(true);
    expect(r.candidates.notReached).toBeGreaterThan(0);
    expect(r.message).toMatch(/cap of 2 analyses/);
  });
});

describe("the soil band as a requirement", () => {
  // the operating speed of both rotors, 1785 rpm, against every bound frequency
  const bandClear = (r: AnalysisResult) =>
    [r.bounds!.lower, r.bounds!.upper].every((b) => b.frequenciesHz.every((f) => Math.abs(1785 / 60 / f - 1) >= 0.2));
  const grid = { length: { min: 7.0, max: 7.2 }, width: { min: 3.0, max: 3.2 }, thickness: { min: 1.4, max: 1.8 } };

  it("when required, every proposal's soil band clears the operating speed; without it the smallest block does not", () => {
    const start = demo();
    const withBand = found(proposeBlockSizes(start, { dimensions: grid, requireSoilBand: true, proposals: 1 }));
    const nominal = found(proposeBlockSizes(start, { dimensions: grid, proposals: 1 }));
    expect(withBand.found && nominal.found).toBe(true);
    const b = withBand.proposals[0]!;
    const n = nominal.proposals[0]!;
    const rb = analyseDoc(applied(start, b), true);
    expect(failing(rb)).toEqual([]);
    expect(bandClear(rb)).toBe(true);
    // the search judged exactly the core's checks, the band's separation, displacement and velocity included
    expect(b.checksPassed).toBe(rb.checks.length);
    expect(rb.checks.filter((c) => c.soilCase).map((c) => c.id)).toContain("velocity@soil-lower");
    const rn = analyseDoc(applied(start, n), true);
    // the nominal proposal passes every nominal check; the core's band checks fail its separation
    expect(rn.checks.filter((c) => !c.pass && !c.soilCase)).toEqual([]);
    expect(bandClear(rn)).toBe(false);
    expect(rn.checks.filter((c) => !c.pass).every((c) => c.id === "frequency-separation@soil-lower" || c.id === "frequency-separation@soil-upper")).toBe(true);
    expect(failing(rn).length).toBeGreaterThan(0);
    expect(b.concreteVolume).toBeGreaterThan(n.concreteVolume);
    expect(withBand.failures.map((f) => f.id).some((id) => /^frequency-separation@soil-(lower|upper)$/.test(id))).toBe(true);
  });
});

describe("notes on what the search keeps as entered", () => {
  it("warns that user-entered springs are not resized with the base, and says nothing of the kind for computed springs", () => {
    const opts = { dimensions: { thickness: { min: 1.0, max: 1.4 } } };
    const user = found(proposeBlockSizes(load("user-springs.json"), opts));
    expect(user.notes.some((n) => /user-entered/.test(n))).toBe(true);
    expect(found(proposeBlockSizes(demo(), opts)).notes).toEqual([]);
  });
});

describe("validation", () => {
  const issuesOf = (options: unknown) => {
    const out = parseSizingOptions(options);
    if (out.ok) throw new Error("expected the options to be refused");
    return out.issues;
  };
  const expectIssue = (options: unknown, path: string, message: RegExp) => {
    const issues = issuesOf(options);
    const hit = issues.find((i) => i.path === path);
    expect(hit, JSON.stringify(issues)).toBeDefined();
    expect(hit!.message).toMatch(message);
  };

  it("fills the defaults", () => {
    const out = parseSizingOptions({ dimensions: { length: { min: 7, max: 8 } } });
    expect(out.ok && out.options).toMatchObject({ centre: "current", requireSoilBand: false, maxAnalyses: 400, proposals: 3, dimensions: { length: { step: 0.1 } } });
  });

  it("refuses bad options with their paths", () => {
    expectIssue({ dimensions: { length: { min: 8, max: 7 } } }, "dimensions.length.max", /at least min/);
    expectIssue({ dimensions: { width: { min: 3, max: 4, step: 0 } } }, "dimensions.width.step", /greater than 0/);
    expectIssue({ dimensions: { thickness: { min: 1.01, max: 1.09, step: 0.1 } } }, "dimensions.thickness", /no multiple of the step/);
    expectIssue({ dimensions: { length: { min: 1, max: 500, step: 0.01 } } }, "dimensions.length.step", /at most 1000/);
    // a step so fine (or bounds so large) that the count of values is not even a finite number
    expectIssue({ dimensions: { length: { min: 1, max: 2, step: 5e-324 } } }, "dimensions.length.step", /too fine/);
    expectIssue({ dimensions: { width: { min: 1, max: 1e308, step: 1e-10 } } }, "dimensions.width.step", /too fine/);
    expectIssue({ dimensions: { height: { min: 1, max: 2 } } }, "dimensions.height", /unknown field/);
    expectIssue({ dimensions: {} }, "dimensions", /at least one of length, width and thickness/);
    expectIssue({}, "dimensions", /is required/);
    expectIssue({ dimensions: { length: { min: 7, max: 8 } }, centre: "middle" }, "centre", /"current" or "load"/);
    expectIssue({ dimensions: { length: { min: 7, max: 8 } }, maxAnalyses: 2.5 }, "maxAnalyses", /whole number/);
    expectIssue({ dimensions: { length: { min: "7", max: 8 } } }, "dimensions.length.min", /finite number/);
  });

  it("echoes no floating-point noise of a bound converted from feet (the panel words it in the project's units)", () => {
    // 23 ft = 7.0104 m, as a conversion writes it
    const issues = issuesOf({ dimensions: { length: { min: 23 * 0.3048, max: 7 }, width: { min: 3.01, max: 3.09, step: 0.1 } } });
    expect(issues.length).toBe(2);
    for (const i of issues) expect(i.message).not.toMatch(/\d\.\d{5,}/);
  });

  it("tells which argument a problem is in", () => {
    const out = proposeBlockSizes({ ...demo(), schemaVersion: 2 }, { dimensions: { length: { min: 8, max: 7 } } });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.issues).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ in: "options", path: "dimensions.length.max" }),
        expect.objectContaining({ in: "input", path: "schemaVersion" }),
      ]),
    );
  });

  it("refuses a block it cannot resize, naming the field", () => {
    const opts = { dimensions: { length: { min: 7, max: 9 } } };
    const refused = (doc: AnalysisInputDocument) => {
      expect(parseAnalysisInput(doc).ok).toBe(true); // a valid input, just not one the assistant can resize
      const out = proposeBlockSizes(doc, opts);
      if (out.ok) throw new Error("expected a refusal");
      return out.issues.map((i) => `${i.in}:${i.path}`);
    };
    const twoBases = demo();
    twoBases.block.solids.push({ name: "side pad", x: [3.8, 5], y: [-1, 1], z: [0, 0.6] });
    expect(refused(twoBases)).toEqual(["input:block.solids[4]"]);
    const baseVoid = demo();
    baseVoid.block.solids.push({ name: "duct", x: [-3.6, -3.4], y: [-0.2, 0.2], z: [0, 1.1], void: true });
    expect(refused(baseVoid)).toEqual(["input:block.solids[4].z"]);
    const lowPlinth = demo();
    lowPlinth.block.solids.push({ name: "shelf", x: [3.8, 4.4], y: [-1, 1], z: [0.5, 1.4] });
    expect(refused(lowPlinth)).toEqual(["input:block.solids[4].z"]);
  });
});

describe("a required margin inside every limit", () => {
  // the same grid as the first suite; a margin of 10 % on every check
  const MARGIN = 0.1;
  const start = demo();
  let plain: SizingResult;
  let kept: SizingResult;
  beforeAll(() => {
    plain = found(proposeBlockSizes(start, { dimensions: BOUNDS, proposals: 1 }));
    kept = found(proposeBlockSizes(start, { dimensions: BOUNDS, proposals: 2, margin: MARGIN }));
  });

  /** Share of the limit left, computed here from value and limit (not by the module's checkMargin). */
  const spare = (c: { comparison?: "min" | "max"; value: number; limit: number }) =>
    c.comparison === "min" ? c.value / c.limit - 1 : 1 - Math.abs(c.value) / c.limit;

  it("without a margin the smallest block sits on a limit (inside 10 %); with it every check of every proposal clears its limit by 10 %", () => {
    expect(plain.found && kept.found).toBe(true);
    const r0 = analyseDoc(applied(start, plain.proposals[0]!));
    expect(Math.min(...r0.checks.map(spare))).toBeLessThan(MARGIN);
    for (const p of kept.proposals) {
      const r = analyseDoc(applied(start, p));
      expect(failing(r)).toEqual([]);
      for (const c of r.checks) expect(spare(c), `${c.key}: ${c.value} against ${c.limit}`).toBeGreaterThanOrEqual(MARGIN - 1e-9);
      // the mass ratio, in the contract's own definition, holds 1.1 x the minimum
      expect(p.massRatio).toBeGreaterThanOrEqual(r.checks.find((c) => c.id === "mass-ratio")!.limit * (1 + MARGIN) - 1e-9);
      expect(p.governing.margin).toBeGreaterThanOrEqual(MARGIN - 1e-9);
    }
    expect(kept.proposals[0]!.concreteVolume).toBeGreaterThan(plain.proposals[0]!.concreteVolume);
    expect(kept.message).toMatch(/at least 10\.0 % inside every limit/);
    expect(kept.options.margin).toBe(MARGIN);
  });

  it("keeps the margin on the soil band's checks too when the band is required", () => {
    const grid = { length: { min: 7.0, max: 7.4 }, width: { min: 3.0, max: 3.4 }, thickness: { min: 1.4, max: 2.0 } };
    const r = found(proposeBlockSizes(start, { dimensions: grid, requireSoilBand: true, proposals: 1, margin: 0.05 }));
    expect(r.found).toBe(true);
    const rb = analyseDoc(applied(start, r.proposals[0]!), true);
    expect(rb.checks.some((c) => c.soilCase)).toBe(true);
    for (const c of rb.checks) expect(spare(c), c.key).toBeGreaterThanOrEqual(0.05 - 1e-9);
  });

  it("is validated: a number from 0 to 0.5, 0 by default", () => {
    const ok = parseSizingOptions({ dimensions: BOUNDS });
    expect(ok.ok && ok.options.margin).toBe(0);
    for (const [margin, message] of [
      [-0.1, /at least 0/],
      [0.6, /at most 0.5/],
      ["10%", /must be a number/],
    ] as const) {
      const out = parseSizingOptions({ dimensions: BOUNDS, margin });
      expect(out.ok).toBe(false);
      if (!out.ok) expect(out.issues.find((i) => i.path === "margin")?.message).toMatch(message);
    }
  });
});

describe("a pile cap (method piles, issue 16)", () => {
  it("never proposes or analyses a cap that leaves a pile head uncovered: the minimum fit holds every pile's circle", () => {
    const doc = load("pile-cap.json");
    const out = proposeBlockSizes(doc, { maxAnalyses: 12, dimensions: { length: { min: 2, max: 5 }, thickness: { min: 1.0, max: 1.4 } } });
    if (!out.ok) throw new Error(JSON.stringify(out.issues));
    // heads at x = +-1.4, y = +-0.8, d = 0.5: 2 (1.4 + 0.25) by 2 (0.8 + 0.25), and more when the mat must also carry the machine's bearings
    expect(out.result.minimumFit.length).toBeCloseTo(3.3, 9);
    expect(out.result.minimumFit.width).toBeGreaterThanOrEqual(2.1 - 1e-9);
    expect(out.result.candidates.doNotFit).toBeGreaterThan(0);
    expect(out.result.analysesRun).toBeGreaterThan(0);
  });
});
