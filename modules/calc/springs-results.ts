// Results of a block on steel springs (method "springs", issue 16): static deflection, the
// vertical mode as an SDOF isolator and its transmissibility per operating speed, the force in
// each spring from the harmonic steady state, and the isolator frequency-ratio check.
import { STANDARD_GRAVITY } from "./criteria-defaults";
import { responseSet } from "./harmonic";
import { ISOLATION_MIN_RATIO, ISOLATION_RATIO_SOURCE, TRANSMISSIBILITY_SOURCE, transmissibility } from "./impedance-springs";
import type { Model } from "./model";
import type { CheckResult, SpringsResult } from "./result-types";
import type { SoilCase } from "./soil-case";

export function springsResults(model: Model, nominal: SoilCase): { result: SpringsResult; checks: CheckResult[] } | null {
  const imp = model.input.impedance;
  if (imp.method !== "springs") return null;
  const mass = model.massProperties.totalMass;
  const k = nominal.stiffnessUsed;
  const c = nominal.dashpotUsed;
  const sumKz = k[2] as number;
  const sumKh = k[0] as number;
  // W / sum kz (hand calculation: the springs share the weight in proportion to kz, layout symmetric)
  const staticDeflection = (mass * STANDARD_GRAVITY) / sumKz;
  const omegaZ = Math.sqrt(sumKz / mass);
  const verticalFrequencyHz = omegaZ / (2 * Math.PI);
  const verticalDampingRatio = (c[2] as number) / (2 * Math.sqrt(sumKz * mass));
  const highestHz = Math.max(...nominal.modes.map((m) => m.frequencyHz));

  const rotors = model.rotors.map((rotor) => {
    const speeds = [...new Set([rotor.rangeRpm[0], rotor.speedRpm, rotor.rangeRpm[1]])].sort((a, b) => a - b);
    const isolation = speeds.map((rpm) => {
      const r = rpm / 60 / verticalFrequencyHz;
      const tr = transmissibility(r, verticalDampingRatio);
      return { speedRpm: rpm, frequencyRatio: r, transmissibility: tr, isolationEfficiency: 1 - tr };
    });
    return { machine: rotor.machine, rotor: rotor.rotor, isolation, springForces: springForces(model, nominal, rotor.omegaRated, model.rotors.indexOf(rotor)) };
  });

  const checks: CheckResult[] = model.rotors.map((rotor) => {
    const value = rotor.rangeRpm[0] / 60 / highestHz;
    return {
      id: "isolator-frequency-ratio",
      key: `isolator-frequency-ratio/${rotor.machine}/${rotor.rotor}`,
      label: `${rotor.machine} ${rotor.rotor}: lowest operating speed ${rotor.rangeRpm[0]} rpm over the highest isolator frequency ${highestHz.toFixed(2)} Hz`,
      value,
      limit: ISOLATION_MIN_RATIO,
      comparison: "min",
      unit: "-",
      source: ISOLATION_RATIO_SOURCE,
      machine: rotor.machine,
      rotor: rotor.rotor,
      pass: value >= ISOLATION_MIN_RATIO,
    };
  });

  return {
    result: {
      staticDeflection,
      sumKz,
      sumKh,
      verticalFrequencyHz,
      verticalDampingRatio,
      highestNaturalFrequencyHz: highestHz,
      transmissibilitySource: TRANSMISSIBILITY_SOURCE,
      rotors,
    },
    checks,
  };
}

/**
 * Force amplitude per axis in each spring at the rotor's rated speed, for each load case:
 * F = (k + i w c) u_p with u_p = U + Theta x p at the spring top (p = (x_i, y_i, 0) from O).
 * Dashpots per spring: the spring's own cz, ch when dampers are given; otherwise the spring's
 * share kz_i / sum kz (kh_i / sum kh) of the vertical (horizontal) dashpot of the damping ratio.
 */
function springForces(model: Model, nominal: SoilCase, omega: number, rotorIndex: number): SpringsResult["rotors"][number]["springForces"] {
  const imp = model.input.impedance;
  const rotor = model.rotors[rotorIndex];
  if (imp.method !== "springs" || !rotor) return [];
  const solver = nominal.solver;
  const u = responseSet(rotor.loads.length);
  solver.setFrequency(omega);
  solver.solveAll(rotor.loads, u);
  const dampers = imp.springs.some((s) => s.cz !== undefined || s.ch !== undefined);
  const kz = nominal.stiffnessUsed[2] as number;
  const kh = nominal.stiffnessUsed[0] as number;
  const cz = nominal.dashpotUsed[2] as number;
  const ch = nominal.dashpotUsed[0] as number;
  const factor = nominal.factor;
  const F = rotor.forceAtRated;
  return rotor.loads.map((load, l) => {
    const o = 6 * l;
    const re = (j: number) => (u.re[o + j] as number) * F;
    const im = (j: number) => (u.im[o + j] as number) * F;
    const forces = imp.springs.map((s) => {
      const x = s.x - model.origin[0];
      const y = s.y - model.origin[1];
      // u_p = U + Theta x p, p = (x, y, 0)
      const ux = [re(0) - re(5) * y, im(0) - im(5) * y] as const;
      const uy = [re(1) + re(5) * x, im(1) + im(5) * x] as const;
      const uz = [re(2) + re(3) * y - re(4) * x, im(2) + im(3) * y - im(4) * x] as const;
      const kzi = s.kz * factor;
      const khi = s.kh * factor;
      const czi = dampers ? (s.cz ?? 0) : (cz * s.kz * factor) / kz;
      const chi = dampers ? (s.ch ?? 0) : (ch * s.kh * factor) / kh;
      const amp = (kk: number, cc: number, d: readonly [number, number]) => Math.hypot(kk, omega * cc) * Math.hypot(d[0], d[1]);
      return [amp(khi, chi, ux), amp(khi, chi, uy), amp(kzi, czi, uz)] as [number, number, number];
    });
    return { case: load.case, unbalanceMode: load.unbalanceMode, speedRpm: rotor.speedRpm, forces };
  });
}


