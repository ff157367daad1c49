// Block on steel springs (impedance method "springs", issue 16): the SDOF isolation identities
// (Chopra, Dynamics of Structures, §3.6), the assembled stiffness of a symmetric layout against
// hand formulas (rigid-body kinematics u_p = U + Theta x p), the static deflection W / sum kz by
// hand, the force per spring against the SDOF transmitted force, the refusals by field, and the
// start-up through the isolator resonance by the existing speed-ramp computation.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { springCouplingIssues, springMatrix, transmissibility, type SpringInput } from "@/modules/calc/impedance-springs";
import { relClose } from "./helpers";

const G = 9.80665;

function springsDoc(springs: SpringInput[], extra: { dampingRatio?: number } = {}, speedRpm = 1480): AnalysisInputDocument {
  return {
    schemaVersion: 1,
    block: { concreteDensity: 2400, solids: [{ name: "inertia block", x: [-1.5, 1.5], y: [-1, 1], z: [0, 0.6] }] },
    soil: { shearModulus: 6e7, poissonRatio: 0.33, density: 1900, allowableBearingPressure: 150000 },
    impedance: { method: "springs", springs, ...extra },
    machines: [
      {
        name: "Fan",
        mass: 1500,
        cg: [0, 0, 1.0],
        rotors: [{ name: "Impeller", mass: 300, speedRpm, speedRangeRpm: [Math.min(1200, speedRpm), speedRpm], balanceGrade: 6.3, axis: "x", bearings: [[-0.5, 0, 1.0], [0.5, 0, 1.0]] }],
      },
    ],
  };
}

const corners = (a: number, b: number, kz: number, kh: number): SpringInput[] => [
  { x: -a, y: -b, kz, kh },
  { x: a, y: -b, kz, kh },
  { x: -a, y: b, kz, kh },
  { x: a, y: b, kz, kh },
];

function parsed(doc: AnalysisInputDocument) {
  const p = parseAnalysisInput(doc);
  if (!p.ok) throw new Error(JSON.stringify(p.issues));
  return p.input;
}

describe("SDOF transmissibility (Chopra, Dynamics of Structures, §3.6)", () => {
  it("is 1 at r = sqrt 2 for every damping ratio, above 1 below it and below 1 above it", () => {
    for (const zeta of [0, 0.005, 0.05, 0.2, 0.5]) {
      expect(transmissibility(Math.SQRT2, zeta)).toBeCloseTo(1, 12);
      expect(transmissibility(1.2, zeta)).toBeGreaterThan(1);
      expect(transmissibility(2, zeta)).toBeLessThan(1);
      expect(transmissibility(0, zeta)).toBeCloseTo(1, 12);
    }
  });
  it("is 1 / |1 - r^2| without damping and grows with damping above sqrt 2", () => {
    expect(transmissibility(3, 0)).toBeCloseTo(1 / 8, 12);
    expect(transmissibility(0.5, 0)).toBeCloseTo(1 / 0.75, 12);
    // damping raises TR above r = sqrt 2 (Chopra §3.6, Fig. 3.6.2)
    expect(transmissibility(3, 0.2)).toBeGreaterThan(transmissibility(3, 0.05));
    // hand value: r = 3, zeta = 0.1: sqrt(1 + 0.36) / sqrt(64 + 0.36)
    expect(transmissibility(3, 0.1)).toBeCloseTo(Math.sqrt(1.36) / Math.sqrt(64.36), 12);
  });
});

describe("assembled stiffness of the springs at O (hand formulas of rigid-body kinematics)", () => {
  it("four equal springs at (+-a, +-b): diagonal terms by hand, every coupling term 0", () => {
    const a = 1.3;
    const b = 0.8;
    const kz = 4e5;
    const kh = 3e5;
    const m = springMatrix(corners(a, b, kz, kh), "k");
    const hand = [4 * kh, 4 * kh, 4 * kz, 4 * kz * b * b, 4 * kz * a * a, 4 * kh * (a * a + b * b)];
    for (let i = 0; i < 6; i++) {
      for (let j = 0; j < 6; j++) {
        const v = m[i * 6 + j] as number;
        if (i === j) expect(relClose(v, hand[i] as number, 1e-12)).toBe(true);
        else expect(Math.abs(v)).toBeLessThan(1e-6);
      }
    }
    expect(springCouplingIssues(corners(a, b, kz, kh))).toEqual([]);
  });
  it("one spring off the axes gives the coupling terms of u_p = U + Theta x p, symmetric", () => {
    const m = springMatrix([{ x: 2, y: 1, kz: 10, kh: 3 }], "k");
    expect(m[2 * 6 + 3]).toBeCloseTo(10 * 1, 12); // K_z,rx = kz y
    expect(m[2 * 6 + 4]).toBeCloseTo(-10 * 2, 12); // K_z,ry = -kz x
    expect(m[3 * 6 + 4]).toBeCloseTo(-10 * 2 * 1, 12); // K_rx,ry = -kz x y
    expect(m[0 * 6 + 5]).toBeCloseTo(-3 * 1, 12); // K_x,rz = -kh y
    expect(m[1 * 6 + 5]).toBeCloseTo(3 * 2, 12); // K_y,rz = kh x
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) expect(m[i * 6 + j]).toBe(m[j * 6 + i]);
    expect(springCouplingIssues([{ x: 2, y: 1, kz: 10, kh: 3 }, { x: -1, y: -1, kz: 10, kh: 3 }, { x: 0, y: 1, kz: 10, kh: 3 }]).length).toBeGreaterThan(0);
  });
});

describe("analysis of a block on four springs", () => {
  const springs = corners(1.3, 0.8, 4e5, 3e5);
  const zeta = 0.02;
  const result = analyse(parsed(springsDoc(springs, { dampingRatio: zeta })));
  // hand: block 3 x 2 x 0.6 m x 2400 kg/m^3 = 8640 kg, plus the 1500 kg machine
  const mass = 3 * 2 * 0.6 * 2400 + 1500;

  it("static deflection is W / sum kz by hand", () => {
    expect(result.springs).toBeDefined();
    expect(result.massProperties.totalMass).toBeCloseTo(mass, 6);
    expect(relClose(result.springs!.staticDeflection, (mass * G) / 1.6e6, 1e-12)).toBe(true);
  });

  it("the vertical mode is sqrt(sum kz / m) / 2 pi and the six springs' stiffness reaches the model", () => {
    const fz = Math.sqrt(1.6e6 / mass) / (2 * Math.PI);
    expect(relClose(result.springs!.verticalFrequencyHz, fz, 1e-12)).toBe(true);
    const z = result.modes.find((m) => m.dominant === "z");
    expect(relClose(z!.frequencyHz, fz, 1e-9)).toBe(true);
    expect(result.impedance.method).toBe("springs");
    expect(result.impedance.stiffness.ry).toBeCloseTo(4 * 4e5 * 1.3 * 1.3, 3);
  });

  it("isolation efficiency is 1 - TR of the vertical SDOF at each operating speed (Chopra §3.6)", () => {
    const fz = result.springs!.verticalFrequencyHz;
    const rows = result.springs!.rotors[0]!.isolation;
    expect(rows.map((r) => r.speedRpm)).toEqual([1200, 1480]);
    for (const row of rows) {
      const r = row.speedRpm / 60 / fz;
      expect(row.frequencyRatio).toBeCloseTo(r, 12);
      expect(row.isolationEfficiency).toBeCloseTo(1 - transmissibility(r, zeta), 12);
    }
  });

  it("vertical case: each spring carries a quarter of the SDOF transmitted force TR F0", () => {
    const rotor = result.rotors[0]!;
    const vertical = result.springs!.rotors[0]!.springForces.find((c) => c.case === "vertical")!;
    const r = rotor.speedRpm / 60 / result.springs!.verticalFrequencyHz;
    // force on the vertical axis through the cg: pure heave, an SDOF with c = 2 zeta sqrt(k m)
    const total = transmissibility(r, zeta) * rotor.forceAmplitude;
    for (const f of vertical.forces) {
      expect(relClose(f[2], total / 4, 1e-6)).toBe(true);
      expect(Math.abs(f[0]) + Math.abs(f[1])).toBeLessThan(1e-9 * total);
    }
    const caseResult = rotor.cases.find((c) => c.case === "vertical")!;
    expect(relClose(caseResult.transmittedForce[2], total, 1e-6)).toBe(true);
  });

  it("checks the operating speed against 3 x the highest isolator frequency (common practice)", () => {
    const check = result.checks.find((c) => c.id === "isolator-frequency-ratio")!;
    const highest = Math.max(...result.modes.map((m) => m.frequencyHz));
    expect(check.value).toBeCloseTo(1200 / 60 / highest, 12);
    expect(check.limit).toBe(3);
    expect(check.pass).toBe(check.value >= 3);
    expect(check.source).toMatch(/common practice/);
    // a slow machine fails it
    const slow = analyse(parsed(springsDoc(springs, { dampingRatio: zeta }, 300)));
    const slowCheck = slow.checks.find((c) => c.id === "isolator-frequency-ratio");
    // 300 rpm = 5 Hz against an isolator mode above 3 Hz: a ratio below 2
    expect(slowCheck!.value).toBeCloseTo(5 / Math.max(...slow.modes.map((m) => m.frequencyHz)), 12);
    expect(slowCheck!.pass).toBe(false);
  });

  it("a run-up passes through the isolator resonance with the existing speed-ramp computation", () => {
    const doc = springsDoc(springs, { dampingRatio: zeta });
    doc.transient = [{ machine: "Fan", rotor: "Impeller", kind: "run-up", durationS: 10 }];
    const run = analyse(parsed(doc)).transient![0]!;
    const modesHz = result.modes.map((m) => m.frequencyHz);
    // the steady-state envelope of the run peaks at one of the isolator's natural frequencies
    const atHz = run.steadyStateMax.atRpm / 60;
    expect(modesHz.some((f) => Math.abs(atHz - f) / f < 0.03)).toBe(true);
    expect(run.peakDisplacement.value).toBeGreaterThan(0);
    expect(Number.isFinite(run.peakDisplacement.value)).toBe(true);
  });
});

describe("refused spring inputs name their field", () => {
  const pathsOf = (doc: AnalysisInputDocument) => {
    const p = parseAnalysisInput(doc);
    return p.ok ? [] : p.issues.map((i) => i.path);
  };
  it("an asymmetric layout (stiffness centre off O)", () => {
    const s = corners(1.3, 0.8, 4e5, 3e5);
    s[0] = { ...s[0]!, x: -1.0 };
    expect(pathsOf(springsDoc(s))).toContain("impedance.springs");
  });
  it("dampers and a damping ratio together, fewer than 3 springs, a negative stiffness", () => {
    const s = corners(1.3, 0.8, 4e5, 3e5).map((x) => ({ ...x, cz: 1000, ch: 500 }));
    expect(pathsOf(springsDoc(s, { dampingRatio: 0.02 }))).toContain("impedance.dampingRatio");
    expect(pathsOf(springsDoc(corners(1.3, 0.8, 4e5, 3e5).slice(0, 2)))).toContain("impedance.springs");
    const neg = corners(1.3, 0.8, 4e5, 3e5);
    neg[1] = { ...neg[1]!, kz: -1 };
    expect(pathsOf(springsDoc(neg))).toContain("impedance.springs[1].kz");
  });
});
