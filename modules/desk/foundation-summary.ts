// One line per foundation for the project page: its status and governing check,
// from the engine's own result for the stored draft. Band checks (modules/calc/band-checks.ts)
// are checks like the others: a failure at a soil bound can govern.
import { checkVerdict, soilCaseText, type AnalysisResult, type CheckResult, type CheckVerdict } from "@/modules/calc";

/** How much of its limit a check uses; above 1 it fails. The governing check has the largest. */
export function checkUtilisation(c: CheckResult): number {
  if (c.comparison === "min") return c.value > 0 ? c.limit / c.value : Number.POSITIVE_INFINITY;
  return c.limit > 0 ? Math.abs(c.value) / c.limit : Number.POSITIVE_INFINITY;
}

// Open failures first, then failures accepted with a justification (still failures: they stay
// ahead of every pass), then passes; within each, by how close each is to its limit.
// Checks kept for information only (not applicable to the support) come last and never govern.
const VERDICT_ORDER: Record<CheckVerdict, number> = { fail: 0, accepted: 1, pass: 2, "not-applicable": 3 };

/** Failing checks first (open ones before accepted ones), then by how close each is to its limit. */
export function sortChecksGoverningFirst(checks: readonly CheckResult[]): CheckResult[] {
  return [...checks].sort((a, b) => VERDICT_ORDER[checkVerdict(a)] - VERDICT_ORDER[checkVerdict(b)] || checkUtilisation(b) - checkUtilisation(a));
}

export interface GoverningSummary {
  label: string;
  pass: boolean;
  /** pass, fail, or "accepted" (failed, accepted with a written justification). */
  verdict: CheckVerdict;
  /** The designer's justification when the governing check is an accepted band check. */
  justification?: string;
  /** "nominal soil", "upper soil bound (G x 1.5)" ... */
  soil: string;
  utilisation: number;
  /** Checks whose value fails their limit, accepted ones included. */
  failing: number;
  /** Of those, how many are accepted with a justification. */
  accepted: number;
  total: number;
}

/** What the governing check reads of a result (so a stored revision's checks suffice). */
export type GoverningSource = Pick<AnalysisResult, "checks"> & { impedance: Pick<AnalysisResult["impedance"], "method"> };

export function governingCheck(result: GoverningSource): GoverningSummary | null {
  const first = sortChecksGoverningFirst(result.checks.filter((c) => !c.notApplicable))[0];
  if (!first) return null;
  return {
    label: first.label,
    pass: first.pass,
    verdict: checkVerdict(first),
    ...(first.acceptance ? { justification: first.acceptance.justification } : {}),
    soil: soilCaseText(first, result.impedance.method === "user"),
    utilisation: checkUtilisation(first),
    failing: result.checks.filter((c) => !c.pass).length,
    accepted: result.checks.filter((c) => checkVerdict(c) === "accepted").length,
    total: result.checks.filter((c) => !c.notApplicable).length,
  };
}
