// A draft's analysis input (issue 18 item 2): the contract's shape with its required values
// allowed to be missing. A draft is only a working copy: it may be saved with blanks (null or
// absent values, empty names, empty lists) while every value that is there must still be what
// the contract says (typed, in range, no unknown fields). Issuing and the analysis take only
// complete inputs (parseAnalysisInput); this module only tells "incomplete" from "invalid".
import type { z } from "zod";
import { formatPath, valueAt, type InputIssue } from "./parse";
import { analysisInputSchema, type AnalysisInput } from "./schema";

export const REQUIRED_MESSAGE = "is required";

export type DraftParseResult =
  /** Complete: a valid analysis input, defaults applied. */
  | { ok: true; complete: true; input: AnalysisInput }
  /** Incomplete but every value present is valid: saveable as a draft, as sent. */
  | { ok: true; complete: false; missing: InputIssue[] }
  /** A value present is wrong (a negative mass, an unknown field): not saveable. */
  | { ok: false; issues: InputIssue[] };

function isBlank(value: unknown): boolean {
  if (value === null || value === undefined) return true;
  if (typeof value === "string") return value.trim() === "";
  return Array.isArray(value) && value.length === 0;
}

/** Whether a zod issue only says that something required has not been given yet. */
function isMissing(issue: z.core.$ZodIssue, json: unknown): boolean {
  const value = valueAt(json, issue.path);
  if (issue.code === "invalid_type") return value === null || value === undefined;
  // an empty name, or an empty list of boxes, machines or bearings: not given yet
  if (issue.code === "too_small") return isBlank(value);
  return false;
}

/**
 * Classifies a draft document. Consistency rules between values (input-consistency.ts) run
 * only on a complete document, as the contract's schema does.
 */
export function parseDraftInput(json: unknown): DraftParseResult {
  const parsed = analysisInputSchema.safeParse(json);
  if (parsed.success) return { ok: true, complete: true, input: parsed.data };
  const issues = parsed.error.issues.flatMap((i): InputIssue[] => {
    if (i.code === "unrecognized_keys") return i.keys.map((k) => ({ path: formatPath([...i.path, k]), message: "unknown field" }));
    return [{ path: formatPath(i.path), message: isMissing(i, json) ? REQUIRED_MESSAGE : i.message }];
  });
  // Refused: every problem is named, the blanks as "is required" beside the wrong values.
  if (parsed.error.issues.some((i) => !isMissing(i, json))) return { ok: false, issues };
  return { ok: true, complete: false, missing: issues };
}
