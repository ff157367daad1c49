// Soil band (G / 1.5 and 1.5 G, common practice, ASCE 4 recalled), frequency-separation checks
// (common practice, ACI 351.3R), speed-range envelopes and warnings.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisResult } from "@/modules/calc";
import { separationOverRange } from "@/modules/calc/checks";
import type { AnalysisInputDocument } from "@/modules/calc/schema";
import { relClose, symmetricBlock } from "./helpers";

function run(doc: AnalysisInputDocument): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}

describe("soil band", () => {
  it("equivalent radius: every frequency scales with sqrt(G factor) (k proportional to G, M unchanged)", () => {
    const result = run(symmetricBlock());
    const { lower, upper } = result.bounds!;
    expect(lower.factor).toBeCloseTo(1 / 1.5, 12);
    expect(upper.factor).toBeCloseTo(1.5, 12);
    result.modes.forEach((m, i) => {
      expect(relClose(lower.frequenciesHz[i]!, m.frequencyHz * Math.sqrt(1 / 1.5), 1e-9)).toBe(true);
      expect(relClose(upper.frequenciesHz[i]!, m.frequencyHz * Math.sqrt(1.5), 1e-9)).toBe(true);
    });
    expect(relClose(upper.shearModulus!, 1.5 * result.impedance.shearModulus!, 1e-12)).toBe(true);
    expect(relClose(lower.frequencyRatios[0]!.ratios[0]!, (1500 / 60) / lower.frequenciesHz[0]!, 1e-12)).toBe(true);
  });

  it("user springs: the factors multiply the user stiffness", () => {
    const impedance: AnalysisInputDocument["impedance"] = {
      method: "user",
      stiffness: { x: 1e9, y: 1e9, z: 2e9, rx: 5e9, ry: 6e9, rz: 4e9 },
      dampingRatio: { x: 0.1, y: 0.1, z: 0.1, rx: 0.1, ry: 0.1, rz: 0.1 },
    };
    const result = run({ ...symmetricBlock({ impedance }), soilBand: { lowerFactor: 0.5, upperFactor: 2 } });
    result.modes.forEach((m, i) => {
      expect(relClose(result.bounds!.lower.frequenciesHz[i]!, m.frequencyHz * Math.sqrt(0.5), 1e-9)).toBe(true);
      expect(relClose(result.bounds!.upper.frequenciesHz[i]!, m.frequencyHz * Math.SQRT2, 1e-9)).toBe(true);
    });
    expect(result.bounds!.upper.governing.displacementPeak).toBeGreaterThan(0);
  });
});

describe("frequency separation", () => {
  it("smallest |r - 1| over the range, 0 when the range crosses the mode", () => {
    expect(separationOverRange([10, 20], 15)).toBe(0);
    expect(separationOverRange([20, 25], 10)).toBeCloseTo(1, 12);
    expect(separationOverRange([5, 8], 10)).toBeCloseTo(0.2, 12);
  });

  it("one check per mode and rotor; a mode inside the range fails and warns of resonance", () => {
    const probe = run(symmetricBlock());
    const fz = probe.modes.find((m) => m.dominant === "z")!.frequencyHz;
    const result = run(symmetricBlock({ rotor: { speedRpm: fz * 60 * 1.1, speedRangeRpm: [fz * 60 * 0.9, fz * 60 * 1.1] } }));
    const sep = result.checks.filter((c) => c.id === "frequency-separation");
    expect(sep).toHaveLength(6);
    const zMode = result.modes.findIndex((m) => m.dominant === "z") + 1;
    const zCheck = sep.find((c) => c.mode === zMode)!;
    expect(zCheck.value).toBe(0);
    expect(zCheck.pass).toBe(false);
    expect(result.warnings.some((w) => w.startsWith(`Resonance: mode ${zMode}`))).toBe(true);
    // the envelope over the range is at least the rated-speed response and is reached inside it
    for (const c of result.rotors[0]!.cases) {
      const rated = Math.max(...c.points.flatMap((p) => p.displacementPeak));
      expect(c.maxOverSpeedRange.displacementPeak).toBeGreaterThanOrEqual(rated * (1 - 1e-12));
      expect(c.maxOverSpeedRange.atRpm).toBeGreaterThanOrEqual(fz * 60 * 0.9 - 1e-9);
      expect(c.maxOverSpeedRange.atRpm).toBeLessThanOrEqual(fz * 60 * 1.1 + 1e-9);
    }
  });

  it("mass ratio, eccentricity and bearing pressure checks use the block rules of thumb (ACI 351.3R)", () => {
    const result = run(symmetricBlock({ machineMass: 30000 }));
    const ratio = result.checks.find((c) => c.id === "mass-ratio")!;
    expect(ratio.value).toBeCloseTo((2400 * 36) / 30000, 12);
    expect(ratio.limit).toBe(3);
    expect(ratio.pass).toBe(false);
    const bearing = result.checks.find((c) => c.id === "bearing-pressure")!;
    expect(bearing.value).toBeCloseTo(((2400 * 36 + 30000) * 9.80665) / 24 / 150000, 12);
    expect(result.checks.filter((c) => c.id === "eccentricity").every((c) => c.pass && c.value < 1e-12)).toBe(true);
  });
});

describe("criteria defaults", () => {
  it("are reported with their sources: ISO 10816-3 zone A/B converted to peak (recalled from memory), common practice", () => {
    const result = run(symmetricBlock());
    const c = result.criteria!;
    // group 2, rigid support: 1.4 mm/s and 22 um r.m.s.; peak = r.m.s. x sqrt(2) for a sinusoid
    expect(c.maxVelocityPeak!.value).toBeCloseTo(1.4e-3 * Math.SQRT2, 15);
    expect(c.maxDisplacementPeak!.value).toBeCloseTo(22e-6 * Math.SQRT2, 15);
    expect(c.maxVelocityPeak!.source).toMatch(/ISO 10816-3.*recalled from memory/);
    expect(c.frequencySeparation!.value).toBe(0.2);
    expect(c.frequencySeparation!.source).toMatch(/common practice.*ACI 351\.3R/);
    expect(c.minMassRatio!.source).toMatch(/common practice/);
    const given = run({ ...symmetricBlock(), criteria: { maxVelocityPeak: 5e-3 } });
    expect(given.criteria!.maxVelocityPeak!.value).toBe(5e-3);
    expect(given.checks.filter((k) => k.id === "velocity").every((k) => k.limit === 5e-3)).toBe(true);
  });
});

describe("frame", () => {
  it("a base whose centroid is not at the input origin is analysed about its centroid, with a warning", () => {
    const doc = symmetricBlock();
    const moved: AnalysisInputDocument = {
      ...doc,
      block: { ...doc.block, solids: [{ name: "block", x: [0, 6], y: [0, 4], z: [0, 1.5] }] },
      machines: doc.machines.map((m) => ({ ...m, cg: [3, 2, 2.2], rotors: m.rotors!.map((r) => ({ ...r, bearings: [[3, 2, 2.2]] })) })),
    };
    const a = run(doc);
    const b = run(moved);
    expect(b.warnings.some((w) => w.includes("centroid of the base contact area"))).toBe(true);
    expect(b.massProperties.origin).toEqual([3, 2, 0]);
    a.modes.forEach((m, i) => expect(relClose(b.modes[i]!.frequencyHz, m.frequencyHz, 1e-12)).toBe(true));
    expect(b.rotors[0]!.cases[0]!.points[0]!.position).toEqual([3, 2, 2.2]);
  });

  it("thin blocks are warned about (thickness at least 0.6 m, common practice)", () => {
    const result = run(symmetricBlock({ h: 0.5, machineHeight: 1 }));
    expect(result.warnings.some((w) => w.includes("thinner than 0.6 m"))).toBe(true);
    expect(result.warnings.some((w) => w.includes("slender"))).toBe(true);
  });
});
