import "server-only";
import { parseAnalysisInput } from "@/modules/calc";
import { analyseInPool } from "@/app/_lib/analysis-pool";

/**
 * The labels of the checks a saved draft fails, for the confirmation before issuing. A draft
 * that cannot be analysed yields none here: issuing it is refused with its own message.
 */
export async function failingCheckLabels(document: unknown): Promise<string[]> {
  const parsed = parseAnalysisInput(document);
  if (!parsed.ok) return [];
  try {
    const result = await analyseInPool(parsed.input);
    return result.checks.filter((c) => !c.pass).map((c) => (c.acceptance ? `${c.label} (accepted with justification)` : c.label));
  } catch {
    return [];
  }
}
