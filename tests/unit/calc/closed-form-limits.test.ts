// Limit cases of the six-DOF model against closed forms computed here from their published
// sources (not from the engine's output).
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisResult } from "@/modules/calc";
import type { AnalysisInputDocument } from "@/modules/calc/schema";
import { G_SAND, NU, RHO_CONCRETE, relClose, symmetricBlock } from "./helpers";

function run(doc: AnalysisInputDocument): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}

function nearestMode(result: AnalysisResult, hz: number): number {
  return result.modes.reduce((best, m) => (Math.abs(m.frequencyHz - hz) < Math.abs(best - hz) ? m.frequencyHz : best), Infinity);
}

const lx = 6;
const ly = 4;
const h = 1.5;
const machineMass = 5000;
const zm = h + 0.7;
const blockMass = RHO_CONCRETE * lx * ly * h;
const m = blockMass + machineMass;

describe("vertical mode of a symmetric block (Richart, Hall & Woods 1970: k_z = 4 G r0 / (1 - nu))", () => {
  it("equals sqrt(k_z / m) / (2 pi) with r0 = sqrt(A / pi)", () => {
    const result = run(symmetricBlock());
    const r0 = Math.sqrt((lx * ly) / Math.PI);
    const kz = (4 * G_SAND * r0) / (1 - NU);
    const expected = Math.sqrt(kz / m) / (2 * Math.PI);
    const vertical = result.modes.find((mode) => mode.dominant === "z");
    expect(vertical).toBeDefined();
    expect(relClose(vertical!.frequencyHz, expected, 1e-9)).toBe(true);
    expect(vertical!.participation.z).toBeGreaterThan(1 - 1e-9);
  });

  it("torsion equals sqrt(k_rz / I_zz) / (2 pi), k_rz = 16 G r0^3 / 3 with the polar-moment radius", () => {
    const result = run(symmetricBlock());
    const r0 = ((lx * ly * (lx * lx + ly * ly)) / (6 * Math.PI)) ** 0.25;
    const kt = (16 * G_SAND * r0 ** 3) / 3;
    const Izz = (blockMass * (lx * lx + ly * ly)) / 12; // the machine is a point on the z axis
    expect(relClose(nearestMode(result, Math.sqrt(kt / Izz) / (2 * Math.PI)), Math.sqrt(kt / Izz) / (2 * Math.PI), 1e-9)).toBe(true);
  });
});

describe("coupled rocking and sliding (Richart, Hall & Woods 1970 frequency equation)", () => {
  it("both planes: the six-DOF frequencies are the roots of w^4 - w^2 (wx^2 + wpsi^2) / gamma + wx^2 wpsi^2 / gamma = 0", () => {
    const result = run(symmetricBlock());
    // combined cg height and inertias computed here from the box formulas
    const zc = (blockMass * (h / 2) + machineMass * zm) / m;
    const kx = (32 * (1 - NU) * G_SAND * Math.sqrt((lx * ly) / Math.PI)) / (7 - 8 * NU);
    const planes = [
      // sliding x, rocking about y: moment of area about y = ly lx^3 / 12
      { I0: (blockMass * (lx * lx + h * h)) / 12 + blockMass * (h / 2 - zc) ** 2 + machineMass * (zm - zc) ** 2, r0: ((ly * lx ** 3) / (3 * Math.PI)) ** 0.25 },
      // sliding y, rocking about x
      { I0: (blockMass * (ly * ly + h * h)) / 12 + blockMass * (h / 2 - zc) ** 2 + machineMass * (zm - zc) ** 2, r0: ((lx * ly ** 3) / (3 * Math.PI)) ** 0.25 },
    ];
    for (const p of planes) {
      const kpsi = (8 * G_SAND * p.r0 ** 3) / (3 * (1 - NU));
      const Ib = p.I0 + m * zc * zc;
      const wx2 = kx / m;
      const wp2 = kpsi / Ib;
      const gamma = p.I0 / Ib;
      const s = wx2 + wp2;
      const d = Math.sqrt(s * s - 4 * gamma * wx2 * wp2);
      for (const w2 of [(s - d) / (2 * gamma), (s + d) / (2 * gamma)]) {
        const hz = Math.sqrt(w2) / (2 * Math.PI);
        expect(relClose(nearestMode(result, hz), hz, 1e-9)).toBe(true);
      }
    }
    // the engine's own cross-check reports the same pairing
    const cc = result.crossCheck!;
    for (const pair of [cc.rockingSlidingXZ, cc.rockingSlidingYZ]) {
      expect(relClose(pair.low.closedFormHz, pair.low.nearestModeHz, 1e-9)).toBe(true);
      expect(relClose(pair.high.closedFormHz, pair.high.nearestModeHz, 1e-9)).toBe(true);
    }
  });
});

describe("uncoupled vertical response against the single-DOF closed forms (Chopra, Dynamics of Structures)", () => {
  const kz = 2.0e9;
  const zeta = 0.1;
  const userSprings = (dz: number): AnalysisInputDocument["impedance"] => ({
    method: "user",
    stiffness: { x: 1e9, y: 1e9, z: kz, rx: 5e9, ry: 5e9, rz: 5e9 },
    dampingRatio: { x: 0.1, y: 0.1, z: dz, rx: 0.1, ry: 0.1, rz: 0.1 },
  });
  const fn = Math.sqrt(kz / m) / (2 * Math.PI);
  const verticalCase = (result: AnalysisResult) => result.rotors[0]!.cases.find((c) => c.case === "vertical" && c.unbalanceMode === "static")!;

  it.each([0.3, 0.8, 1.0, 1.5, 2.5])("rotating-mass amplitude (m_e e / m) r^2 / sqrt((1 - r^2)^2 + (2 zeta r)^2) at r = %s", (r) => {
    const speedRpm = r * fn * 60;
    const grade = 6.3;
    const rotorMass = 1000;
    const result = run(symmetricBlock({ impedance: userSprings(zeta), rotor: { mass: rotorMass, speedRpm, balanceGrade: grade } }));
    const e = grade / 1000 / ((speedRpm * 2 * Math.PI) / 60); // ISO 1940-1: e = G / w
    const expected = ((rotorMass * e) / m) * r * r / Math.sqrt((1 - r * r) ** 2 + (2 * zeta * r) ** 2);
    const point = verticalCase(result).points[0]!;
    expect(relClose(point.displacementPeak[2], expected, 1e-9)).toBe(true);
    expect(point.displacementPeak[0]).toBeLessThan(1e-12 * expected);
  });

  it("peak of the rotating-mass response: A_max = (m_e e / m) / (2 zeta sqrt(1 - zeta^2)) at r = 1 / sqrt(1 - 2 zeta^2)", () => {
    const r = 1 / Math.sqrt(1 - 2 * zeta * zeta);
    const speedRpm = r * fn * 60;
    const result = run(symmetricBlock({ impedance: userSprings(zeta), rotor: { mass: 1000, speedRpm, balanceGrade: 2.5 } }));
    const e = 2.5 / 1000 / ((speedRpm * 2 * Math.PI) / 60);
    const expected = (1000 * e) / m / (2 * zeta * Math.sqrt(1 - zeta * zeta));
    expect(relClose(verticalCase(result).points[0]!.displacementPeak[2], expected, 1e-9)).toBe(true);
  });

  it.each([0.5, 1.2, 3])("constant-force amplitude (F0 / k) / sqrt((1 - r^2)^2 + (2 zeta r)^2) and TR at r = %s", (r) => {
    const speedRpm = r * fn * 60;
    const F0 = 1500;
    const result = run(symmetricBlock({ impedance: userSprings(zeta), rotor: { speedRpm, balanceGrade: undefined, unbalanceForce: F0 } }));
    const c = verticalCase(result);
    const denom = Math.sqrt((1 - r * r) ** 2 + (2 * zeta * r) ** 2);
    expect(relClose(c.points[0]!.displacementPeak[2], F0 / kz / denom, 1e-9)).toBe(true);
    expect(relClose(c.transmissibility, Math.sqrt(1 + (2 * zeta * r) ** 2) / denom, 1e-9)).toBe(true);
  });

  it.each([0.05, 0.2, 0.5])("transmissibility is 1 at r = sqrt(2) for zeta = %s (Chopra)", (dz) => {
    const speedRpm = Math.SQRT2 * fn * 60;
    const result = run(symmetricBlock({ impedance: userSprings(dz), rotor: { speedRpm } }));
    expect(verticalCase(result).transmissibility).toBeCloseTo(1, 9);
  });

  it("the engine's cross-check SDOF values agree with the six-DOF vertical case when uncoupled", () => {
    const result = run(symmetricBlock({ impedance: userSprings(zeta), rotor: { speedRpm: 1.7 * fn * 60 } }));
    const v = result.crossCheck!.vertical;
    expect(relClose(v.amplitude!, v.sixDofAmplitudeAtO!, 1e-9)).toBe(true);
    expect(relClose(v.transmissibility!, v.sixDofTransmissibility!, 1e-9)).toBe(true);
    expect(relClose(v.closedFormHz, fn, 1e-9)).toBe(true);
  });
});
