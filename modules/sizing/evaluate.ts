// One candidate through the calculation core: the resized input is validated like any input,
// analysed with a two-point sweep (the checks do not use the plotted sweep), and judged on
// every check of the result, plus, when asked, the frequency separation of the soil band.
import { analyse, CRITERIA_DEFAULTS, parseAnalysisInput, type AnalysisInput, type AnalysisResult, type CheckResult, type InputIssue } from "@/modules/calc";
import { separationOverRange } from "@/modules/calc/checks";

/** Check id of the soil band's frequency separation (not a check of the core's result). */
export const SOIL_BAND_SEPARATION_ID = "frequency-separation-soil-band";

/** Input field of the time-integration runs (not checks), left out of the search's analyses. */
const OPTIONAL_RUNS_FIELD = "transient";

/** The fewest sweep points the core accepts: the plots are not needed to judge a candidate. */
const SEARCH_SWEEP_POINTS = 2;

export interface Evaluation {
  result: AnalysisResult;
  /** The result's checks, then the soil-band separation checks when required. */
  checks: CheckResult[];
  pass: boolean;
  /** Distinct ids of the failing checks. */
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
 * The soil band's natural frequencies against every rotor's operating range, one check per
 * bound and rotor (its value the smallest |r - 1| over the six modes), with the same criterion
 * and the same measure as the core's frequency-separation check.
 */
export function soilBandSeparationChecks(result: AnalysisResult, input: AnalysisInput): CheckResult[] {
  const bounds = result.bounds;
  if (!bounds) return [];
  const criterion = result.criteria?.frequencySeparation ?? {
    value: input.criteria?.frequencySeparation ?? CRITERIA_DEFAULTS.frequencySeparation.value,
    source: CRITERIA_DEFAULTS.frequencySeparation.source,
  };
  const out: CheckResult[] = [];
  for (const [which, bound] of [["lower", bounds.lower], ["upper", bounds.upper]] as const) {
    for (const r of result.rotors) {
      const range = r.speedRangeRpm ?? [r.speedRpm, r.speedRpm];
      const values = bound.frequenciesHz.map((fn) => separationOverRange([range[0] / 60, range[1] / 60], fn));
      const value = Math.min(...values);
      const mode = values.indexOf(value) + 1;
      out.push({
        id: SOIL_BAND_SEPARATION_ID,
        key: `${SOIL_BAND_SEPARATION_ID}/${which}/${r.machine}/${r.rotor}`,
        label: `Soil band ${which} bound (G x ${bound.factor.toFixed(3)}): mode ${mode} against ${r.machine} ${r.rotor} ${range[0]}-${range[1]} rpm: smallest |r - 1|`,
        value,
        limit: criterion.value,
        pass: value >= criterion.value,
        source: `${criterion.source}; soil band: ${bounds.source}`,
        unit: "-",
        comparison: "min",
        machine: r.machine,
        rotor: r.rotor,
        mode,
      });
    }
  }
  return out;
}

export type EvaluateResult = { ok: true; evaluation: Evaluation } | { ok: false; issues: InputIssue[] };

/** Validates and analyses a resized document for the search. */
export function evaluateCandidate(document: unknown, requireSoilBand: boolean): EvaluateResult {
  const parsed = parseAnalysisInput(document);
  if (!parsed.ok) return parsed;
  const input: AnalysisInput = { ...parsed.input, sweep: { ...parsed.input.sweep, points: SEARCH_SWEEP_POINTS } };
  // Optional start-up / coast-down runs (a field being added to the core) give no check and
  // cost far more than the rest of the analysis: the search leaves them out. Deleted by name
  // through an index so this compiles whether or not the field exists yet.
  delete (input as unknown as Record<string, unknown>)[OPTIONAL_RUNS_FIELD];
  const result = analyse(input, { soilBand: requireSoilBand });
  const checks = requireSoilBand ? [...result.checks, ...soilBandSeparationChecks(result, input)] : result.checks;
  const failingIds = [...new Set(checks.filter((c) => !c.pass).map((c) => c.id))];
  return { ok: true, evaluation: { result, checks, pass: failingIds.length === 0, failingIds } };
}
