// Results of a block on steel springs (method "springs", issue 16): static deflection, the
// vertical mode as an SDOF isolator and its transmissibility per operating speed, the force in
// each spring from the harmonic steady state, and the isolator frequency-ratio check.
import { STANDARD_GRAVITY } from "./criteria-defaults";
import { dofFromArray } from "./dof";
import { naturalModes } from "./eigen";
import { baseAndRelativeMotion, forceAt, responseSet, type HarmonicSolver, type ResponseSet } from "./harmonic";
import { evaluateImpedanceMatrix } from "./impedance-model";
import { twoMassFrequenciesHz, type TwoStageParts } from "./two-stage";
import { ISOLATION_MIN_RATIO, ISOLATION_RATIO_SOURCE, TRANSMISSIBILITY_SOURCE, transmissibility } from "./impedance-springs";
import type { Model } from "./model";
import type { CheckResult, SpringBaseResult, SpringsResult } from "./result-types";
import type { SoilCase } from "./soil-case";
import { speedGridRpm } from "./sweep-grid";
import { rpmToRadPerSec } from "./unbalance";

export const SPRING_COMPRESSION_SOURCE =
  "common practice (no lift-off): every spring stays in compression, its static load (rigid block on linear springs, static equilibrium) greater than the amplitude of its dynamic vertical force F = (k + i w c) u_z (harmonic steady state)";

export function springsResults(model: Model, nominal: SoilCase, bandCases: SoilCase[] = []): { result: SpringsResult; checks: CheckResult[] } | null {
  const imp = model.input.impedance;
  if (imp.method !== "springs") return null;
  const mass = model.massProperties.totalMass;
  const parts = nominal.impedance.twoStage;
  const { k, c } = springsOwn(nominal);
  const sumKz = k[2] as number;
  const sumKh = k[0] as number;
  // W / sum kz (hand calculation: the springs share the weight in proportion to kz, layout symmetric)
  const staticDeflection = (mass * STANDARD_GRAVITY) / sumKz;
  const omegaZ = Math.sqrt(sumKz / mass);
  const verticalDampingRatio = (c[2] as number) / (2 * Math.sqrt(sumKz * mass));
  const base = parts && model.baseBlock ? baseResult(model, nominal, parts) : undefined;
  // on a base block: the vertical isolator frequency is the lower root of the two-mass system
  const verticalFrequencyHz = base ? base.twoMassVerticalHz[0] : omegaZ / (2 * Math.PI);
  // on a base block: the highest of the upper block's twelve-DOF modes and of the rigid-floor
  // modes of the same springs (an upper bound of the six lowest: Rayleigh's constraint theorem)
  const highestHz = base ? Math.max(base.isolatorModesHighestHz, base.rigidFloorHighestHz) : Math.max(...nominal.modes.map((m) => m.frequencyHz));

  const rotors = model.rotors.map((rotor) => {
    const speeds = [...new Set([rotor.rangeRpm[0], rotor.speedRpm, rotor.rangeRpm[1]])].sort((a, b) => a - b);
    const isolation = speeds.map((rpm) => {
      const r = rpm / 60 / verticalFrequencyHz;
      const tr = parts ? groundTransmissibility(rotor, nominal.solver, rpmToRadPerSec(rpm)) : transmissibility(r, verticalDampingRatio);
      return { speedRpm: rpm, frequencyRatio: r, transmissibility: tr, isolationEfficiency: 1 - tr };
    });
    return { machine: rotor.machine, rotor: rotor.rotor, isolation, springForces: springForces(model, nominal, rotor.omegaRated, model.rotors.indexOf(rotor)) };
  });

  const checks: CheckResult[] = model.rotors.map((rotor) => {
    const value = rotor.rangeRpm[0] / 60 / highestHz;
    return {
      id: "isolator-frequency-ratio",
      key: `isolator-frequency-ratio/${rotor.machine}/${rotor.rotor}`,
      label: `${rotor.machine} ${rotor.rotor}: lowest operating speed ${rotor.rangeRpm[0]} rpm over the highest isolator frequency ${highestHz.toFixed(2)} Hz${base ? " (springs on the base block: the higher of the upper block's modes and the same springs on a rigid floor)" : ""}`,
      value,
      limit: ISOLATION_MIN_RATIO,
      comparison: "min",
      unit: "-",
      source: base ? `${ISOLATION_RATIO_SOURCE}; on a base block the isolator frequency is the highest of the twelve-DOF modes dominated by the upper block and of the six modes of the same springs on a rigid floor (an upper bound of the six lowest modes, Rayleigh's theorem of constraint), the safe side` : ISOLATION_RATIO_SOURCE,
      machine: rotor.machine,
      rotor: rotor.rotor,
      pass: value >= ISOLATION_MIN_RATIO,
    };
  });

  const staticLoads = springStaticLoads(model);
  checks.push(...springCompressionChecks(model, staticLoads, [nominal, ...bandCases]));

  return {
    result: {
      staticLoads,
      staticDeflection,
      sumKz,
      sumKh,
      verticalFrequencyHz,
      verticalDampingRatio,
      highestNaturalFrequencyHz: highestHz,
      transmissibilitySource: base ? GROUND_TRANSMISSIBILITY_SOURCE : TRANSMISSIBILITY_SOURCE,
      rotors,
      ...(base ? { base } : {}),
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
  const own = springsOwn(nominal);
  const kz = own.k[2] as number;
  const kh = own.k[0] as number;
  const cz = own.c[2] as number;
  const ch = own.c[0] as number;
  const factor = nominal.factor;
  const F = rotor.forceAtRated;
  const w = motionScratch();
  return rotor.loads.map((load, l) => {
    // the springs' relative motion (on a rigid floor: U itself)
    baseAndRelativeMotion(solver, model.baseBlock?.transfer ?? null, u, l, w.base, w.rel);
    const re = (j: number) => (w.rel.re[j] as number) * F;
    const im = (j: number) => (w.rel.im[j] as number) * F;
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



/**
 * Static load in each spring (N, compression positive, input order): the rigid block on linear
 * springs under its weight W at the combined cg (x_c, y_c) from O. With the stiffness centre at
 * O (sum kz x = sum kz y = sum kz x y = 0, required by the input rules), equilibrium of force and
 * of the moments about the axes through O gives the deflection d_i = W / sum kz + W y_c y_i /
 * sum kz y^2 + W x_c x_i / sum kz x^2 and the load kz_i d_i (statics; the loads add up to W). A
 * symmetric block of four equal springs with the cg above O: m g / 4 each.
 */
export function springStaticLoads(model: Model): number[] {
  const imp = model.input.impedance;
  if (imp.method !== "springs") return [];
  const weight = model.massProperties.totalMass * STANDARD_GRAVITY;
  const xc = model.massProperties.cg[0] - model.origin[0];
  const yc = model.massProperties.cg[1] - model.origin[1];
  const pos = imp.springs.map((s) => [s.x - model.origin[0], s.y - model.origin[1]] as const);
  let sumKz = 0;
  let sumKzXX = 0;
  let sumKzYY = 0;
  imp.springs.forEach((s, i) => {
    const [x, y] = pos[i] as readonly [number, number];
    sumKz += s.kz;
    sumKzXX += s.kz * x * x;
    sumKzYY += s.kz * y * y;
  });
  return imp.springs.map((s, i) => {
    const [x, y] = pos[i] as readonly [number, number];
    const d = weight / sumKz + (sumKzYY > 0 ? (weight * yc * y) / sumKzYY : 0) + (sumKzXX > 0 ? (weight * xc * x) / sumKzXX : 0);
    return s.kz * d;
  });
}

/** Amplitude of the dynamic vertical force in each spring, for each load of the rotor, at omega with unbalance force f. */
function verticalSpringForces(model: Model, sc: SoilCase, rotorIndex: number, omega: number, f: number): number[][] {
  const imp = model.input.impedance;
  const rotor = model.rotors[rotorIndex];
  if (imp.method !== "springs" || !rotor) return [];
  const u = responseSet(rotor.loads.length);
  sc.solver.setFrequency(omega);
  sc.solver.solveAll(rotor.loads, u);
  const dampers = imp.springs.some((s) => s.cz !== undefined || s.ch !== undefined);
  const own = springsOwn(sc);
  const kz = own.k[2] as number;
  const cz = own.c[2] as number;
  const w = motionScratch();
  return rotor.loads.map((_, l) => {
    baseAndRelativeMotion(sc.solver, model.baseBlock?.transfer ?? null, u, l, w.base, w.rel);
    const re = (j: number) => (w.rel.re[j] as number) * f;
    const im = (j: number) => (w.rel.im[j] as number) * f;
    return imp.springs.map((s) => {
      const x = s.x - model.origin[0];
      const y = s.y - model.origin[1];
      const kzi = s.kz * sc.factor;
      const czi = dampers ? (s.cz ?? 0) : (cz * kzi) / kz;
      return Math.hypot(kzi, omega * czi) * Math.hypot(re(2) + re(3) * y - re(4) * x, im(2) + im(3) * y - im(4) * x);
    });
  });
}

interface SpringPeak {
  force: number;
  speedRpm: number;
  soilCase: SoilCase;
}

/**
 * Check `spring-compression` (no lift-off, common practice): per rotor and spring, the static load
 * over the largest dynamic vertical force amplitude in that spring over the rotor's operating
 * speeds (the envelope grid of the rotor responses: 101 speeds, the rated speed and every natural
 * frequency in the range), every load case, at nominal stiffness and at both ends of the band;
 * at least 1. With two or more rotors also `spring-compression-combined` per spring: the sum of
 * every rotor's largest amplitude (the rotors' phases and speeds are unknown: the absolute sum is
 * an upper bound, the safe side).
 */
function springCompressionChecks(model: Model, staticLoads: number[], cases: SoilCase[]): CheckResult[] {
  const imp = model.input.impedance;
  if (imp.method !== "springs") return [];
  const modesHz = cases[0]?.modes.map((m) => m.frequencyHz) ?? [];
  const peaks: SpringPeak[][] = model.rotors.map((rotor, r) => {
    const best: SpringPeak[] = imp.springs.map(() => ({ force: 0, speedRpm: rotor.speedRpm, soilCase: cases[0] as SoilCase }));
    for (const sc of cases) {
      for (const rpm of speedGridRpm(rotor.rangeRpm, rotor.speedRpm, modesHz)) {
        const omega = rpmToRadPerSec(rpm);
        const forces = verticalSpringForces(model, sc, r, omega, forceAt(rotor.forceAtRated, rotor.omegaRated, omega));
        for (const perLoad of forces) {
          perLoad.forEach((fz, i) => {
            const b = best[i] as SpringPeak;
            if (fz > b.force) best[i] = { force: fz, speedRpm: rpm, soilCase: sc };
          });
        }
      }
    }
    return best;
  });
  const where = (sc: SoilCase) => (sc.factor === 1 ? "nominal stiffness" : `stiffness x ${Number(sc.factor.toPrecision(3))}`);
  const ratio = (staticLoad: number, dynamic: number) => (dynamic > 0 ? staticLoad / dynamic : Number.MAX_VALUE);
  const checks: CheckResult[] = [];
  model.rotors.forEach((rotor, r) => {
    imp.springs.forEach((_, i) => {
      const p = (peaks[r] as SpringPeak[])[i] as SpringPeak;
      const staticLoad = staticLoads[i] as number;
      const value = ratio(staticLoad, p.force);
      checks.push({
        id: "spring-compression",
        key: `spring-compression/${rotor.machine}/${rotor.rotor}/spring-${i + 1}`,
        label: `Spring ${i + 1} stays in compression (no lift-off) under ${rotor.machine} ${rotor.rotor}: static load over the largest dynamic vertical force (at ${Number(p.speedRpm.toPrecision(6))} rpm, ${where(p.soilCase)})`,
        value,
        limit: 1,
        comparison: "min",
        unit: "-",
        source: SPRING_COMPRESSION_SOURCE,
        machine: rotor.machine,
        rotor: rotor.rotor,
        pass: value >= 1,
      });
    });
  });
  if (model.rotors.length >= 2) {
    imp.springs.forEach((_, i) => {
      const dynamic = peaks.reduce((sum, best) => sum + (best[i] as SpringPeak).force, 0);
      const value = ratio(staticLoads[i] as number, dynamic);
      checks.push({
        id: "spring-compression-combined",
        key: `spring-compression-combined/spring-${i + 1}`,
        label: `Spring ${i + 1} stays in compression (no lift-off) under every rotor together: static load over the sum of each rotor's largest dynamic vertical force`,
        value,
        limit: 1,
        comparison: "min",
        unit: "-",
        source: `${SPRING_COMPRESSION_SOURCE}; rotors together by the absolute sum of their peaks (upper bound)`,
        pass: value >= 1,
      });
    });
  }
  return checks;
}

export const GROUND_TRANSMISSIBILITY_SOURCE =
  "harmonic steady state of the twelve-DOF model (inertia block on springs on the base block on the soil): TR = |force into the soil under the base| / unbalance force amplitude, the largest over the rotor's single-direction static-unbalance load cases";

function motionScratch() {
  return {
    base: { re: new Float64Array(6), im: new Float64Array(6) },
    rel: { re: new Float64Array(6), im: new Float64Array(6) },
  };
}

/** The springs' own diagonal stiffness and dashpot at O (on a base block: the springs alone, not the condensed support). */
function springsOwn(sc: SoilCase): { k: ArrayLike<number>; c: ArrayLike<number> } {
  const parts = sc.impedance.twoStage;
  if (!parts) return { k: sc.stiffnessUsed, c: sc.dashpotUsed };
  const k = new Float64Array(6);
  const c = new Float64Array(6);
  parts.springs.evaluate(0, k, c);
  return { k, c };
}

/** Load cases of one direction (not "rotating") with static unbalance: the ones whose force amplitude is the rotor's. */
function singleDirectionLoads(rotor: Model["rotors"][number]): number[] {
  return rotor.loads.flatMap((load, l) => (load.case !== "rotating" && load.unbalanceMode === "static" ? [l] : []));
}

/** On a base block: |force into the soil| / |unbalance force| at omega, the largest over the single-direction static loads. */
function groundTransmissibility(rotor: Model["rotors"][number], solver: HarmonicSolver, omega: number): number {
  const u = responseSet(rotor.loads.length);
  solver.setFrequency(omega);
  solver.solveAll(rotor.loads, u);
  let worst = 0;
  for (const l of singleDirectionLoads(rotor)) worst = Math.max(worst, solver.transmittedForce(u, l, 1, null));
  return worst;
}

/** Largest displacement amplitude per axis over the eight corners of the base (the maximum over a rigid box lies at a corner). */
function cornerPeaks(model: Model, q: { re: Float64Array; im: Float64Array }, scale: number): [number, number, number] {
  const box = model.baseBlock?.box;
  const out: [number, number, number] = [0, 0, 0];
  if (!box) return out;
  for (const px of box.x) for (const py of box.y) for (const pz of box.z) {
    const p = [px, py, pz] as const;
    // u_p = U + Theta x p
    const comp = (a: 0 | 1 | 2, part: Float64Array) => {
      const t = [part[3] as number, part[4] as number, part[5] as number];
      const cross = [t[1]! * p[2] - t[2]! * p[1], t[2]! * p[0] - t[0]! * p[2], t[0]! * p[1] - t[1]! * p[0]];
      return (part[a] as number) + (cross[a] as number);
    };
    for (const a of [0, 1, 2] as const) out[a] = Math.max(out[a], Math.hypot(comp(a, q.re), comp(a, q.im)) * scale);
  }
  return out;
}

/** The base block's result: static pressure, soil springs, two-mass and rigid-floor frequencies, ground forces and base motion. */
function baseResult(model: Model, nominal: SoilCase, parts: TwoStageParts): SpringBaseResult {
  const bb = parts.base;
  const input = model.input;
  const imp = input.impedance;
  const support = imp.method === "springs" && imp.base?.support ? imp.base.support.method : "gazetas";
  const omega1 = model.rotors[0]?.omegaRated ?? 0;
  const K = new Float64Array(36);
  const C = new Float64Array(36);
  const kb = new Float64Array(6);
  const cb = new Float64Array(6);
  evaluateImpedanceMatrix(parts.soil, omega1, K, C, kb, cb, true);
  const own = springsOwn(nominal);
  const twoMass = twoMassFrequenciesHz(model.massProperties.totalMass, own.k[2] as number, bb.mass, kb[2] as number);
  const rigidFloorHighestHz = Math.max(...naturalModes(model.massMatrix, own.k).map((m) => m.frequencyHz));
  const upperModes = nominal.modes.filter((m) => m.block === "upper");
  const isolatorModesHighestHz = upperModes.length ? Math.max(...upperModes.map((m) => m.frequencyHz)) : 0;
  const solver = nominal.solver;
  const w = motionScratch();
  const rotors = model.rotors.map((rotor) => {
    const u: ResponseSet = responseSet(rotor.loads.length);
    solver.setFrequency(rotor.omegaRated);
    solver.solveAll(rotor.loads, u);
    const tf = new Float64Array(3);
    return {
      machine: rotor.machine,
      rotor: rotor.rotor,
      cases: rotor.loads.map((load, l) => {
        solver.transmittedForce(u, l, rotor.forceAtRated, tf);
        baseAndRelativeMotion(solver, bb.transfer, u, l, w.base, w.rel);
        return {
          case: load.case,
          unbalanceMode: load.unbalanceMode,
          speedRpm: rotor.speedRpm,
          groundForce: [tf[0] as number, tf[1] as number, tf[2] as number] as [number, number, number],
          baseDisplacementPeak: cornerPeaks(model, w.base, rotor.forceAtRated),
        };
      }),
    };
  });
  return {
    position: [bb.position[0], bb.position[1], bb.position[2]],
    dimensions: [bb.box.x[1] - bb.box.x[0], bb.box.y[1] - bb.box.y[0], bb.thickness],
    mass: bb.mass,
    springHeight: bb.springHeight,
    area: bb.area.area,
    staticBearingPressure: baseBearingPressure(model),
    supportMethod: support,
    soilStaticStiffness: dofFromArray(parts.soil.staticStiffness),
    soilStiffness: dofFromArray(kb),
    soilDashpot: dofFromArray(cb),
    soilMaterialDamping: parts.beta,
    evaluatedAtHz: omega1 / (2 * Math.PI),
    soilDetails: parts.soil.details,
    twoMassVerticalHz: twoMass,
    rigidFloorHighestHz,
    isolatorModesHighestHz,
    rotors,
  };
}

/** (upper block, machines and base) g / footprint of the base (Pa); 0 without a base. */
export function baseBearingPressure(model: Model): number {
  const bb = model.baseBlock;
  if (!bb) return 0;
  return ((model.massProperties.totalMass + bb.mass) * STANDARD_GRAVITY) / bb.area.area;
}
