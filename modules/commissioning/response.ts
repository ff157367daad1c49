// The revision's model answering for a measurement: the steady-state amplitude at a named
// point, in one direction, at a given speed, for a soil stiffness factor on G. Everything is
// the engine's own (modules/calc: buildModel, runSoilCase, the harmonic solver and its force
// rule F (w / w_r)^2), so a prediction here is the one the design made, at the speed measured.
import { buildModel, type Model, type RotorModel } from "@/modules/calc/model";
import { forceAt, responseSet } from "@/modules/calc/harmonic";
import { runSoilCase, type SoilCase } from "@/modules/calc/soil-case";
import type { AnalysisInput } from "@/modules/calc/schema";
import { rpmToRadPerSec, type ShaftAxis } from "@/modules/calc/unbalance";
import type { Vec3 } from "@/modules/calc/vec3";
import type { Direction } from "./types";

export type AxisIndex = 0 | 1 | 2;

/** A point of the model a reading names: a rotor's bearing or a check point. */
export interface ModelPoint {
  name: string;
  /** Relative to O (the model's origin). */
  local: Vec3;
  /** The rotor it belongs to (the first one holding it, for a shared check point). */
  rotor: number;
  shaftAxis: ShaftAxis;
}

export function buildResponseModel(input: AnalysisInput): Model {
  return buildModel(input);
}

const norm = (s: string) => s.trim().replace(/\s+/g, " ").toLowerCase();

/** The model's points by name (case and spacing ignored). */
export function modelPoints(model: Model): ModelPoint[] {
  const out: ModelPoint[] = [];
  const seen = new Set<string>();
  model.rotors.forEach((r, i) => {
    for (const p of r.points) {
      const key = norm(p.name);
      if (seen.has(key)) continue;
      seen.add(key);
      out.push({ name: p.name, local: p.local, rotor: i, shaftAxis: r.input.axis });
    }
  });
  return out;
}

export function findPoint(points: ModelPoint[], name: string): ModelPoint | undefined {
  const key = norm(name);
  return points.find((p) => norm(p.name) === key);
}

/**
 * The block axis of a direction at a shaft: vertical is z; for a horizontal shaft along x (y),
 * axial is x (y) and horizontal the other plan axis. A vertical shaft has no single horizontal
 * direction (null: the file must say x or y).
 */
export function axisOf(direction: Direction, shaft: ShaftAxis): AxisIndex | null {
  if (direction === "x") return 0;
  if (direction === "y") return 1;
  if (direction === "z") return 2;
  if (shaft === "z") return direction === "axial" || direction === "vertical" ? 2 : null;
  if (direction === "vertical") return 2;
  const along: AxisIndex = shaft === "x" ? 0 : 1;
  return direction === "axial" ? along : along === 0 ? 1 : 0;
}

export const AXIS_NAMES = ["x", "y", "z"] as const;

/** Amplitudes (peak) of one point and direction: displacement (m) and velocity (m/s). */
export interface PointAmplitude {
  displacementPeak: number;
  velocityPeak: number;
}

/**
 * One soil case of the model (G times `factor`, the engine's own soil-band path) and the
 * steady-state response it gives at any point and speed.
 */
export class SoilResponse {
  readonly case: SoilCase;
  private readonly u;
  private readonly amp = new Float64Array(3);

  constructor(
    readonly model: Model,
    readonly factor: number,
  ) {
    this.case = runSoilCase(model, factor);
    this.u = responseSet(Math.max(1, ...model.rotors.map((r) => r.loads.length)));
  }

  get naturalHz(): number[] {
    return this.case.modes.map((m) => m.frequencyHz);
  }

  /** Largest amplitude over the rotor's load cases (vertical, horizontal, rotating; static and couple) at a point. */
  private rotorAt(rotor: RotorModel, omega: number, local: Vec3, axis: AxisIndex): number {
    const solver = this.case.solver;
    solver.setFrequency(omega);
    solver.solveAll(rotor.loads, this.u);
    const coords = Float64Array.from(local);
    const scale = forceAt(rotor.forceAtRated, rotor.omegaRated, omega);
    let worst = 0;
    for (let l = 0; l < rotor.loads.length; l++) {
      solver.pointAmplitudes(this.u, l, coords, scale, this.amp, true);
      worst = Math.max(worst, this.amp[axis] as number);
    }
    return worst;
  }

  /**
   * The predicted amplitude at `point` in `axis` with the point's rotor (and every rotor of the
   * same rated speed, coupled on one train) at `rpm`, each at its worst load case, plus the other
   * rotors at their rated speed; the rotors' amplitudes are added (worst relative phase, the
   * engine's same-speed combination rule): an upper estimate of what a single overall reading holds.
   */
  at(point: ModelPoint, axis: AxisIndex, rpm: number): PointAmplitude {
    const own = this.model.rotors[point.rotor];
    let d = 0;
    let v = 0;
    for (const r of this.model.rotors) {
      const sameTrain = own !== undefined && Math.abs(r.speedRpm - own.speedRpm) < 1e-9;
      const omega = sameTrain ? rpmToRadPerSec(rpm) : r.omegaRated;
      const x = this.rotorAt(r, omega, point.local, axis);
      d += x;
      v += x * omega;
    }
    return { displacementPeak: d, velocityPeak: v };
  }
}

/**
 * The share of a mode's motion at a point that is along `axis` (0 to 1): |u_axis| / |u| with
 * u_p = U_t + Theta x p from the mode shape about O.
 */
export function axisShare(shape: number[], local: Vec3, axis: AxisIndex): number {
  const [ux, uy, uz, tx, ty, tz] = [0, 1, 2, 3, 4, 5].map((i) => shape[i] ?? 0) as [number, number, number, number, number, number];
  const [px, py, pz] = local;
  const u = [ux + ty * pz - tz * py, uy + tz * px - tx * pz, uz + tx * py - ty * px];
  const total = Math.hypot(u[0] as number, u[1] as number, u[2] as number);
  return total === 0 ? 0 : Math.abs(u[axis] as number) / total;
}

/** A mode "moves the point in the direction" when at least 30 % of its motion there is along it: a judgement of this desk, not a standard's figure. */
export const AXIS_SHARE_MIN = 0.3;

/** The lowest natural frequency whose mode moves the point in `axis`, for the ISO support class; null when none does. */
export function lowestModeInAxis(modes: { frequencyHz: number; shape: number[] }[], local: Vec3, axis: AxisIndex): number | null {
  let lowest: number | null = null;
  for (const m of modes) if (axisShare(m.shape, local, axis) >= AXIS_SHARE_MIN && (lowest === null || m.frequencyHz < lowest)) lowest = m.frequencyHz;
  return lowest;
}

/** The points a measurement file may name for this input, with their shaft (the readers' check). */
export function knownPointsOf(input: AnalysisInput): { name: string; shaftAxis: ShaftAxis }[] {
  return modelPoints(buildModel(input)).map((p) => ({ name: p.name, shaftAxis: p.shaftAxis }));
}
