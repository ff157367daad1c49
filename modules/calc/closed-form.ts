// Closed-form single-degree-of-freedom and coupled rocking-sliding values shown beside the
// six-DOF results as a cross-check.
import { responseSet } from "./harmonic";
import type { Model } from "./model";
import type { CrossCheckResult, CrossCheckValue } from "./result-types";
import type { SoilCase } from "./soil-case";

/** Natural frequency of a spring-mass oscillator f = sqrt(k / m) / (2 pi) (Chopra, Dynamics of Structures). */
export const sdofFrequencyHz = (k: number, m: number) => Math.sqrt(k / m) / (2 * Math.PI);

/**
 * Steady-state amplitude of m u'' + c u' + k (1 + 2 i beta) u = F0 e^{i w t}:
 * |F0 / (k (1 + 2 i beta) + i w c - w^2 m)|. With beta = 0 this is Chopra's
 * (F0 / k) / sqrt((1 - r^2)^2 + (2 zeta r)^2), zeta = c / (2 sqrt(k m)).
 */
export function sdofAmplitude(F0: number, k: number, c: number, m: number, omega: number, beta: number): number {
  return F0 / Math.hypot(k - omega * omega * m, 2 * beta * k + omega * c);
}

/**
 * Force transmissibility |k (1 + 2 i beta) + i w c| / |k (1 + 2 i beta) + i w c - w^2 m|; with
 * beta = 0 Chopra's sqrt(1 + (2 zeta r)^2) / sqrt((1 - r^2)^2 + (2 zeta r)^2).
 */
export function sdofTransmissibility(k: number, c: number, m: number, omega: number, beta: number): number {
  const im = 2 * beta * k + omega * c;
  return Math.hypot(k, im) / Math.hypot(k - omega * omega * m, im);
}

/**
 * Coupled rocking and sliding, Richart, Hall & Woods (1970):
 * w^4 - w^2 (w_x^2 + w_psi^2) / gamma + w_x^2 w_psi^2 / gamma = 0, w_x^2 = k_x / m,
 * w_psi^2 = k_psi / I_b, gamma = I_0 / I_b (I_0 about the cg, I_b about the base axis).
 * Returns the two roots in Hz, ascending.
 */
export function rockingSlidingHz(kx: number, kpsi: number, m: number, Ib: number, I0: number): [number, number] {
  const wx2 = kx / m;
  const wp2 = kpsi / Ib;
  const gamma = I0 / Ib;
  const sum = wx2 + wp2;
  const disc = Math.sqrt(Math.max(sum * sum - 4 * gamma * wx2 * wp2, 0));
  const lo = (sum - disc) / (2 * gamma);
  const hi = (sum + disc) / (2 * gamma);
  return [Math.sqrt(Math.max(lo, 0)) / (2 * Math.PI), Math.sqrt(hi) / (2 * Math.PI)];
}

function nearest(closedFormHz: number, modesHz: number[]): CrossCheckValue {
  let best = 0;
  modesHz.forEach((f, i) => {
    if (Math.abs(f - closedFormHz) < Math.abs((modesHz[best] as number) - closedFormHz)) best = i;
  });
  return { closedFormHz, nearestModeHz: modesHz[best] as number, nearestMode: best + 1 };
}

export function buildCrossCheck(model: Model, nominal: SoilCase): CrossCheckResult {
  const k = nominal.stiffnessUsed;
  const c = nominal.dashpotUsed;
  const M = model.massMatrix;
  const m = M[0] as number;
  const I0 = model.massProperties.inertiaAtCg;
  const modesHz = nominal.modes.map((mode) => mode.frequencyHz);
  const beta = nominal.soil.materialDamping;
  const xz = rockingSlidingHz(k[0] as number, k[4] as number, m, M[4 * 7] as number, (I0[1] as number[])[1] as number);
  const yz = rockingSlidingHz(k[1] as number, k[3] as number, m, M[3 * 7] as number, (I0[0] as number[])[0] as number);
  const vertical: CrossCheckResult["vertical"] = nearest(sdofFrequencyHz(k[2] as number, m), modesHz);
  const rotor = model.rotors[0];
  const load = rotor?.loads.find((l) => l.case === "vertical" && l.unbalanceMode === "static");
  if (rotor && load) {
    const omega = rotor.omegaRated;
    const solver = nominal.solver;
    solver.setFrequency(omega);
    const u = responseSet(rotor.loads.length);
    solver.solveAll(rotor.loads, u);
    const l = rotor.loads.indexOf(load);
    const tf = new Float64Array(3);
    vertical.amplitude = sdofAmplitude(rotor.forceAtRated, k[2] as number, c[2] as number, m, omega, beta);
    vertical.sixDofAmplitudeAtO = Math.hypot(u.re[6 * l + 2] as number, u.im[6 * l + 2] as number) * rotor.forceAtRated;
    vertical.transmissibility = sdofTransmissibility(k[2] as number, c[2] as number, m, omega, beta);
    vertical.sixDofTransmissibility = solver.transmittedForce(u, l, 1, tf);
  }
  return {
    source:
      "vertical and torsion: single-DOF oscillator (Chopra, Dynamics of Structures); rocking-sliding: frequency equation of Richart, Hall & Woods (1970); springs and dashpots as used by the six-DOF model at the first rotor's rated speed" +
      (nominal.impedance.evaluateMatrix ? " (their diagonal only: the coupling terms of the pile group are not in these closed forms, so they differ from the six-DOF modes)" : ""),
    vertical,
    torsion: nearest(sdofFrequencyHz(k[5] as number, M[5 * 7] as number), modesHz),
    rockingSlidingXZ: { low: nearest(xz[0], modesHz), high: nearest(xz[1], modesHz) },
    rockingSlidingYZ: { low: nearest(yz[0], modesHz), high: nearest(yz[1], modesHz) },
  };
}
