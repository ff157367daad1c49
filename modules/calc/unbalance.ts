// Rotating unbalance of a rotor and its load vectors at O.
// ISO 1940-1 (ISO 21940-11): balance grade G = e w (mm/s), so e = G / 1000 / w_rated (m) and
// F(w) = serviceFactor * m_rotor * e * w^2; or a vendor force at rated speed scaled by
// (w / w_rated)^2. Phasors follow u(t) = Re(U e^{i w t}).
import type { LoadCaseName, UnbalanceModeName } from "./result-types";
import type { RotorInput } from "./schema";
import { cross3, type Vec3 } from "./vec3";

export type ShaftAxis = "x" | "y" | "z";

/** The load cases of a rotor: a horizontal shaft's force has a vertical and a horizontal part; a vertical shaft's lies in the plan. */
export function loadCasesFor(axis: ShaftAxis): LoadCaseName[] {
  return axis === "z" ? ["horizontal-x", "horizontal-y", "rotating"] : ["vertical", "horizontal", "rotating"];
}

/** The load cases of horizontal shafts (the contract's three). */
export const LOAD_CASES: LoadCaseName[] = loadCasesFor("x");

export const rpmToRadPerSec = (rpm: number) => (rpm * 2 * Math.PI) / 60;

/** Total unbalance force amplitude at the rated speed, service factor included (N). */
export function forceAtRatedSpeed(rotor: RotorInput): number {
  const omega = rpmToRadPerSec(rotor.speedRpm);
  const base =
    rotor.unbalanceForce ??
    // F = m e w^2 with e = G / w: F = m (G / 1000) w (ISO 1940-1)
    rotor.mass * ((rotor.balanceGrade ?? 0) / 1000) * omega;
  return rotor.serviceFactor * base;
}

/**
 * Unit force phasor (real and imaginary parts) of a load case. Vertical: z. Horizontal: the
 * horizontal axis normal to the shaft. Rotating: both, 90 degrees apart, turning by the
 * right-hand rule about the positive shaft axis: shaft x, F = [0, cos wt, sin wt] -> [0, 1, -i];
 * shaft y, F = [sin wt, 0, cos wt] -> [-i, 0, 1]; vertical shaft z, F = [cos wt, sin wt, 0] -> [1, -i, 0].
 */
export function forceDirection(axis: ShaftAxis, loadCase: LoadCaseName): { re: Vec3; im: Vec3 } {
  if (axis === "z") {
    if (loadCase === "horizontal-x") return { re: [1, 0, 0], im: [0, 0, 0] };
    if (loadCase === "horizontal-y") return { re: [0, 1, 0], im: [0, 0, 0] };
    if (loadCase === "rotating") return { re: [1, 0, 0], im: [0, -1, 0] };
    throw new Error(`internal error: a vertical shaft has no ${loadCase} load case`);
  }
  if (loadCase === "horizontal-x" || loadCase === "horizontal-y") throw new Error(`internal error: a horizontal shaft has no ${loadCase} load case`);
  if (loadCase === "vertical") return { re: [0, 0, 1], im: [0, 0, 0] };
  if (loadCase === "horizontal") return { re: axis === "x" ? [0, 1, 0] : [1, 0, 0], im: [0, 0, 0] };
  return axis === "x" ? { re: [0, 1, 0], im: [0, 0, -1] } : { re: [0, 0, 1], im: [-1, 0, 0] };
}

export interface UnitLoad {
  case: LoadCaseName;
  unbalanceMode: UnbalanceModeName;
  /** Generalised force at O for a total force amplitude of 1 N: [Fx, Fy, Fz, Mx, My, Mz]. */
  re: Float64Array;
  im: Float64Array;
  /**
   * Rotating case: the same load as U = U[a] - i U[b] of two real loads of this list (the two
   * directions 90 degrees apart), so the solver needs no factor solve for it.
   */
  combine?: { a: number; b: number };
  /** True when im is all zero (vertical and horizontal cases). */
  realOnly: boolean;
}

/** Weights of the bearings: static, 1/n each in phase; couple, +1/2 and -1/2 at the two end bearings. */
export function bearingWeights(bearings: Vec3[], axis: ShaftAxis, mode: UnbalanceModeName): number[] {
  if (mode === "static") return bearings.map(() => 1 / bearings.length);
  const k = axis === "x" ? 0 : axis === "y" ? 1 : 2;
  let lo = 0;
  let hi = 0;
  bearings.forEach((b, i) => {
    if (b[k] < (bearings[lo] as Vec3)[k]) lo = i;
    if (b[k] > (bearings[hi] as Vec3)[k]) hi = i;
  });
  return bearings.map((_, i) => (i === lo ? 0.5 : i === hi ? -0.5 : 0));
}

/** A force f at position p (relative to O) adds f and the moment p x f at O. */
export function unitLoads(rotor: RotorInput, bearings: Vec3[]): UnitLoad[] {
  const modes: UnbalanceModeName[] = rotor.unbalanceMode === "both" ? ["static", "couple"] : [rotor.unbalanceMode];
  const loads: UnitLoad[] = [];
  for (const mode of modes) {
    const weights = bearingWeights(bearings, rotor.axis, mode);
    for (const loadCase of loadCasesFor(rotor.axis)) {
      const dir = forceDirection(rotor.axis, loadCase);
      const re = new Float64Array(6);
      const im = new Float64Array(6);
      bearings.forEach((p, i) => {
        const w = weights[i] as number;
        if (w === 0) return;
        const fr: Vec3 = [dir.re[0] * w, dir.re[1] * w, dir.re[2] * w];
        const fi: Vec3 = [dir.im[0] * w, dir.im[1] * w, dir.im[2] * w];
        const mr = cross3(p, fr);
        const mi = cross3(p, fi);
        for (let j = 0; j < 3; j++) {
          re[j] = (re[j] as number) + (fr[j] as number);
          im[j] = (im[j] as number) + (fi[j] as number);
          re[3 + j] = (re[3 + j] as number) + (mr[j] as number);
          im[3 + j] = (im[3 + j] as number) + (mi[j] as number);
        }
      });
      const load: UnitLoad = { case: loadCase, unbalanceMode: mode, re, im, realOnly: im.every((v) => v === 0) };
      if (loadCase === "rotating") {
        // shaft x: [0, 1, -i] = horizontal - i vertical; shaft y: [-i, 0, 1] = vertical - i horizontal;
        // shaft z: [1, -i, 0] = horizontal-x - i horizontal-y (the two cases before this one, in order)
        const first = loads.length - 2;
        const second = loads.length - 1;
        load.combine = rotor.axis === "x" ? { a: second, b: first } : { a: first, b: second };
      }
      loads.push(load);
    }
  }
  return loads;
}
