// Rotors responding together (issue 18 item 7). The single-rotor results of rotor-response.ts
// stay as they are; this adds their combinations:
//  - rotors at the same speed (same speedRpm and the same speed range: a motor and the pump it
//    drives) are superposed at every point. The relative phase of two unbalances is unknown, so
//    the bound is taken per point and axis: max over the phases of |sum_r e^{i phi_r} a_r| is
//    sum_r |a_r| for one complex component a_r of each rotor (reached with every phasor aligned),
//    i.e. the worst relative phase of each point and axis on its own. The in-phase case (every
//    rotor's force phasor with the same phase: one physically consistent response) is |sum_r a_r|.
//  - groups at different speeds respond at different frequencies, whose peaks coincide at some
//    instant whatever the phases: the combination is the absolute sum of the groups' peak
//    amplitudes (an upper bound; common practice for multi-frequency excitation; the square root
//    of the sum of squares would be smaller, so the sum is the safe side).
import { forceAt, responseSet, type HarmonicSolver, type ResponseSet } from "./harmonic";
import type { Model, ResponsePoint, RotorModel } from "./model";
import type { CombinedCaseResult, CombinedPointResult, CombinedResult, LoadCaseName, UnbalanceModeName } from "./result-types";
import { speedGridRpm } from "./sweep-grid";
import { rpmToRadPerSec } from "./unbalance";
import type { Vec3 } from "./vec3";

export const SAME_SPEED_RULE_TEXT =
  "Same speed: responses superposed per point and axis; worst relative unbalance phase per point and axis (sum of the amplitudes |U1| + |U2| + ...), and the in-phase case (all forces in phase) reported beside it";
export const DIFFERENT_SPEEDS_RULE_TEXT =
  "Different speeds: absolute sum of the speed groups' peak amplitudes per point and axis (upper bound; common practice for multi-frequency excitation, the safe side of the square root of the sum of squares)";

const CASE_ORDER: LoadCaseName[] = ["vertical", "horizontal", "horizontal-x", "horizontal-y", "rotating"];

export interface CaseKey {
  case: LoadCaseName;
  unbalanceMode: UnbalanceModeName;
}

/** The combined load cases of some rotors: every (case, unbalance mode) any of them has, static before couple, cases in a fixed order. */
export function combinedCaseKeys(rotors: RotorModel[]): CaseKey[] {
  const keys: CaseKey[] = [];
  for (const mode of ["static", "couple"] as const) {
    for (const c of CASE_ORDER) {
      if (rotors.some((r) => r.loads.some((l) => l.case === c && l.unbalanceMode === mode))) keys.push({ case: c, unbalanceMode: mode });
    }
  }
  return keys;
}

/**
 * The load of a rotor that takes part in a combined case: the same case and unbalance mode; else
 * the same case in the rotor's own mode (a rotor with one mode has it in every combined case);
 * else (a vertical shaft has no `vertical` case, a horizontal one no `horizontal-x`) the rotor's
 * rotating case in that mode, or in its own: the rotor's real, rotating force.
 */
export function loadIndexFor(rotor: RotorModel, key: CaseKey): number {
  const find = (p: (l: RotorModel["loads"][number]) => boolean) => rotor.loads.findIndex(p);
  for (const i of [
    find((l) => l.case === key.case && l.unbalanceMode === key.unbalanceMode),
    find((l) => l.case === key.case),
    find((l) => l.case === "rotating" && l.unbalanceMode === key.unbalanceMode),
    find((l) => l.case === "rotating"),
  ]) {
    if (i >= 0) return i;
  }
  throw new Error("internal error: a rotor without a rotating load case");
}

/** Per case key and point: worst-phase and in-phase displacement per axis at one speed. */
interface SpeedSnapshot {
  worst: Float64Array; // [key][point][axis]
  inPhase: Float64Array;
}

/**
 * Worst-phase (sum of moduli) and in-phase (modulus of the sum) amplitudes per key, point and
 * axis at one speed. `loadIdx[k][r]` is rotor r's load in key k; `coords` the points relative to O.
 */
function snapshot(rotors: RotorModel[], loadIdx: number[][], coords: Float64Array, solver: HarmonicSolver, omega: number, sets: ResponseSet[], out: SpeedSnapshot): void {
  solver.setFrequency(omega);
  rotors.forEach((r, i) => solver.solveAll(r.loads, sets[i] as ResponseSet));
  const np = coords.length / 3;
  const { worst, inPhase } = out;
  worst.fill(0);
  const scales = rotors.map((r) => forceAt(r.forceAtRated, r.omegaRated, omega));
  for (let k = 0; k < loadIdx.length; k++) {
    const li = loadIdx[k] as number[];
    for (let i = 0; i < np; i++) {
      const px = coords[3 * i] as number;
      const py = coords[3 * i + 1] as number;
      const pz = coords[3 * i + 2] as number;
      const at = 3 * (k * np + i);
      let sxr = 0, sxi = 0, syr = 0, syi = 0, szr = 0, szi = 0;
      let wx = 0, wy = 0, wz = 0;
      for (let ri = 0; ri < rotors.length; ri++) {
        const u = sets[ri] as ResponseSet;
        const o = 6 * (li[ri] as number);
        const f = scales[ri] as number;
        const r = u.re;
        const m = u.im;
        // u_p = U_t + Theta x p, scaled by the rotor's force amplitude at this speed
        const xr = ((r[o] as number) + (r[o + 4] as number) * pz - (r[o + 5] as number) * py) * f;
        const xi = ((m[o] as number) + (m[o + 4] as number) * pz - (m[o + 5] as number) * py) * f;
        const yr = ((r[o + 1] as number) + (r[o + 5] as number) * px - (r[o + 3] as number) * pz) * f;
        const yi = ((m[o + 1] as number) + (m[o + 5] as number) * px - (m[o + 3] as number) * pz) * f;
        const zr = ((r[o + 2] as number) + (r[o + 3] as number) * py - (r[o + 4] as number) * px) * f;
        const zi = ((m[o + 2] as number) + (m[o + 3] as number) * py - (m[o + 4] as number) * px) * f;
        wx += Math.sqrt(xr * xr + xi * xi);
        wy += Math.sqrt(yr * yr + yi * yi);
        wz += Math.sqrt(zr * zr + zi * zi);
        sxr += xr;
        sxi += xi;
        syr += yr;
        syi += yi;
        szr += zr;
        szi += zi;
      }
      worst[at] = wx;
      worst[at + 1] = wy;
      worst[at + 2] = wz;
      inPhase[at] = Math.sqrt(sxr * sxr + sxi * sxi);
      inPhase[at + 1] = Math.sqrt(syr * syr + syi * syi);
      inPhase[at + 2] = Math.sqrt(szr * szr + szi * szi);
    }
  }
}

const vec = (a: Float64Array, at: number, s = 1): Vec3 => [(a[at] as number) * s, (a[at + 1] as number) * s, (a[at + 2] as number) * s];
const maxOf = (a: Float64Array, at: number) => Math.max(a[at] as number, a[at + 1] as number, a[at + 2] as number);

/** Points of some rotors: each rotor's bearings (in the order of the rotors), then every check point. */
export function combinedPoints(model: Model, rotors: RotorModel[]): ResponsePoint[] {
  const bearings = rotors.flatMap((r) => r.points.slice(0, r.input.bearings.length));
  const checkPoints = (model.rotors[0]?.points ?? []).slice(model.rotors[0]?.input.bearings.length ?? 0);
  return [...bearings, ...checkPoints];
}

/** Same-speed combination of rotors that share speedRpm and speed range, at the given points. */
export function sameSpeedCombination(
  rotors: RotorModel[],
  points: ResponsePoint[],
  solver: HarmonicSolver,
  modesHz: number[],
  keys: CaseKey[] = combinedCaseKeys(rotors),
): CombinedCaseResult[] {
  const first = rotors[0];
  if (!first) return [];
  const sets = rotors.map((r) => responseSet(r.loads.length));
  const omega = first.omegaRated;
  const np = points.length;
  const loadIdx = keys.map((key) => rotors.map((r) => loadIndexFor(r, key)));
  const coords = Float64Array.from(points.flatMap((p) => p.local));
  const fresh = (): SpeedSnapshot => ({ worst: new Float64Array(keys.length * np * 3), inPhase: new Float64Array(keys.length * np * 3) });
  const rated = fresh();
  snapshot(rotors, loadIdx, coords, solver, omega, sets, rated);
  const s = fresh();
  const env = { dW: new Float64Array(keys.length * np), vW: new Float64Array(keys.length * np), dP: new Float64Array(keys.length * np), vP: new Float64Array(keys.length * np) };
  for (const rpm of speedGridRpm(first.rangeRpm, first.speedRpm, modesHz)) {
    const w = rpmToRadPerSec(rpm);
    snapshot(rotors, loadIdx, coords, solver, w, sets, s);
    for (let j = 0; j < keys.length * np; j++) {
      const dw = maxOf(s.worst, 3 * j);
      const dp = maxOf(s.inPhase, 3 * j);
      if (dw > (env.dW[j] as number)) env.dW[j] = dw;
      if (dw * w > (env.vW[j] as number)) env.vW[j] = dw * w;
      if (dp > (env.dP[j] as number)) env.dP[j] = dp;
      if (dp * w > (env.vP[j] as number)) env.vP[j] = dp * w;
    }
  }
  return keys.map((key, k) => ({
    case: key.case,
    unbalanceMode: key.unbalanceMode,
    points: points.map((p, i): CombinedPointResult => {
      const j = k * np + i;
      return {
        name: p.name,
        position: p.position,
        displacementPeak: vec(rated.worst, 3 * j),
        velocityPeak: vec(rated.worst, 3 * j, omega),
        overSpeedRange: { displacementPeak: env.dW[j] as number, velocityPeak: env.vW[j] as number },
        inPhase: {
          displacementPeak: vec(rated.inPhase, 3 * j),
          velocityPeak: vec(rated.inPhase, 3 * j, omega),
          overSpeedRange: { displacementPeak: env.dP[j] as number, velocityPeak: env.vP[j] as number },
        },
      };
    }),
  }));
}

/**
 * Different speeds: the absolute sum of the groups' results per case key, point and axis (the
 * worst-phase values, and the in-phase values likewise); over the speed ranges the sum of each
 * group's largest component over its own range (each group may peak at any speed of its range).
 */
export function sumOfGroups(keys: CaseKey[], points: ResponsePoint[], groups: CombinedCaseResult[][]): CombinedCaseResult[] {
  const add = (a: Vec3, b: Vec3): Vec3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
  return keys.map((key) => {
    const parts = groups.map((g) => g.find((c) => c.case === key.case && c.unbalanceMode === key.unbalanceMode));
    return {
      case: key.case,
      unbalanceMode: key.unbalanceMode,
      points: points.map((p, i): CombinedPointResult => {
        const acc: CombinedPointResult = {
          name: p.name,
          position: p.position,
          displacementPeak: [0, 0, 0],
          velocityPeak: [0, 0, 0],
          overSpeedRange: { displacementPeak: 0, velocityPeak: 0 },
          inPhase: { displacementPeak: [0, 0, 0], velocityPeak: [0, 0, 0], overSpeedRange: { displacementPeak: 0, velocityPeak: 0 } },
        };
        for (const part of parts) {
          const q = part?.points[i];
          if (!q) throw new Error("internal error: a speed group without the combined case");
          acc.displacementPeak = add(acc.displacementPeak, q.displacementPeak);
          acc.velocityPeak = add(acc.velocityPeak, q.velocityPeak);
          acc.overSpeedRange.displacementPeak += q.overSpeedRange.displacementPeak;
          acc.overSpeedRange.velocityPeak += q.overSpeedRange.velocityPeak;
          acc.inPhase.displacementPeak = add(acc.inPhase.displacementPeak, q.inPhase.displacementPeak);
          acc.inPhase.velocityPeak = add(acc.inPhase.velocityPeak, q.inPhase.velocityPeak);
          acc.inPhase.overSpeedRange.displacementPeak += q.inPhase.overSpeedRange.displacementPeak;
          acc.inPhase.overSpeedRange.velocityPeak += q.inPhase.overSpeedRange.velocityPeak;
        }
        return acc;
      }),
    };
  });
}

/** Rotors grouped by equal speedRpm and equal speed range, in the order of first appearance. */
export function speedGroups(rotors: RotorModel[]): RotorModel[][] {
  const groups = new Map<string, RotorModel[]>();
  for (const r of rotors) {
    const key = `${r.speedRpm}|${r.rangeRpm[0]}|${r.rangeRpm[1]}`;
    const g = groups.get(key);
    if (g) g.push(r);
    else groups.set(key, [r]);
  }
  return [...groups.values()];
}

const groupName = (rotors: RotorModel[]) => rotors.map((r) => `${r.machine} ${r.rotor}`);
const rotorIds = (rotors: RotorModel[]) => rotors.map((r) => ({ machine: r.machine, rotor: r.rotor }));

/**
 * The combinations of an input with two or more rotors: one entry per speed group of two or more
 * rotors (id `rpm-<speed>-<from>-<to>`), then, when there are two or more speed groups, one entry
 * for all rotors (id `all-speeds`). Without two rotors there is nothing to combine (empty list).
 */
export function combinedResults(model: Model, solver: HarmonicSolver, modesHz: number[]): CombinedResult[] {
  if (model.rotors.length < 2) return [];
  const groups = speedGroups(model.rotors);
  const out: CombinedResult[] = [];
  const allPoints = combinedPoints(model, model.rotors);
  const allKeys = combinedCaseKeys(model.rotors);
  // Each group is solved once at every point of the input (all bearings, then the check points);
  // a group's own entry takes its keys and its rotors' bearings plus the check points.
  const several = groups.length >= 2;
  const perGroup = groups.map((g) => (g.length >= 2 || several ? sameSpeedCombination(g, allPoints, solver, modesHz, allKeys) : []));
  const bearingStart = new Map<RotorModel, number>();
  let at = 0;
  for (const r of model.rotors) {
    bearingStart.set(r, at);
    at += r.input.bearings.length;
  }
  const checkIdx = allPoints.map((_, i) => i).slice(at);
  groups.forEach((g, gi) => {
    if (g.length < 2) return;
    const first = g[0] as RotorModel;
    const idx = [...g.flatMap((r) => Array.from({ length: r.input.bearings.length }, (_, j) => (bearingStart.get(r) as number) + j)), ...checkIdx];
    const own = combinedCaseKeys(g);
    const cases = (perGroup[gi] as CombinedCaseResult[])
      .filter((c) => own.some((k) => k.case === c.case && k.unbalanceMode === c.unbalanceMode))
      .map((c) => ({ ...c, points: idx.map((i) => c.points[i] as CombinedPointResult) }));
    out.push({
      id: `rpm-${first.speedRpm}-${first.rangeRpm[0]}-${first.rangeRpm[1]}`,
      group: groupName(g),
      rotors: rotorIds(g),
      speedRpm: first.speedRpm,
      speedRangeRpm: first.rangeRpm,
      rule: "same-speed",
      ruleText: SAME_SPEED_RULE_TEXT,
      cases,
    });
  });
  if (several) {
    out.push({
      id: "all-speeds",
      group: groupName(model.rotors),
      rotors: rotorIds(model.rotors),
      rule: "different-speeds-sum",
      ruleText: DIFFERENT_SPEEDS_RULE_TEXT,
      cases: sumOfGroups(allKeys, allPoints, perGroup),
    });
  }
  return out;
}
