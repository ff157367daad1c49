// One line per foundation for the project page: its status and governing check,
// from the engine's own result for the stored draft.
import type { AnalysisResult, CheckResult } from "@/modules/calc";

/** How much of its limit a check uses; above 1 it fails. The governing check has the largest. */
export function checkUtilisation(c: CheckResult): number {
  if (c.comparison === "min") return c.value > 0 ? c.limit / c.value : Number.POSITIVE_INFINITY;
  return c.limit > 0 ? Math.abs(c.value) / c.limit : Number.POSITIVE_INFINITY;
}

/** Failing checks first, then by how close each is to its limit. */
export function sortChecksGoverningFirst(checks: readonly CheckResult[]): CheckResult[] {
  return [...checks].sort((a, b) => Number(a.pass) - Number(b.pass) || checkUtilisation(b) - checkUtilisation(a));
}

export interface GoverningSummary {
  label: string;
  pass: boolean;
  utilisation: number;
  failing: number;
  total: number;
}

export function governingCheck(result: AnalysisResult): GoverningSummary | null {
  const first = sortChecksGoverningFirst(result.checks)[0];
  if (!first) return null;
  return {
    label: first.label,
    pass: first.pass,
    utilisation: checkUtilisation(first),
    failing: result.checks.filter((c) => !c.pass).length,
    total: result.checks.length,
  };
}
