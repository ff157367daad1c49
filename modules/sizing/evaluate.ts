// One candidate through the calculation core: the resized input is validated like any input,
// analysed with a two-point sweep (the checks do not use the plotted sweep), and judged on
// every check of the result. With the soil band required the core runs the band, and its
// result then holds the band checks (separation, displacement and velocity at the lower and
// upper bound, modules/calc/band-checks.ts): the same checks the desk and the package show.
import { analyse, parseAnalysisInput, type AnalysisInput, type AnalysisResult, type CheckResult, type InputIssue } from "@/modules/calc";

/** Input field of the time-integration runs (not checks), left out of the search's analyses. */
const OPTIONAL_RUNS_FIELD = "transient";

/** The fewest sweep points the core accepts: the plots are not needed to judge a candidate. */
const SEARCH_SWEEP_POINTS = 2;

export interface Evaluation {
  result: AnalysisResult;
  /** The result's checks (the soil band's included when required). An accepted band check still fails here. */
  checks: CheckResult[];
  pass: boolean;
  /** Distinct ids of the failing checks (those inside the required margin included). */
  failingIds: string[];
}

/**
 * Distance of a check's value from its limit as a share of the limit, positive on the passing
 * side: (value - limit) / limit for a minimum, (limit - value) / limit for a maximum. Unlike
 * 1 - utilisation it stays finite when a separation is 0 (a speed range crossing a mode).
 */
export function checkMargin(c: CheckResult): number {
  const distance = c.comparison === "min" ? c.value - c.limit : c.limit - Math.abs(c.value);
  return c.limit > 0 ? distance / c.limit : distance;
}

/**
 * Relative tolerance on the required margin, so a candidate that keeps the margin to the last
 * few bits of a float (10 % written as 0.1) is not refused for the rounding of the division.
 */
const MARGIN_TOLERANCE = 1e-9;

/** The check passes and keeps the required margin inside its limit. */
export function clearsWithMargin(c: CheckResult, margin: number): boolean {
  // a check kept for information only (not applicable to the support) never holds a size back
  if (c.notApplicable) return true;
  return c.pass && (margin <= 0 || checkMargin(c) >= margin - MARGIN_TOLERANCE);
}

export type EvaluateResult = { ok: true; evaluation: Evaluation } | { ok: false; issues: InputIssue[] };

/** Validates and analyses a resized document for the search. */
export function evaluateCandidate(document: unknown, requireSoilBand: boolean, margin = 0): EvaluateResult {
  const parsed = parseAnalysisInput(document);
  if (!parsed.ok) return parsed;
  const input: AnalysisInput = { ...parsed.input, sweep: { ...parsed.input.sweep, points: SEARCH_SWEEP_POINTS } };
  // Optional start-up / coast-down runs (a field being added to the core) give no check and
  // cost far more than the rest of the analysis: the search leaves them out. Deleted by name
  // through an index so this compiles whether or not the field exists yet.
  delete (input as unknown as Record<string, unknown>)[OPTIONAL_RUNS_FIELD];
  const result = analyse(input, { soilBand: requireSoilBand });
  const checks = result.checks;
  // With a required margin a check that passes but sits inside the margin counts as failing.
  const failingIds = [...new Set(checks.filter((c) => !clearsWithMargin(c, margin)).map((c) => c.id))];
  return { ok: true, evaluation: { result, checks, pass: failingIds.length === 0, failingIds } };
}
