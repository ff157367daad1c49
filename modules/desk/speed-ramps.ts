// Speed ramps (start-up and coast-down runs through resonance, result.transient) as the desk
// and the calculation package present them: a run's title, the harmonic steady state of the
// run's rotor over the run's speeds for comparison, the operating range in the run's speeds,
// and fewer rows of the envelope for a workbook. Pure: the engine's result goes in.
import type { AnalysisResult, TransientResult } from "@/modules/calc";

/** What every speed-ramp figure carries beside it: the time-domain model's own limits. */
export const SPEED_RAMP_CAUTION =
  "Speed ramps are integrated in time on the same idealised rigid block, with the soil springs and dashpots frozen at the rated speed and the material damping made viscous there: below the rated speed the damping is understated (peaks on the safe side), above it overstated. The real ramp follows the drive's torque and the load, not a constant rate; use the vendor's start-up and coast-down times.";

export const SPEED_RAMP_METHOD = {
  integration: "Newmark's average-acceleration method (γ = 1/2, β = 1/4), unconditionally stable",
  source: "Newmark (1959), A method of computation for structural dynamics, J. Eng. Mech. Div. ASCE 85(EM3); equivalent viscous damping of equal energy per cycle after Chopra, Dynamics of Structures (recalled from memory)",
} as const;

const kindWords = { "run-up": "start-up", "coast-down": "coast-down" } as const;

/** "start-up of Motor RWM-101 · rotor, 0 → 1785 rpm in 12 s (rotating, static unbalance)". */
export function speedRampTitle(run: Pick<TransientResult, "kind" | "machine" | "rotor" | "fromRpm" | "toRpm" | "durationS" | "case" | "unbalanceMode">): string {
  const rpm = (v: number) => (Number.isInteger(v) ? String(v) : v.toFixed(1));
  return `${kindWords[run.kind]} of ${run.machine} · ${run.rotor}, ${rpm(run.fromRpm)} → ${rpm(run.toRpm)} rpm in ${run.durationS} s (${run.case}, ${run.unbalanceMode} unbalance)`;
}

/** The word the desk uses for a run kind. */
export function speedRampKindWord(kind: TransientResult["kind"]): string {
  return kindWords[kind];
}

/** The time at which a run passes a speed (constant rate; may lie outside the run). */
export function timeAtRpm(run: Pick<TransientResult, "fromRpm" | "toRpm" | "durationS">, rpm: number): number {
  return ((rpm - run.fromRpm) / (run.toRpm - run.fromRpm)) * run.durationS;
}

export interface SteadyStateCurve {
  rpm: number[];
  /** Largest component over the run's bearings (m, m/s). */
  displacement: number[];
  velocity: number[];
}

/**
 * The harmonic steady state of the run's rotor, load case and unbalance mode at its bearings,
 * enveloped over the bearings, from the result's frequency sweep, at the sweep frequencies that
 * lie within the run's speeds. Empty when the sweep does not reach them.
 */
export function steadyStateCurve(result: Pick<AnalysisResult, "sweep">, run: TransientResult): SteadyStateCurve {
  const bearings = new Set(run.points.map((p) => p.name));
  const series = result.sweep.series.filter((s) => s.machine === run.machine && s.rotor === run.rotor && s.case === run.case && s.unbalanceMode === run.unbalanceMode && bearings.has(s.point));
  const lo = Math.min(run.fromRpm, run.toRpm);
  const hi = Math.max(run.fromRpm, run.toRpm);
  const out: SteadyStateCurve = { rpm: [], displacement: [], velocity: [] };
  if (!series.length) return out;
  result.sweep.frequencyHz.forEach((f, i) => {
    const rpm = f * 60;
    if (rpm < lo || rpm > hi) return;
    out.rpm.push(rpm);
    out.displacement.push(series.reduce((m, s) => Math.max(m, s.displacementPeak[i] ?? 0), 0));
    out.velocity.push(series.reduce((m, s) => Math.max(m, s.velocityPeak[i] ?? 0), 0));
  });
  return out;
}

/** The rotor's operating speed range (rpm) from the result, or its rated speed alone. */
export function operatingRangeRpm(result: Pick<AnalysisResult, "sweep" | "rotors">, run: Pick<TransientResult, "machine" | "rotor">): [number, number] | null {
  const range = result.sweep.operatingRangesHz?.find((o) => o.machine === run.machine && o.rotor === run.rotor);
  if (range) return [range.fromHz * 60, range.toHz * 60];
  const rotor = result.rotors.find((r) => r.machine === run.machine && r.rotor === run.rotor);
  if (!rotor) return null;
  return rotor.speedRangeRpm ? [rotor.speedRangeRpm[0], rotor.speedRangeRpm[1]] : [rotor.speedRpm, rotor.speedRpm];
}

/** Natural frequencies of the run's frozen model that the run passes (Hz, with their mode numbers). */
export function passedNaturalFrequencies(run: TransientResult): { mode: number; frequencyHz: number }[] {
  const lo = Math.min(run.fromRpm, run.toRpm) / 60;
  const hi = Math.max(run.fromRpm, run.toRpm) / 60;
  return run.model.naturalFrequenciesHz.map((frequencyHz, i) => ({ mode: i + 1, frequencyHz })).filter((m) => m.frequencyHz >= lo && m.frequencyHz <= hi);
}

export interface EnvelopeRows {
  /** How many output intervals each row gathers (1: the series as computed). */
  intervalsPerRow: number;
  timeS: number[];
  speedRpm: number[];
  /** Per bearing, per row (m, m/s). */
  displacement: number[][];
  velocity: number[][];
}

/**
 * At most `maxRows` rows of a run's envelope: consecutive output intervals gathered in equal
 * groups, each row the largest value of its group at every bearing (so no peak is lost), at the
 * middle of the group (the mean of its first and last interval middles, exact for the equal
 * intervals the engine uses; the speed is linear in time).
 */
export function envelopeRows(run: TransientResult, maxRows: number): EnvelopeRows {
  const n = run.series.timeS.length;
  const per = Math.max(1, Math.ceil(n / Math.max(1, maxRows)));
  const rows = Math.ceil(n / per);
  const mid = (xs: number[], r: number) => ((xs[r * per] ?? 0) + (xs[Math.min(n, (r + 1) * per) - 1] ?? 0)) / 2;
  const gather = (xs: number[]) =>
    Array.from({ length: rows }, (_, r) => {
      let m = 0;
      for (let k = r * per; k < Math.min(n, (r + 1) * per); k++) m = Math.max(m, xs[k] ?? 0);
      return m;
    });
  return {
    intervalsPerRow: per,
    timeS: Array.from({ length: rows }, (_, r) => (per === 1 ? (run.series.timeS[r] ?? 0) : mid(run.series.timeS, r))),
    speedRpm: Array.from({ length: rows }, (_, r) => (per === 1 ? (run.series.speedRpm[r] ?? 0) : mid(run.series.speedRpm, r))),
    displacement: run.series.displacementPeak.map(gather),
    velocity: run.series.velocityPeak.map(gather),
  };
}
