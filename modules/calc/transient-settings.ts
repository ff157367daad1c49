// Limits and defaults of the start-up and coast-down time integration (transient.ts). Kept
// apart so that the schema, the consistency rules and the engine share them without cycles.

export const TRANSIENT_LIMITS = {
  /** Longest run accepted (s): large fans and pumps coast down within minutes. */
  maxDurationS: 600,
  /** Most runs in one input, so one analysis stays quick. */
  maxRuns: 8,
  /** Output intervals of the decimated time history. */
  defaultOutputPoints: 500,
  minOutputPoints: 10,
  maxOutputPoints: 2000,
  /**
   * Time steps per period of the highest frequency of the run (natural or excitation). With
   * Newmark's average-acceleration method the period elongation is Omega / (2 atan(Omega / 2)) - 1
   * for Omega = w dt (see transient-newmark.ts): 0.2 % at 40 steps per period.
   */
  stepsPerPeriod: 40,
  /**
   * Largest number of steps of one run (about half a second of computing); a longer run is
   * integrated with a coarser step and a warning.
   */
  maxSteps: 1_000_000,
  /** Largest number of steps of all the runs of one input, shared equally between them. */
  maxTotalSteps: 2_000_000,
  /** Below this many steps per shortest period the coarsened run is flagged as inaccurate. */
  minStepsPerPeriod: 10,
} as const;

export type TransientKind = "run-up" | "coast-down";

/**
 * Start and end speeds of a run: given values, or by default from standstill to the rated speed
 * (run-up) and from the rated speed to standstill (coast-down).
 */
export function resolveTransientSpeeds(
  request: { kind: TransientKind; fromRpm?: number | undefined; toRpm?: number | undefined },
  ratedRpm: number,
): { fromRpm: number; toRpm: number } {
  const runUp = request.kind === "run-up";
  return {
    fromRpm: request.fromRpm ?? (runUp ? 0 : ratedRpm),
    toRpm: request.toRpm ?? (runUp ? ratedRpm : 0),
  };
}
