// The sweep series of an answer, at full resolution or thinned for a plot (POST
// /api/v1/calculate?series=plot|full|none). Thinning keeps the shape of the contract: one
// shared frequency grid and every series aligned with it; each kept value is the full sweep's
// own value at that frequency, never an interpolation or an average.
import type { AnalysisResult, SweepResult } from "./result-types";

export const SERIES_MODES = ["plot", "full", "none"] as const;
export type SeriesMode = (typeof SERIES_MODES)[number];

/** About this many evenly spaced points, before the peaks and the mode neighbourhoods are added. */
export const PLOT_BASE_POINTS = 40;
/** Grid points kept on each side of the grid point nearest a natural frequency. */
export const MODE_NEIGHBOURS = 1;

/** How the answer's sweep was sampled (`sweep.sampling`, only when it is not the full sweep). */
export interface SweepSampling {
  mode: Exclude<SeriesMode, "full">;
  /** Points kept, and the points of the full sweep. */
  points: number;
  fullPoints: number;
}

function addPeaks(keep: Set<number>, values: readonly number[]): void {
  // Every local maximum (a plateau counts once, at its first point): the peaks of each curve
  // keep their exact value and frequency. Minima are left to the stride: across dozens of
  // series their union would keep most of the grid.
  for (let i = 1; i < values.length - 1; i++) {
    const prev = values[i - 1] as number;
    const v = values[i] as number;
    let j = i + 1;
    while (j < values.length - 1 && values[j] === v) j++;
    const next = values[j] as number;
    if (v > prev && v > next) keep.add(i);
  }
}

/**
 * The indices of the grid that a plot keeps: first and last; every PLOT_BASE_POINTS-th share of
 * the grid (an even stride); every local maximum of any displacement, velocity or
 * transmissibility series; and MODE_NEIGHBOURS points either side of each natural frequency.
 */
export function plotIndices(sweep: SweepResult, modesHz: readonly number[]): number[] {
  const f = sweep.frequencyHz;
  const n = f.length;
  if (n <= 2) return f.map((_, i) => i);
  const keep = new Set<number>([0, n - 1]);
  const stride = Math.max(1, Math.ceil(n / PLOT_BASE_POINTS));
  for (let i = 0; i < n; i += stride) keep.add(i);
  for (const s of sweep.series) {
    addPeaks(keep, s.displacementPeak);
    addPeaks(keep, s.velocityPeak);
  }
  for (const t of sweep.transmissibility ?? []) addPeaks(keep, t.values);
  for (const hz of modesHz) {
    if (!(hz >= (f[0] as number) && hz <= (f[n - 1] as number))) continue;
    let nearest = 0;
    for (let i = 1; i < n; i++) if (Math.abs((f[i] as number) - hz) < Math.abs((f[nearest] as number) - hz)) nearest = i;
    for (let i = Math.max(0, nearest - MODE_NEIGHBOURS); i <= Math.min(n - 1, nearest + MODE_NEIGHBOURS); i++) keep.add(i);
  }
  return [...keep].sort((a, b) => a - b);
}

function pick(values: readonly number[], idx: readonly number[]): number[] {
  return idx.map((i) => values[i] as number);
}

/** The result with its sweep series as asked; `full` is the result itself, untouched. */
export function withSeries(result: AnalysisResult, mode: SeriesMode): AnalysisResult & { sweep: SweepResult & { sampling?: SweepSampling } } {
  if (mode === "full") return result;
  const sweep = result.sweep;
  const fullPoints = sweep.frequencyHz.length;
  if (mode === "none") {
    const { transmissibility, ...rest } = sweep;
    return {
      ...result,
      sweep: { ...rest, frequencyHz: [], series: [], ...(transmissibility ? { transmissibility: [] } : {}), sampling: { mode, points: 0, fullPoints } },
    };
  }
  const idx = plotIndices(
    sweep,
    result.modes.map((m) => m.frequencyHz),
  );
  return {
    ...result,
    sweep: {
      ...sweep,
      frequencyHz: pick(sweep.frequencyHz, idx),
      series: sweep.series.map((s) => ({ ...s, displacementPeak: pick(s.displacementPeak, idx), velocityPeak: pick(s.velocityPeak, idx) })),
      ...(sweep.transmissibility ? { transmissibility: sweep.transmissibility.map((t) => ({ ...t, values: pick(t.values, idx) })) } : {}),
      sampling: { mode, points: idx.length, fullPoints },
    },
  };
}
