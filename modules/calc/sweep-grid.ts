// Frequencies of the plotting sweep and of the operating-speed grids.
import type { AnalysisInput } from "./schema";
import { SPEED_RANGE_GRID_POINTS, SWEEP_DEFAULTS } from "./criteria-defaults";

export interface SweepSettings {
  fromHz: number;
  toHz: number;
  points: number;
}

/** Operating range of a rotor in rpm; defaults to [speedRpm, speedRpm] (contract). */
export function speedRangeRpm(rotor: { speedRpm: number; speedRangeRpm?: [number, number] | undefined }): [number, number] {
  return rotor.speedRangeRpm ?? [rotor.speedRpm, rotor.speedRpm];
}

/**
 * Sweep settings with the product defaults: 0.5 to 60 Hz in 600 points, the upper end raised to
 * 1.25 x the highest operating speed when that is above 60 Hz.
 */
export function resolveSweep(input: Pick<AnalysisInput, "sweep" | "machines">): SweepSettings {
  const topHz = Math.max(
    0,
    ...input.machines.flatMap((m) => m.rotors.map((r) => speedRangeRpm(r)[1] / 60)),
  );
  return {
    fromHz: input.sweep?.fromHz ?? SWEEP_DEFAULTS.fromHz,
    toHz: input.sweep?.toHz ?? Math.max(SWEEP_DEFAULTS.toHz, SWEEP_DEFAULTS.speedMargin * topHz),
    points: input.sweep?.points ?? SWEEP_DEFAULTS.points,
  };
}

/** Evenly spaced values from a to b inclusive. */
export function linspace(a: number, b: number, n: number): number[] {
  if (n <= 1 || a === b) return [a];
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = a + ((b - a) * i) / (n - 1);
  return out;
}

/**
 * Speeds (rpm) at which an operating range is enveloped: an even grid of 101 speeds, the rated
 * speed, and every natural frequency that falls inside the range, ascending and unique.
 */
export function speedGridRpm(range: [number, number], ratedRpm: number, naturalHz: number[]): number[] {
  const [a, b] = range;
  const speeds = linspace(a, b, SPEED_RANGE_GRID_POINTS);
  speeds.push(ratedRpm);
  for (const f of naturalHz) {
    const rpm = f * 60;
    if (rpm > a && rpm < b) speeds.push(rpm);
  }
  return [...new Set(speeds)].sort((x, y) => x - y);
}
