// Checks at both ends of the soil-uncertainty band, and the designer's acceptance of a band
// exceedance. The one implementation used by the engine's result, the sizing assistant, the
// desk's verdict table, the project table's governing check, the revision comparison and the
// calculation package: each reads `soilCase`, `acceptance` and `checkVerdict` from here.
//
// Frequency separation, displacement and velocity (single rotors and combined) depend on the soil stiffness; they are
// repeated at the lower and the upper bound with the nominal case's measures and criteria
// (checks.ts `soilDependentChecks`). Mass ratio, eccentricity and bearing pressure do not
// depend on it and are not repeated.
import { soilDependentChecks, type Criteria } from "./checks";
import type { CheckResult } from "./result-types";
import type { AcceptanceInput } from "./schema";
import type { SoilCase } from "./soil-case";

export type SoilBoundName = "lower" | "upper";

/** The checks that are repeated at the band's bounds (their nominal ids). */
export const BAND_CHECKED_IDS = ["frequency-separation", "displacement", "velocity", "displacement-combined", "velocity-combined"] as const;
export type BandCheckedId = (typeof BAND_CHECKED_IDS)[number];

/** Id of a check at a soil bound, e.g. `frequency-separation@soil-upper`. The nominal ids are unchanged. */
export function bandCheckId(nominalId: BandCheckedId, bound: SoilBoundName): string {
  return `${nominalId}@soil-${bound}`;
}

/** A check key that names a band check (the only kind a designer may accept with a justification). */
export const BAND_CHECK_KEY_PATTERN = /^(frequency-separation|displacement|velocity|displacement-combined|velocity-combined)@soil-(lower|upper)\/.+/;

/** The check's nominal id (`frequency-separation` for `frequency-separation@soil-upper`). */
export function nominalCheckId(c: Pick<CheckResult, "id">): string {
  const at = c.id.indexOf("@soil-");
  return at < 0 ? c.id : c.id.slice(0, at);
}

function factorText(factor: number): string {
  return String(Number(factor.toPrecision(3)));
}

/** "upper soil bound (G x 1.5)" and the like, for labels and tables. */
export function soilCaseText(c: Pick<CheckResult, "soilCase" | "soilFactor">, userSprings = false): string {
  if (!c.soilCase) return "nominal soil";
  const what = userSprings ? "stiffness" : "G";
  return `${c.soilCase} soil bound${c.soilFactor === undefined ? "" : ` (${what} x ${factorText(c.soilFactor)})`}`;
}

/**
 * Frequency separation, displacement and velocity at one bound: the nominal checks' definitions
 * on the bound's modes and responses, under ids `<id>@soil-<bound>` and keys
 * `<id>@soil-<bound>/<rest of the nominal key>`.
 */
export function boundChecks(criteria: Criteria, bound: SoilBoundName, sc: SoilCase, bandSource: string, userSprings: boolean): CheckResult[] {
  const tagged = { soilCase: bound, soilFactor: sc.factor } as const;
  const prefix = `At the ${soilCaseText(tagged, userSprings)}: `;
  return soilDependentChecks(criteria, sc.modes, sc.rotors, sc.combined).map((c) => {
    const id = bandCheckId(c.id as BandCheckedId, bound);
    return {
      ...c,
      id,
      key: `${id}${(c.key ?? "").slice(c.id.length)}`,
      label: prefix + c.label,
      source: `${c.source}; soil band: ${bandSource}`,
      ...tagged,
    };
  });
}

export interface AcceptanceOutcome {
  checks: CheckResult[];
  warnings: string[];
}

/**
 * Marks each failing band check named by an acceptance as accepted with the designer's written
 * justification. The check keeps `pass: false` and its value: the acceptance is a recorded
 * decision, not a pass. An acceptance that names a passing check, or no check of this result,
 * changes nothing and is reported in the warnings.
 */
export function applyAcceptances(checks: CheckResult[], acceptances: readonly AcceptanceInput[] | undefined): AcceptanceOutcome {
  if (!acceptances?.length) return { checks, warnings: [] };
  const byKey = new Map(acceptances.map((a) => [a.checkKey, a]));
  const seen = new Set<string>();
  const warnings: string[] = [];
  const out = checks.map((c) => {
    const a = c.key === undefined ? undefined : byKey.get(c.key);
    if (!a || !c.soilCase) return c;
    seen.add(a.checkKey);
    if (c.pass) {
      warnings.push(`Acceptance of "${a.checkKey}": the check passes, so the justification is kept in the input but not shown as an acceptance.`);
      return c;
    }
    return { ...c, acceptance: { justification: a.justification } };
  });
  for (const a of acceptances) {
    if (!seen.has(a.checkKey)) warnings.push(`Acceptance of "${a.checkKey}": no band check of this result has that key (names changed, or the soil band was not run); it has no effect.`);
  }
  return { checks: out, warnings };
}

export type CheckVerdict = "pass" | "fail" | "accepted" | "not-applicable";

/** pass, fail, failed and accepted with a written justification (band checks only), or not applicable (kept for information). */
export function checkVerdict(c: Pick<CheckResult, "pass" | "acceptance" | "notApplicable">): CheckVerdict {
  if (c.notApplicable) return "not-applicable";
  if (c.pass) return "pass";
  return c.acceptance ? "accepted" : "fail";
}

export const CHECK_VERDICT_LABELS: Record<CheckVerdict, string> = {
  pass: "pass",
  fail: "fail",
  accepted: "accepted with justification",
  "not-applicable": "not applicable",
};
