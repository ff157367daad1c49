// Parsing of an analysis input document into a valid AnalysisInput, or the list of problems
// with their JSON paths (e.g. "soil.poissonRatio", "machines[0].rotors[0].bearings").
import type { z } from "zod";
import { analysisInputSchema, type AnalysisInput } from "./schema";

export interface InputIssue {
  path: string;
  message: string;
}

export type ParseResult = { ok: true; input: AnalysisInput } | { ok: false; issues: InputIssue[] };

export const ROOT_PATH = "(root)";

/** JSON path in dotted form with [i] for array indices. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const part of path) {
    if (typeof part === "number") out += `[${part}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out || ROOT_PATH;
}

/** The value at a path of the submitted document (undefined when absent). */
export function valueAt(json: unknown, path: readonly PropertyKey[]): unknown {
  let v: unknown = json;
  for (const part of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<PropertyKey, unknown>)[part];
  }
  return v;
}

function issuesFromZod(error: z.ZodError, json: unknown): InputIssue[] {
  return error.issues.flatMap((issue) => {
    if (issue.code === "unrecognized_keys") {
      return issue.keys.map((key) => ({ path: formatPath([...issue.path, key]), message: "unknown field" }));
    }
    // A blank (null, as the desk's form sends it) is as missing as an absent field.
    if (issue.code === "invalid_type" && (valueAt(json, issue.path) ?? null) === null) {
      return [{ path: formatPath(issue.path), message: "is required" }];
    }
    return [{ path: formatPath(issue.path), message: issue.message }];
  });
}

/** Validates a parsed JSON value against the contract. */
export function parseAnalysisInput(json: unknown): ParseResult {
  const parsed = analysisInputSchema.safeParse(json);
  return parsed.success ? { ok: true, input: parsed.data } : { ok: false, issues: issuesFromZod(parsed.error, json) };
}

/** Validates a JSON text (a text that is not JSON is one problem at the root). */
export function parseAnalysisInputText(text: string): ParseResult {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    return { ok: false, issues: [{ path: ROOT_PATH, message: `not valid JSON: ${(e as Error).message}` }] };
  }
  return parseAnalysisInput(json);
}
