// Springs on a base block on the soil (two-stage isolation, engine 1.8.0, two-stage.ts): the
// vertical modes against the undamped two-mass frequency equation, the steady-state force into
// the ground against the closed-form two-DOF solution, the limit of a very heavy and very stiff
// base against the rigid-floor springs, the condensed six-DOF solve against a direct 12 x 12
// complex solve, and the input rules, the bearing check and the speed-ramp refusal.
import { describe, expect, it } from "vitest";
import { analyse, analyseTransient, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { integrateRun } from "@/modules/calc/transient";
import { relClose } from "./helpers";
import { baseAndRelativeMotion, responseSet } from "@/modules/calc/harmonic";
import { buildModel } from "@/modules/calc/model";
import { runSoilCase } from "@/modules/calc/soil-case";
import type { SpringInput } from "@/modules/calc/impedance-springs";
import { twoStageModes, twoStageTimeDomain } from "@/modules/calc/two-stage";

const G = 9.80665;
const RHO = 2400;

const corners = (a: number, b: number, kz: number, kh: number, extra: Partial<SpringInput> = {}): SpringInput[] => [
  { x: -a, y: -b, kz, kh, ...extra },
  { x: a, y: -b, kz, kh, ...extra },
  { x: -a, y: b, kz, kh, ...extra },
  { x: a, y: b, kz, kh, ...extra },
];

type Base = NonNullable<Extract<AnalysisInputDocument["impedance"], { method: "springs" }>["base"]>;
type Springs = Extract<AnalysisInputDocument["impedance"], { method: "springs" }>;

const userSoil = (k: number, ratio = 0) => ({
  method: "user" as const,
  stiffness: { x: k, y: k, z: k, rx: k, ry: k, rz: k },
  dampingRatio: { x: ratio, y: ratio, z: ratio, rx: ratio, ry: ratio, rz: ratio },
});

/** The fan of the springs tests: 3 m x 2 m x 0.6 m block, 1500 kg fan with its cg above O. */
function doc(base: Base | undefined, o: { springs?: SpringInput[]; dampingRatio?: number; materialDamping?: number; unbalanceForce?: number } = {}): AnalysisInputDocument {
  const imp: Springs = { method: "springs", springs: o.springs ?? corners(1.3, 0.8, 4e5, 3e5) };
  if (o.dampingRatio !== undefined) imp.dampingRatio = o.dampingRatio;
  if (base) imp.base = base;
  return {
    schemaVersion: 1,
    block: { concreteDensity: RHO, solids: [{ name: "inertia block", x: [-1.5, 1.5], y: [-1, 1], z: [0, 0.6] }] },
    soil: { shearWaveVelocity: 140, poissonRatio: 0.3, density: 1900, materialDamping: o.materialDamping ?? 0, allowableBearingPressure: 200000 },
    impedance: imp,
    machines: [
      {
        name: "Fan",
        mass: 1500,
        cg: [0, 0, 1.0],
        rotors: [
          {
            name: "Impeller",
            mass: 300,
            speedRpm: 1480,
            speedRangeRpm: [1200, 1480],
            ...(o.unbalanceForce ? { unbalanceForce: o.unbalanceForce } : { balanceGrade: 6.3 }),
            axis: "x",
            bearings: [
              [-0.5, 0, 1.0],
              [0.5, 0, 1.0],
            ],
          },
        ],
      },
    ],
  };
}

function parsed(d: AnalysisInputDocument) {
  const p = parseAnalysisInput(d);
  if (!p.ok) throw new Error(JSON.stringify(p.issues));
  return p.input;
}

function issuesOf(d: AnalysisInputDocument): { path: string; message: string }[] {
  const p = parseAnalysisInput(d);
  return p.ok ? [] : p.issues;
}

// block 3 x 2 x 0.6 m of concrete and the 1500 kg fan; base 4 x 3 x 0.9 m
const M1 = 3 * 2 * 0.6 * RHO + 1500;
const BASE: Base = { x: [-2, 2], y: [-1.5, 1.5], z: [-1.2, -0.3] };
const M2 = 4 * 3 * 0.9 * RHO;
const K1 = 4 * 4e5;

/** Roots of det [[k1 - w^2 m1, -k1], [-k1, k1 + k2 - w^2 m2]] = 0 in Hz (Den Hartog, Mechanical Vibrations; Chopra, Dynamics of Structures, two-DOF systems). */
function twoMassHz(m1: number, k1: number, m2: number, k2: number): [number, number] {
  const a = m1 * m2;
  const b = k1 * m2 + (k1 + k2) * m1;
  const c = k1 * k2;
  const d = Math.sqrt(b * b - 4 * a * c);
  return [Math.sqrt((b - d) / (2 * a)) / (2 * Math.PI), Math.sqrt((b + d) / (2 * a)) / (2 * Math.PI)];
}

describe("springs on a base block: vertical modes against the two-mass frequency equation", () => {
  it("gives the two vertical frequencies of m1 on k1 on m2 on k2 (constant soil springs, symmetric case)", () => {
    const k2 = 5e7;
    const r = analyse(parsed(doc({ ...BASE, support: userSoil(k2) })));
    expect(r.modes).toHaveLength(12);
    const vertical = r.modes.filter((m) => m.participation.z > 0.999).map((m) => m.frequencyHz);
    expect(vertical).toHaveLength(2);
    const [lo, hi] = twoMassHz(M1, K1, M2, k2);
    expect(vertical[0]).toBeCloseTo(lo, 9);
    expect(vertical[1]).toBeCloseTo(hi, 9);
    // hand check of the magnitudes: lo just under sqrt(k1 / m1) (springs in series with a stiff soil)
    expect(lo).toBeLessThan(Math.sqrt(K1 / M1) / (2 * Math.PI));
    expect(r.springs?.base?.twoMassVerticalHz[0]).toBeCloseTo(lo, 9);
    expect(r.springs?.verticalFrequencyHz).toBeCloseTo(lo, 9);
    // the lower mode is the isolator's (upper block), the upper one the base's
    const lower = r.modes.find((m) => m.frequencyHz === vertical[0]);
    const upper = r.modes.find((m) => m.frequencyHz === vertical[1]);
    expect(lower?.block).toBe("upper");
    expect(upper?.block).toBe("base");
    expect(upper?.baseShape).toHaveLength(6);
  });

  it("uses Gazetas' K_z of the base's footprint at the stated frequency (the first rotor's rated speed) for the same equation", () => {
    const r = analyse(parsed(doc(BASE)));
    const b = r.springs?.base;
    expect(b?.supportMethod).toBe("gazetas");
    expect(b?.evaluatedAtHz).toBeCloseTo(1480 / 60, 12);
    const vertical = r.modes.filter((m) => m.participation.z > 0.999).map((m) => m.frequencyHz);
    const [lo, hi] = twoMassHz(M1, K1, M2, b?.soilStiffness.z ?? 0);
    expect(vertical[0]).toBeCloseTo(lo, 8);
    expect(vertical[1]).toBeCloseTo(hi, 8);
  });
});

describe("springs on a base block: steady-state force into the ground against the closed-form two-DOF solution", () => {
  it("matches |k2 (1 + 2 i beta) u2| of [[k1 + i w c1 - w^2 m1, -(k1 + i w c1)], [-(k1 + i w c1), k1 + i w c1 + k2 (1 + 2 i beta) - w^2 m2]] u = [F, 0]", () => {
    const k2 = 2e8;
    const beta = 0.05;
    const cz = 3000;
    const F = 1000;
    const r = analyse(parsed(doc({ ...BASE, support: userSoil(k2, 0) }, { springs: corners(1.3, 0.8, 4e5, 3e5, { cz, ch: 2000 }), materialDamping: beta, unbalanceForce: F })));
    const w = (1480 / 60) * 2 * Math.PI;
    // complex arithmetic by hand: a = k1 + i w c1
    const c1 = 4 * cz;
    const ar = K1;
    const ai = w * c1;
    const d11r = ar - w * w * M1;
    const d22r = ar + k2 - w * w * M2;
    const d22i = ai + 2 * beta * k2;
    // det = d11 d22 - a^2
    const detR = d11r * d22r - ai * d22i - (ar * ar - ai * ai);
    const detI = d11r * d22i + ai * d22r - 2 * ar * ai;
    // u2 = a F / det
    const numR = ar * F;
    const numI = ai * F;
    const den = detR * detR + detI * detI;
    const u2r = (numR * detR + numI * detI) / den;
    const u2i = (numI * detR - numR * detI) / den;
    const ground = Math.hypot(k2 * u2r - 2 * beta * k2 * u2i, k2 * u2i + 2 * beta * k2 * u2r);
    const vertical = r.springs?.base?.rotors[0]?.cases.find((c) => c.case === "vertical" && c.unbalanceMode === "static");
    expect(vertical?.groundForce[2]).toBeCloseTo(ground, 9);
    expect(Math.abs(vertical?.groundForce[0] ?? 1)).toBeLessThan(1e-9 * ground);
    // the rotor case's transmitted force is the force into the soil on a base block
    const rotorCase = r.rotors[0]?.cases.find((c) => c.case === "vertical");
    expect(rotorCase?.transmittedForce[2]).toBeCloseTo(ground, 9);
    // the isolation at the rated speed is 1 - TR of the force into the ground (single-direction loads, the largest)
    const rated = r.springs?.rotors[0]?.isolation.find((i) => i.speedRpm === 1480);
    const horizontal = r.springs?.base?.rotors[0]?.cases.find((c) => c.case === "horizontal");
    const trH = Math.hypot(...(horizontal?.groundForce ?? [0, 0, 0])) / F;
    expect(rated?.transmissibility).toBeCloseTo(Math.max(ground / F, trH), 12);
    expect(rated?.isolationEfficiency).toBeCloseTo(1 - Math.max(ground / F, trH), 12);
    expect(r.springs?.transmissibilitySource).toMatch(/force into the soil/);
  });
});

describe("springs on a base block: a very heavy, very stiff base is the rigid floor", () => {
  it("reproduces the rigid-floor frequencies, spring forces and transmitted force", () => {
    const rigid = analyse(parsed(doc(undefined, { dampingRatio: 0.02 })));
    const heavy = analyse(parsed(doc({ ...BASE, concreteDensity: RHO * 1e4, support: userSoil(1e16) }, { dampingRatio: 0.02 })));
    const six = heavy.modes.slice(0, 6);
    six.forEach((m, i) => {
      expect(m.block).toBe("upper");
      expect(Math.abs(m.frequencyHz / (rigid.modes[i]?.frequencyHz ?? 0) - 1)).toBeLessThan(1e-5);
    });
    const fr = rigid.springs?.rotors[0]?.springForces ?? [];
    const fh = heavy.springs?.rotors[0]?.springForces ?? [];
    expect(fh).toHaveLength(fr.length);
    fr.forEach((c, l) =>
      c.forces.forEach((f, i) =>
        f.forEach((v, a) => {
          const h = (fh[l]?.forces[i] as number[])[a] as number;
          expect(Math.abs(h - v)).toBeLessThanOrEqual(1e-4 * Math.max(Math.abs(v), 1e-3));
        }),
      ),
    );
    // the force into the soil carries the base's inertia: vertically K_b q / (S_s u) = 1 / (1 - w^2 m_b / K_b) to first
    // order in 1 / K_b (hand derivation from the base's equation of motion), 6.2e-4 here
    const w = (1480 / 60) * 2 * Math.PI;
    const inertia = (w * w * M2 * 1e4) / 1e16;
    const rv = rigid.rotors[0]?.cases.find((c) => c.case === "vertical")?.transmittedForce[2] ?? 0;
    const hv = heavy.rotors[0]?.cases.find((c) => c.case === "vertical")?.transmittedForce[2] ?? 0;
    expect(Math.abs(hv / rv - 1 - inertia)).toBeLessThan(0.02 * inertia);
    // a stiff base only ten times as dense: the inertia term is 6e-7, the forces agree within 1e-5
    const stiff = analyse(parsed(doc({ ...BASE, concreteDensity: RHO * 10, support: userSoil(1e16) }, { dampingRatio: 0.02 })));
    rigid.rotors[0]?.cases.forEach((c, l) => {
      const h = stiff.rotors[0]?.cases[l];
      c.transmittedForce.forEach((v, a) => expect(Math.abs((h?.transmittedForce[a] ?? 0) - v)).toBeLessThanOrEqual(1e-5 * Math.max(v, 1e-3)));
    });
    expect(heavy.springs?.staticDeflection).toBe(rigid.springs?.staticDeflection);
    expect(heavy.springs?.staticLoads).toEqual(rigid.springs?.staticLoads);
  });

  it("leaves a block on a rigid floor as before (no base result, bearing check not applicable)", () => {
    const rigid = analyse(parsed(doc(undefined)));
    expect(rigid.springs?.base).toBeUndefined();
    expect(rigid.modes).toHaveLength(6);
    expect(rigid.modes[0]?.block).toBeUndefined();
    expect(rigid.checks.find((c) => c.id === "bearing-pressure")?.notApplicable).toBeDefined();
  });
});

/** Gaussian elimination with partial pivoting on a dense complex system (test-only reference). */
function solveComplex(Ar: number[][], Ai: number[][], br: number[], bi: number[]): { re: number[]; im: number[] } {
  const n = br.length;
  const a = Ar.map((row, i) => row.map((v, j) => [v, (Ai[i] as number[])[j] as number] as [number, number]));
  const b = br.map((v, i) => [v, bi[i] as number] as [number, number]);
  const mul = (x: [number, number], y: [number, number]): [number, number] => [x[0] * y[0] - x[1] * y[1], x[0] * y[1] + x[1] * y[0]];
  const div = (x: [number, number], y: [number, number]): [number, number] => {
    const d = y[0] * y[0] + y[1] * y[1];
    return [(x[0] * y[0] + x[1] * y[1]) / d, (x[1] * y[0] - x[0] * y[1]) / d];
  };
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.hypot(...(a[r] as [number, number][])[c]!) > Math.hypot(...(a[p] as [number, number][])[c]!)) p = r;
    [a[c], a[p]] = [a[p] as [number, number][], a[c] as [number, number][]];
    [b[c], b[p]] = [b[p] as [number, number], b[c] as [number, number]];
    const rowC = a[c] as [number, number][];
    for (let r = c + 1; r < n; r++) {
      const rowR = a[r] as [number, number][];
      const f = div(rowR[c] as [number, number], rowC[c] as [number, number]);
      for (let j = c; j < n; j++) {
        const t = mul(f, rowC[j] as [number, number]);
        rowR[j] = [(rowR[j] as [number, number])[0] - t[0], (rowR[j] as [number, number])[1] - t[1]];
      }
      const t = mul(f, b[c] as [number, number]);
      b[r] = [(b[r] as [number, number])[0] - t[0], (b[r] as [number, number])[1] - t[1]];
    }
  }
  const x: [number, number][] = new Array(n);
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i] as [number, number];
    for (let j = i + 1; j < n; j++) {
      const t = mul((a[i] as [number, number][])[j] as [number, number], x[j] as [number, number]);
      s = [s[0] - t[0], s[1] - t[1]];
    }
    x[i] = div(s, (a[i] as [number, number][])[i] as [number, number]);
  }
  return { re: x.map((v) => v[0]), im: x.map((v) => v[1]) };
}

describe("springs on a base block: the condensed six-DOF solve equals the direct twelve-DOF solve", () => {
  it("gives the same upper and base motion and force into the soil for an off-centre base on Gazetas soil with hysteresis", () => {
    const input = parsed(doc({ x: [-1.8, 2.4], y: [-1.2, 1.6], z: [-1.3, -0.4], support: { method: "gazetas" } }, { springs: corners(1.3, 0.8, 4e5, 3e5, { cz: 2500, ch: 1500 }), materialDamping: 0.04 }));
    const model = buildModel(input);
    const sc = runSoilCase(model, 1);
    const parts = sc.impedance.twoStage;
    expect(parts).toBeDefined();
    if (!parts) return;
    // B = centre of the base's underside relative to O; T built here from rigid-body kinematics
    const b = [0.3, 0.2, -1.3];
    parts.base.offset.forEach((v, i) => expect(v).toBeCloseTo(b[i] as number, 12));
    expect(parts.base.mass).toBeCloseTo(RHO * 4.2 * 2.8 * 0.9, 6);
    expect(parts.base.springHeight).toBeCloseTo(0.4, 12);
    const T = Array.from({ length: 6 }, (_, i) => Array.from({ length: 6 }, (_, j) => (i === j ? 1 : 0)));
    // u_O = U_B + b x Theta
    (T[0] as number[])[4] = -(b[2] as number);
    (T[0] as number[])[5] = b[1] as number;
    (T[1] as number[])[3] = b[2] as number;
    (T[1] as number[])[5] = -(b[0] as number);
    (T[2] as number[])[3] = -(b[1] as number);
    (T[2] as number[])[4] = b[0] as number;
    const rotor = model.rotors[0];
    if (!rotor) throw new Error("no rotor");
    for (const hz of [0, 2.1, 15, 24.7]) {
      const w = 2 * Math.PI * hz;
      const ks = new Float64Array(6);
      const cs = new Float64Array(6);
      parts.soil.evaluate(w, ks, cs);
      const beta = 0.04;
      const Ar = Array.from({ length: 12 }, () => new Array<number>(12).fill(0));
      const Ai = Array.from({ length: 12 }, () => new Array<number>(12).fill(0));
      const Ks = (i: number, j: number) => parts.springK[i * 6 + j] as number;
      const Cs = (i: number, j: number) => parts.springC[i * 6 + j] as number;
      const t = (i: number, j: number) => (T[i] as number[])[j] as number;
      for (let i = 0; i < 6; i++) {
        for (let j = 0; j < 6; j++) {
          (Ar[i] as number[])[j] = Ks(i, j) - w * w * (model.massMatrix[i * 6 + j] as number);
          (Ai[i] as number[])[j] = w * Cs(i, j);
          let ktr = 0;
          let ctr = 0;
          for (let m = 0; m < 6; m++) {
            ktr += Ks(i, m) * t(m, j);
            ctr += Cs(i, m) * t(m, j);
          }
          (Ar[i] as number[])[6 + j] = -ktr;
          (Ai[i] as number[])[6 + j] = -w * ctr;
          (Ar[6 + j] as number[])[i] = -ktr;
          (Ai[6 + j] as number[])[i] = -w * ctr;
          let kttr = 0;
          let cttr = 0;
          for (let m = 0; m < 6; m++) for (let n = 0; n < 6; n++) {
            kttr += t(m, i) * Ks(m, n) * t(n, j);
            cttr += t(m, i) * Cs(m, n) * t(n, j);
          }
          const soilK = i === j ? (ks[i] as number) : 0;
          const soilC = i === j ? (cs[i] as number) : 0;
          (Ar[6 + i] as number[])[6 + j] = kttr + soilK - w * w * (parts.base.massMatrix[i * 6 + j] as number);
          (Ai[6 + i] as number[])[6 + j] = w * cttr + 2 * beta * soilK + w * soilC;
        }
      }
      const u = responseSet(rotor.loads.length);
      sc.solver.setFrequency(w);
      sc.solver.solveAll(rotor.loads, u);
      const base = { re: new Float64Array(6), im: new Float64Array(6) };
      const rel = { re: new Float64Array(6), im: new Float64Array(6) };
      rotor.loads.forEach((load, l) => {
        if (load.combine) return;
        const br = [...load.re, ...new Array<number>(6).fill(0)];
        const bi = [...(load.realOnly ? new Array<number>(6).fill(0) : load.im), ...new Array<number>(6).fill(0)];
        const x = solveComplex(Ar, Ai, br, bi);
        const scale = Math.max(...x.re.map(Math.abs), ...x.im.map(Math.abs));
        for (let j = 0; j < 6; j++) {
          expect(Math.abs((u.re[6 * l + j] as number) - (x.re[j] as number))).toBeLessThan(1e-9 * scale);
          expect(Math.abs((u.im[6 * l + j] as number) - (x.im[j] as number))).toBeLessThan(1e-9 * scale);
        }
        baseAndRelativeMotion(sc.solver, parts.base.transfer, u, l, base, rel);
        for (let j = 0; j < 6; j++) {
          expect(Math.abs((base.re[j] as number) - (x.re[6 + j] as number))).toBeLessThan(1e-9 * scale);
          expect(Math.abs((base.im[j] as number) - (x.im[6 + j] as number))).toBeLessThan(1e-9 * scale);
        }
        // force into the soil: (K_b (1 + 2 i beta) + i w C_b) q_B, translational rows
        const out = new Float64Array(3);
        sc.solver.transmittedForce(u, l, 1, out);
        for (let j = 0; j < 3; j++) {
          const kq = ks[j] as number;
          const dq = 2 * beta * kq + w * (cs[j] as number);
          const fr = kq * (x.re[6 + j] as number) - dq * (x.im[6 + j] as number);
          const fi = kq * (x.im[6 + j] as number) + dq * (x.re[6 + j] as number);
          expect(Math.abs((out[j] as number) - Math.hypot(fr, fi))).toBeLessThan(1e-8 * Math.max(1e-6, Math.hypot(fr, fi), ...Array.from(out)));
        }
      });
    }
  });
});

describe("springs on a base block: the twelve modes are mass-normalised and orthogonal", () => {
  it("phi_i^T M12 phi_j = delta_ij and phi_i^T K12 phi_j = w_i^2 delta_ij for an off-centre base (the time-domain K12, M12 at the same frequency)", () => {
    const input = parsed(doc({ x: [-1.8, 2.4], y: [-1.2, 1.6], z: [-1.3, -0.4] }, { materialDamping: 0.04 }));
    const model = buildModel(input);
    const sc = runSoilCase(model, 1);
    const parts = sc.impedance.twoStage;
    if (!parts) throw new Error("no base");
    const omega = model.rotors[0]?.omegaRated ?? 0;
    const modes = twoStageModes(model.massMatrix, parts, omega);
    const { M, K } = twoStageTimeDomain(model.massMatrix, parts, omega);
    const phi = modes.map((m) => [...m.shape, ...(m.baseShape ?? [])]);
    const form = (A: Float64Array, a: number[], b: number[]) => {
      let s = 0;
      for (let i = 0; i < 12; i++) for (let j = 0; j < 12; j++) s += (a[i] as number) * (A[i * 12 + j] as number) * (b[j] as number);
      return s;
    };
    const scaleK = Math.max(...modes.map((m) => m.eigenvalue));
    for (let i = 0; i < 12; i++) {
      for (let j = 0; j < 12; j++) {
        expect(Math.abs(form(M, phi[i] as number[], phi[j] as number[]) - (i === j ? 1 : 0))).toBeLessThan(1e-9);
        expect(Math.abs(form(K, phi[i] as number[], phi[j] as number[]) - (i === j ? (modes[i]?.eigenvalue ?? 0) : 0))).toBeLessThan(1e-9 * scaleK);
      }
    }
    // the result's modes are these
    expect(sc.modes.map((m) => m.frequencyHz)).toEqual(modes.map((m) => m.frequencyHz));
  });
});

describe("springs on a base block: checks, refusals and speed ramps", () => {
  it("applies the bearing check to the base: (block, machines and base) g over its footprint, against the allowable", () => {
    const r = analyse(parsed(doc(BASE)));
    const bearing = r.checks.find((c) => c.id === "bearing-pressure");
    const pressure = ((M1 + M2) * G) / 12;
    expect(r.springs?.base?.staticBearingPressure).toBeCloseTo(pressure, 6);
    expect(bearing?.value).toBeCloseTo(pressure / 200000, 9);
    expect(bearing?.notApplicable).toBeUndefined();
    expect(bearing?.label).toMatch(/base block/);
    // the upper block's own W / A is kept in massProperties, meaning unchanged
    expect(r.massProperties.staticBearingPressure).toBeCloseTo((M1 * G) / 6, 6);
  });

  it("takes the isolator frequency of the ratio check on the safe side: at least the rigid-floor springs' highest mode", () => {
    const r = analyse(parsed(doc(BASE)));
    const rigid = analyse(parsed(doc(undefined)));
    const check = r.checks.find((c) => c.id === "isolator-frequency-ratio");
    const rigidHighest = Math.max(...rigid.modes.map((m) => m.frequencyHz));
    expect(r.springs?.base?.rigidFloorHighestHz).toBeCloseTo(rigidHighest, 9);
    expect(r.springs?.highestNaturalFrequencyHz).toBeGreaterThanOrEqual(rigidHighest);
    expect(check?.value).toBeCloseTo(1200 / 60 / (r.springs?.highestNaturalFrequencyHz ?? 0), 12);
    // Rayleigh's constraint theorem: each of the six lowest two-stage modes lies at or below the rigid-floor mode of the same rank
    r.modes.slice(0, 6).forEach((m, i) => expect(m.frequencyHz).toBeLessThanOrEqual((rigid.modes[i]?.frequencyHz ?? 0) * (1 + 1e-12)));
  });

  it("computes the spring forces from the relative motion and the static deflection as on a rigid floor", () => {
    const r = analyse(parsed(doc(BASE)));
    expect(r.springs?.staticDeflection).toBeCloseTo((M1 * G) / K1, 12);
    expect(r.springs?.staticLoads?.[0]).toBeCloseTo((M1 * G) / 4, 6);
    const f = r.springs?.rotors[0]?.springForces.find((c) => c.case === "vertical");
    expect(f?.forces).toHaveLength(4);
    expect(f?.forces[0]?.[2]).toBeGreaterThan(0);
    expect(r.springs?.base?.rotors[0]?.cases.find((c) => c.case === "vertical")?.baseDisplacementPeak[2]).toBeGreaterThan(0);
  });

  it("runs the speed ramps on the twelve-DOF model: at constant rated speed, started on the steady state, it stays on the harmonic amplitude", () => {
    // at the reference (rated) speed the frozen time-domain model is the frequency-domain one exactly:
    // K_b(w_ref), C_b(w_ref) + 2 beta K_b / w_ref gives i w C_b + 2 i beta K_b at w = w_ref
    const input = parsed(doc(BASE, { materialDamping: 0.03, dampingRatio: 0.05 }));
    const model = buildModel(input);
    const sc = runSoilCase(model, 1);
    const rotor = model.rotors[0];
    if (!rotor) throw new Error("no rotor");
    for (const name of ["vertical", "rotating"] as const) {
      const loadIndex = rotor.loads.findIndex((l) => l.case === name && l.unbalanceMode === "static");
      const harmonic = sc.rotors[0]?.cases[loadIndex];
      const run = integrateRun(model, sc, { rotor, loadIndex, fromRpm: 1480, toRpm: 1480, durationS: 2, outputPoints: 50, start: "steady", stepsPerPeriod: 100 });
      expect(run.naturalFrequenciesHz).toHaveLength(12);
      for (let p = 0; p < 2; p++) {
        const expected = Math.max(...(harmonic?.points[p]?.displacementPeak ?? [0]));
        expect(relClose(run.displacementPeak[p]?.[0] ?? 0, expected, 5e-3)).toBe(true);
        expect(relClose(run.displacementPeak[p]?.at(-1) ?? 0, expected, 5e-3)).toBe(true);
      }
    }
  });

  it("a slow run-up through the isolator resonance reproduces the twelve-DOF harmonic peak (quasi-static limit), in analyse and on its own", () => {
    const d = doc(BASE, { materialDamping: 0.03, dampingRatio: 0.05 });
    const request = { machine: "Fan", rotor: "Impeller", kind: "run-up" as const, fromRpm: 100, toRpm: 140, durationS: 80, case: "vertical" as const };
    d.transient = [request];
    const input = parsed(d);
    const r = analyse(input);
    const run = r.transient?.[0];
    expect(run?.model.naturalFrequenciesHz).toHaveLength(12);
    const peak = run?.peakDisplacement.value ?? 0;
    expect(relClose(peak, run?.steadyStateMax.displacementPeak ?? 0, 0.01)).toBe(true);
    // the peak sits at the two-mass vertical isolator frequency
    expect(relClose(run?.peakDisplacement.atRpm ?? 0, (r.springs?.base?.twoMassVerticalHz[0] ?? 0) * 60, 0.05)).toBe(true);
    expect(r.warnings.some((w) => /not computed/.test(w))).toBe(false);
    expect(analyseTransient(input, request).peakDisplacement.value).toBe(peak);
  });

  it("refuses a base above the block's underside, a spring off the base, an embedment deeper than the base and unknown fields, naming the field", () => {
    expect(issuesOf(doc({ ...BASE, z: [-1, 0.1] })).map((i) => i.path)).toContain("impedance.base.z");
    const off = corners(1.3, 0.8, 4e5, 3e5);
    const outside = doc({ x: [-1.2, 1.2], y: [-1.5, 1.5], z: [-1.2, -0.3] }, { springs: off });
    expect(issuesOf(outside).map((i) => i.path)).toContain("impedance.springs[0]");
    const deep = doc(BASE);
    deep.soil.embedmentDepth = 1.5;
    expect(issuesOf(deep).map((i) => i.path)).toContain("soil.embedmentDepth");
    const unknown = doc({ ...BASE, height: 2 } as Base);
    expect(issuesOf(unknown).some((i) => i.path.startsWith("impedance.base"))).toBe(true);
    const wrongSupport = doc({ ...BASE, support: { method: "piles" } as unknown as Base["support"] });
    expect(issuesOf(wrongSupport).some((i) => i.path.startsWith("impedance.base.support"))).toBe(true);
  });

  it("gives the Gazetas validity warnings for the base's footprint (a0 = w B / Vs beyond 1.5 in the speed range)", () => {
    const r = analyse(parsed(doc(BASE)));
    const B = 1.5; // half the base's width (3 m)
    const a0 = (2 * Math.PI * (1480 / 60) * B) / 140;
    expect(a0).toBeGreaterThan(1.5);
    expect(r.warnings.some((w) => w.startsWith("Base block: Fan Impeller: a0 = w B / Vs reaches") && w.includes(a0.toFixed(2)))).toBe(true);
    // a rigid floor has no soil under it: no such warning
    expect(analyse(parsed(doc(undefined))).warnings.some((w) => /a0 = w B/.test(w))).toBe(false);
  });

  it("applies the soil band to the soil under the base and to the springs' stiffness together", () => {
    const r = analyse(parsed(doc(BASE)));
    const lower = r.bounds?.lower;
    const upper = r.bounds?.upper;
    expect(lower?.frequenciesHz).toHaveLength(12);
    // the springs scale with the factor, so the isolator modes move by about sqrt(factor); the base's by less than sqrt(factor) (Gazetas: K scales with G)
    const f0 = r.modes[0]?.frequencyHz ?? 0;
    expect((lower?.frequenciesHz[0] ?? 0) / f0).toBeCloseTo(Math.sqrt(lower?.factor ?? 0), 2);
    expect((upper?.frequenciesHz[11] ?? 0) / (r.modes[11]?.frequencyHz ?? 1)).toBeGreaterThan(1);
  });
});
