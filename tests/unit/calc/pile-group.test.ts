// Pile group under a rigid cap (method "piles", pile-group.ts, impedance-piles.ts), checked
// against sources outside the code:
// - Dobry, R. & Gazetas, G. (1988), Geotechnique 38(4): interaction factor
//   alpha(S) = (S / r0)^(-1/2) exp(-beta w S / V) exp(-i w S / V), V = Vs (vertical, lateral across
//   the line of piles) or Lysmer's analog V_La = 3.4 Vs / (pi (1 - nu)) (lateral along it) (recalled).
// - Superposition for two equal piles under a rigid cap (Poulos & Davis 1980, Pile Foundation
//   Analysis and Design, two-pile group): K_group = 2 K_single / (1 + alpha).
// - Rigid-cap kinematics u_p = U + Theta x p: without interaction the cap's stiffness is the sum
//   of the piles' (sum kv x^2 + n K_MM for rocking, sum K_HH r^2 for torsion, n K_HM coupling).
// - Passivity: the radiation dashpot matrix of a passive support is positive semidefinite.
import { readFileSync } from "node:fs";
import { EigenvalueDecomposition, Matrix, CholeskyDecomposition } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import {
  STATIC_INTERACTION_FADE_A0,
  clampPositiveSemidefinite,
  groupInfluence,
  interactionFactor,
  lysmerVelocity,
  pileGroupModel,
  randolphStaticInteraction,
  staticInteractionExcess,
} from "@/modules/calc/pile-group";
import { pileHeadStatic, randolphInfluenceRadius, type PileSoil, type PileSpec } from "@/modules/calc/pile-single";
import { relClose } from "./helpers";

const VS = 140;
const SOIL: PileSoil = { shearModulus: 1900 * VS * VS, density: 1900, poissonRatio: 0.3 };
const PILE: PileSpec = { diameter: 0.5, length: 14, youngsModulus: 3e10, density: 2500, tip: "floating", profile: "uniform" };
const R0 = 0.25;

function group(xs: number[], ys: number[], interaction = true, beta = 0.02, spec: PileSpec = PILE) {
  return pileGroupModel({ spec, soil: SOIL, geo: { x: Float64Array.from(xs), y: Float64Array.from(ys), zh: 0 }, beta, interaction });
}
const XS = [-1.4, 1.4, -1.4, 1.4];
const YS = [-0.8, -0.8, 0.8, 0.8];
const at = (M: Float64Array, i: number, j: number) => M[i * 6 + j] as number;
function matrix(M: Float64Array): Matrix {
  const m = new Matrix(6, 6);
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) m.set(i, j, at(M, i, j));
  return m;
}
const eigenvalues = (M: Float64Array) => new EigenvalueDecomposition(matrix(M), { assumeSymmetric: true }).realEigenvalues;

describe("Dobry & Gazetas (1988) interaction factor", () => {
  it("at zero frequency alpha = (S / r0)^(-1/2), real, and it decays as S^(-1/2)", () => {
    const [re, im] = interactionFactor(1.0, R0, 0, VS, 0.05);
    expect(re).toBeCloseTo(Math.sqrt(0.25 / 1.0), 14);
    expect(Math.abs(im)).toBe(0);
    // 2 d spacing: alpha = (4)^(-1/2) = 0.5
    expect(interactionFactor(1.0, 0.25, 0, VS, 0)[0]).toBeCloseTo(0.5, 14);
    // four times the spacing halves it
    expect(interactionFactor(4.0, R0, 0, VS, 0)[0] / interactionFactor(1.0, R0, 0, VS, 0)[0]).toBeCloseTo(0.5, 14);
  });

  it("phase e^(-i w S / V) (the wave arrives later at the farther pile) and amplitude e^(-beta w S / V)", () => {
    const w = 2 * Math.PI * 10;
    const S = 2.0;
    const beta = 0.04;
    const [re, im] = interactionFactor(S, R0, w, VS, beta);
    const amp = Math.sqrt(R0 / S) * Math.exp((-beta * w * S) / VS);
    expect(Math.hypot(re, im)).toBeCloseTo(amp, 12);
    expect(Math.atan2(im, re)).toBeCloseTo(-((w * S) / VS - 2 * Math.PI * Math.round((w * S) / VS / (2 * Math.PI))), 10);
  });

  it("Lysmer's analog velocity 3.4 Vs / (pi (1 - nu))", () => {
    expect(lysmerVelocity(140, 0.3)).toBeCloseTo((3.4 * 140) / (Math.PI * 0.7), 12);
    expect(lysmerVelocity(140, 0.3)).toBeGreaterThan(140);
  });
});

describe("static floor of the vertical interaction (Randolph & Wroth 1979, recalled)", () => {
  it("alpha_R = ln(r_m / S) / ln(r_m / r0) below r_m, 0 beyond; r_m of Randolph & Wroth (1978)", () => {
    expect(randolphInfluenceRadius(PILE, 0.3)).toBeCloseTo(24.5, 12);
    expect(randolphInfluenceRadius({ ...PILE, tip: "end-bearing" }, 0.3)).toBeCloseTo(0.25 * 14, 12);
    expect(randolphInfluenceRadius({ ...PILE, profile: "linear" }, 0.3)).toBeCloseTo((0.25 + 1.25 * 0.7 - 0.25) * 14, 12);
    expect(randolphStaticInteraction(2, R0, 24.5)).toBeCloseTo(Math.log(12.25) / Math.log(98), 12);
    expect(randolphStaticInteraction(R0, R0, 24.5)).toBeCloseTo(1, 12);
    expect(randolphStaticInteraction(30, R0, 24.5)).toBe(0);
  });

  it("fades linearly to nothing at a0 = w d / Vs = 0.2 and only ever adds to Dobry & Gazetas' factor", () => {
    const excess0 = randolphStaticInteraction(2, R0, 24.5) - Math.sqrt(R0 / 2);
    expect(staticInteractionExcess(2, R0, 24.5, 0)).toBeCloseTo(excess0, 12);
    expect(staticInteractionExcess(2, R0, 24.5, 0.1)).toBeCloseTo(excess0 / 2, 12);
    expect(staticInteractionExcess(2, R0, 24.5, STATIC_INTERACTION_FADE_A0)).toBe(0);
    expect(staticInteractionExcess(2, R0, 24.5, 0.7)).toBe(0);
    // where Dobry & Gazetas' static limit is the larger (wide spacing, short r_m) nothing is added
    expect(staticInteractionExcess(3, R0, 3.5, 0)).toBe(0);
  });

  it("the group at a0 >= 0.2 is Dobry & Gazetas' alone; below, its vertical stiffness is softer", () => {
    const geo = { x: Float64Array.from(XS), y: Float64Array.from(YS), zh: 0 };
    const floor = { rm: 24.5, diameter: PILE.diameter };
    const wAt = (a0: number) => (a0 * VS) / PILE.diameter;
    const hi = [groupInfluence(geo, R0, VS, 0.3, 0.02, wAt(0.3), true), groupInfluence(geo, R0, VS, 0.3, 0.02, wAt(0.3), true, floor)];
    expect(Array.from(hi[1]!.vRe)).toEqual(Array.from(hi[0]!.vRe));
    expect(Array.from(hi[1]!.vIm)).toEqual(Array.from(hi[0]!.vIm));
    const lo = [groupInfluence(geo, R0, VS, 0.3, 0.02, wAt(0.05), true), groupInfluence(geo, R0, VS, 0.3, 0.02, wAt(0.05), true, floor)];
    // Q_zz = T^T A^-1 T along z: more interaction, a smaller Q (a softer group in z)
    expect(lo[1]!.vRe[2 * 7]!).toBeLessThan(lo[0]!.vRe[2 * 7]!);
    expect(Array.from(lo[1]!.hRe)).toEqual(Array.from(lo[0]!.hRe));
  });
});

describe("group at O", () => {
  it("two piles, vertical at w = 0: 2 kv / (1 + alpha) (superposition, Poulos & Davis 1980)", () => {
    const g = group([-1, 1], [0, 0], true, 0);
    const K = new Float64Array(36);
    const C = new Float64Array(36);
    g.evaluate(0, K, C);
    const kv = pileHeadStatic(PILE, SOIL).kv;
    // at w = 0 the factor is Randolph & Wroth's (1979) static ln(r_m/S)/ln(r_m/r0) where it exceeds
    // Dobry & Gazetas' (S/r0)^(-1/2): r_m = (0.25 + 2.5 (1 - nu) - 0.25) L = 1.75 x 14 = 24.5 m
    const alpha = Math.log(24.5 / 2) / Math.log(24.5 / R0);
    expect(alpha).toBeGreaterThan(Math.sqrt(R0 / 2));
    // (1e-8: the engine takes w = 0 as a0 = 1e-9 for the dashpots' limit, where the fade is 1 - 5e-9)
    expect(relClose(at(K, 2, 2), (2 * kv) / (1 + alpha), 1e-8)).toBe(true);
    // rocking about y of the pair: kv x^2 each, with the antisymmetric interaction: 2 kv / (1 - alpha) x^2 + 2 K_MM
    const s = pileHeadStatic(PILE, SOIL);
    expect(relClose(at(K, 4, 4), (2 * kv) / (1 - alpha) + 2 * s.kmm, 1e-8)).toBe(true);
  });

  it("2 x 2 group without interaction is the sum of the singles (rigid-cap kinematics)", () => {
    const s = pileHeadStatic(PILE, SOIL);
    const K = new Float64Array(36);
    const C = new Float64Array(36);
    group(XS, YS, false, 0).evaluate(0, K, C);
    expect(relClose(at(K, 0, 0), 4 * s.khh, 1e-12)).toBe(true);
    expect(relClose(at(K, 2, 2), 4 * s.kv, 1e-12)).toBe(true);
    expect(relClose(at(K, 3, 3), 4 * s.kv * 0.8 ** 2 + 4 * s.kmm, 1e-12)).toBe(true);
    expect(relClose(at(K, 4, 4), 4 * s.kv * 1.4 ** 2 + 4 * s.kmm, 1e-12)).toBe(true);
    expect(relClose(at(K, 5, 5), 4 * s.khh * (1.4 ** 2 + 0.8 ** 2), 1e-12)).toBe(true);
    // sway-rocking coupling (sign: a pile hangs below its head): K_x,ry = -n K_HM, K_y,rx = +n K_HM
    expect(relClose(at(K, 0, 4), -4 * s.khm, 1e-12)).toBe(true);
    expect(relClose(at(K, 1, 3), 4 * s.khm, 1e-12)).toBe(true);
  });

  it("2 x 2 group: interaction lowers the vertical and lateral static stiffness below the sum of singles (efficiency < 1)", () => {
    const s = pileHeadStatic(PILE, SOIL);
    const K = new Float64Array(36);
    const C = new Float64Array(36);
    group(XS, YS).evaluate(0, K, C);
    const effV = at(K, 2, 2) / (4 * s.kv);
    const effH = at(K, 0, 0) / (4 * s.khh);
    expect(effV).toBeLessThan(1);
    expect(effV).toBeGreaterThan(0.3);
    expect(effH).toBeLessThan(1);
    // hand: vertical at w = 0, each pile sees from its three neighbours (S = 1.6, 2.8, 3.225 m) the
    // larger of Randolph & Wroth's (1979) ln(r_m/S)/ln(r_m/r0) (r_m = 24.5 m) and (S/r0)^(-1/2)
    const factor = (S: number) => Math.max(Math.log(24.5 / S) / Math.log(24.5 / R0), Math.sqrt(R0 / S));
    const sum = factor(1.6) + factor(2.8) + factor(Math.hypot(2.8, 1.6));
    expect(relClose(effV, 1 / (1 + sum), 1e-8)).toBe(true);
  });

  it("K and C are symmetric at every frequency; K is positive definite at low frequency", () => {
    const g = group([-1.4, 1.4, -1.4, 1.4, 0.3], [-0.8, -0.8, 0.8, 0.8, 0.1]);
    const K = new Float64Array(36);
    const C = new Float64Array(36);
    for (const f of [0, 0.5, 3, 12, 30, 60]) {
      g.evaluate(2 * Math.PI * f, K, C);
      for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
        expect(at(K, i, j)).toBe(at(K, j, i));
        expect(at(C, i, j)).toBe(at(C, j, i));
      }
      if (f <= 3) expect(new CholeskyDecomposition(matrix(K)).isPositiveDefinite()).toBe(true);
    }
  });

  it("passive at every frequency: the radiation dashpots and the total damping 2 beta K + w C are positive semidefinite", () => {
    for (const beta of [0, 0.03]) {
      const g = group(XS, YS, true, beta);
      const K = new Float64Array(36);
      const C = new Float64Array(36);
      for (let f = 0.25; f <= 60; f *= 1.25) {
        const w = 2 * Math.PI * f;
        g.evaluate(w, K, C);
        const total = Float64Array.from(K, (k, i) => 2 * beta * k + w * (C[i] as number));
        const vals = eigenvalues(total);
        const scale = Math.max(...vals.map(Math.abs));
        expect(Math.min(...vals)).toBeGreaterThanOrEqual(-1e-9 * scale);
      }
    }
  });

  it("the nearest positive semidefinite matrix: negative eigenvalues removed, a positive one kept", () => {
    const M = new Float64Array(36);
    M[0] = 2;
    M[7] = -1;
    M[1] = 0;
    M[14] = 1;
    M[21] = 1;
    M[28] = 1;
    M[35] = 1;
    expect(clampPositiveSemidefinite(M)).toBeCloseTo(-1, 12);
    expect(M[0]).toBeCloseTo(2, 12);
    expect(Math.abs(M[7] as number)).toBeLessThan(1e-12);
    const pd = Float64Array.from({ length: 36 }, (_, i) => (i % 7 === 0 ? 3 : 0));
    expect(clampPositiveSemidefinite(pd)).toBe(0);
  });
});

const EXAMPLE = JSON.parse(readFileSync("examples/pile-cap.json", "utf8")) as AnalysisInputDocument;
function withPiles(change: Record<string, unknown>): AnalysisInputDocument {
  return { ...EXAMPLE, impedance: { ...(EXAMPLE.impedance as object), ...change } as AnalysisInputDocument["impedance"] };
}
function issuePaths(doc: unknown): string[] {
  const p = parseAnalysisInput(doc);
  return p.ok ? [] : p.issues.map((i) => i.path);
}

describe("the pile-cap example through the engine", () => {
  it("parses, runs, gives six modes and the sway-rocking coupling terms", () => {
    const p = parseAnalysisInput(EXAMPLE);
    if (!p.ok) throw new Error(JSON.stringify(p.issues));
    const r = analyse(p.input);
    expect(r.impedance.method).toBe("piles");
    expect(r.modes).toHaveLength(6);
    for (const m of r.modes) expect(m.frequencyHz).toBeGreaterThan(0);
    const coupling = r.impedance.coupling ?? [];
    const xry = coupling.find((c) => c.dofs[0] === "x" && c.dofs[1] === "ry");
    expect(xry?.stiffness).toBeLessThan(0);
    expect(r.impedance.details?.groupEfficiencyVertical).toBeLessThan(1);
    // the passivity clamp is named where it acts (rocking and torsion of this close group below about 11 Hz)
    expect(r.warnings.some((w) => w.startsWith("Piles: at 0.500 to 11.0 Hz") && w.includes("no radiation damping"))).toBe(true);
    const alone = parseAnalysisInput(withPiles({ interaction: "none" }));
    if (!alone.ok) throw new Error(JSON.stringify(alone.issues));
    expect(analyse(alone.input).warnings.some((w) => w.includes("no radiation damping"))).toBe(false);
  });
});

describe("limits of the piles method are refused by field", () => {
  it("a short rigid pile (L below the active length)", () => {
    expect(issuePaths(withPiles({ length: 3 }))).toContain("impedance.length");
  });
  it("spacing closer than 2 d", () => {
    expect(issuePaths(withPiles({ piles: [{ x: -0.4, y: 0 }, { x: 0.0, y: 0 }, { x: 1.4, y: 0.8 }] }))).toContain("impedance.piles[1]");
  });
  it("a pile head outside the underside of the cap", () => {
    expect(issuePaths(withPiles({ piles: [{ x: -1.4, y: 0 }, { x: 2.5, y: 0 }] }))).toContain("impedance.piles[1]");
  });
  it("raked piles are not offered: a rake field is unknown", () => {
    expect(issuePaths(withPiles({ piles: [{ x: -1.4, y: 0, rake: 0.2 }, { x: 1.4, y: 0 }] }))).toContain("impedance.piles[0].rake");
  });
  it("a rated speed where the group's dynamic stiffness has a negative direction (no natural frequency there; 2400 rpm for the example)", () => {
    const fast = structuredClone(EXAMPLE);
    const rotor = fast.machines[0]?.rotors?.[0];
    if (!rotor) throw new Error("example has no rotor");
    rotor.speedRpm = 2400;
    rotor.speedRangeRpm = [1700, 2400];
    const p = parseAnalysisInput(fast);
    expect(p.ok).toBe(false);
    const issue = p.ok ? undefined : p.issues.find((i) => i.path === "impedance.piles");
    expect(issue?.message).toContain("negative direction");
    // the group at that speed: the least eigenvalue of K is indeed negative (not a rounding artefact)
    const K = new Float64Array(36);
    const C = new Float64Array(36);
    group(XS, YS, true, 0.02).evaluate((2400 * 2 * Math.PI) / 60, K, C);
    expect(Math.min(...eigenvalues(K))).toBeLessThan(-0.05 * Math.max(...eigenvalues(K)));
  });
  it("one pile (no torsional stiffness without pile torsion), a bad tip, a stratum under the piles", () => {
    expect(issuePaths(withPiles({ piles: [{ x: 0, y: 0 }] }))).toContain("impedance.piles");
    expect(issuePaths(withPiles({ tip: "socketed" }))).toContain("impedance.tip");
    expect(issuePaths({ ...withPiles({}), soil: { ...EXAMPLE.soil, stratum: { thickness: 20, base: "rigid" } } })).toContain("soil.stratum");
  });
});
