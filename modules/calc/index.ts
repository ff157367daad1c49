// Calculation core of Plinthwise (calc-contract.md version 1): a rigid block foundation with
// six degrees of freedom on soil springs and dashpots, under rotating unbalance.
import { analyse } from "./analyse";
import { parseAnalysisInput, parseAnalysisInputText, type InputIssue } from "./parse";
import type { AnalysisResult } from "./result-types";

export { analyse, ENGINE_VERSION, type AnalyseOptions } from "./analyse";
export { parseAnalysisInput, parseAnalysisInputText, formatPath, valueAt, type InputIssue, type ParseResult } from "./parse";
export {
  analysisInputSchema,
  transientRequestSchema,
  type AnalysisInput,
  type AnalysisInputDocument,
  type TransientRequest,
  type TransientRequestDocument,
} from "./schema";
export { analyseTransient, TransientRequestError } from "./transient";
export { TRANSIENT_LIMITS } from "./transient-settings";
export { parseDraftInput, REQUIRED_MESSAGE, type DraftParseResult } from "./draft-input";
export { INPUT_LIMITS, checkInputBounds, type BoundIssue } from "./input-limits";
export type * from "./result-types";
export { CRITERIA_DEFAULTS, SOIL_BAND_DEFAULTS, SWEEP_DEFAULTS, MATERIAL_DAMPING_DEFAULT } from "./criteria-defaults";
export {
  BAND_CHECKED_IDS,
  BAND_CHECK_KEY_PATTERN,
  CHECK_VERDICT_LABELS,
  bandCheckId,
  checkVerdict,
  nominalCheckId,
  soilCaseText,
  type BandCheckedId,
  type CheckVerdict,
  type SoilBoundName,
} from "./band-checks";
export { ACCEPTANCE_JUSTIFICATION_MIN, ACCEPTANCE_JUSTIFICATION_MAX, type AcceptanceInput } from "./schema";
export { DOF_KEYS, type DofKey, type Dof6 } from "./dof";

/** Validates a JSON value and analyses it: the shared path of the CLI and the HTTP API. */
export function analyseJson(json: unknown): { ok: true; result: AnalysisResult } | { ok: false; issues: InputIssue[] } {
  const parsed = parseAnalysisInput(json);
  return parsed.ok ? { ok: true, result: analyse(parsed.input) } : parsed;
}

/** The same from a JSON text. */
export function analyseText(text: string): { ok: true; result: AnalysisResult } | { ok: false; issues: InputIssue[] } {
  const parsed = parseAnalysisInputText(text);
  return parsed.ok ? { ok: true, result: analyse(parsed.input) } : parsed;
}
