// The workspace's verdicts table folds the soil band (issue 15 item 2): with the band on, every
// frequency-separation, displacement and velocity check is there three times (nominal soil and
// both bounds, modules/calc/band-checks.ts), so the table shows each check at its governing
// case and folds the other cases' rows until asked. Nothing is dropped: the rows stay in the
// table (hidden, printed), the counts and the order are the engine's, and a failing or accepted
// row never folds.
import { checkVerdict, nominalCheckId, type CheckResult } from "@/modules/calc";

/** The key the same check shares at nominal soil and at both bounds; null for a check without a key (it stands alone). */
export function soilCaseGroupOf(c: Pick<CheckResult, "id" | "key">): string | null {
  if (!c.key) return null;
  return nominalCheckId(c) + c.key.slice(c.id.length);
}

/**
 * For each row of a governing-first list (sortChecksGoverningFirst): whether it may be folded,
 * that is, it passes (or is not applicable) and an earlier row, its check's governing case, is shown.
 */
export function foldableSoilCases(sorted: readonly CheckResult[]): boolean[] {
  const seen = new Set<string>();
  return sorted.map((c) => {
    const group = soilCaseGroupOf(c);
    if (group === null) return false;
    const governing = !seen.has(group);
    seen.add(group);
    const verdict = checkVerdict(c);
    return !governing && (verdict === "pass" || verdict === "not-applicable");
  });
}
