import { parseAnalysisInput } from "@/modules/calc";
import { parseSizingOptions, proposeBlockSizesAsync, type SizingIssue } from "@/modules/sizing";
import { SIZING_API_DEFAULT_ANALYSES, SIZING_API_MAX_ANALYSES, sizingRequestSchema } from "@/modules/desk/mat-sizing";
import { AppError, type FieldIssue } from "@/modules/platform/errors";
import { defineRoute } from "@/app/_lib/route";

export const dynamic = "force-dynamic";

/** 1 MB, as for /calculate: far above any real foundation model, low enough to keep parsing cheap. */
const MAX_BODY_BYTES = 1_000_000;
const ROOT = "(root)";

/** `input.soil.poissonRatio`, `options.dimensions.length.max`: the caller sees which document is wrong. */
function prefixed(issue: SizingIssue): FieldIssue {
  return { path: issue.path === ROOT ? issue.in : `${issue.in}.${issue.path}`, message: issue.message };
}

const isPlainObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** The API's default cap, written in when the caller gives none (the module's own default may differ). */
function withApiDefault(options: unknown): unknown {
  return isPlainObject(options) && !Object.hasOwn(options, "maxAnalyses") ? { ...options, maxAnalyses: SIZING_API_DEFAULT_ANALYSES } : options;
}

/** What the API refuses before the module sees it: more analyses than the API's cap. */
function apiLimitIssues(options: unknown): FieldIssue[] {
  if (!isPlainObject(options)) return [];
  const requested = options.maxAnalyses;
  if (typeof requested === "number" && requested > SIZING_API_MAX_ANALYSES) {
    return [{ path: "options.maxAnalyses", message: `must be at most ${SIZING_API_MAX_ANALYSES} through the API (each analysis takes a few milliseconds of the server)` }];
  }
  return [];
}

function invalid(issues: FieldIssue[]): AppError {
  return new AppError("invalid_input", "The sizing request has problems.", issues);
}

// The wrapper reads the JSON (413, empty or non-JSON 400) and checks the envelope; the
// contract's parser and the assistant's option schema then name every problem by its path.
export const POST = defineRoute({
  access: { kind: "signedIn" },
  body: sizingRequestSchema,
  maxBodyBytes: MAX_BODY_BYTES,
  handler: async (_ctx, body) => {
    const options = withApiDefault(body.options);
    const limits = apiLimitIssues(options);
    if (limits.length > 0) {
      // Refused before any analysis; the other problems are named too, so one round trip
      // shows them all (the API's message wins where both speak of one field).
      const taken = new Set(limits.map((i) => i.path));
      const parsedOptions = parseSizingOptions(options);
      const parsedInput = parseAnalysisInput(body.input);
      throw invalid([
        ...limits,
        ...(parsedOptions.ok ? [] : parsedOptions.issues.map((i) => prefixed({ in: "options", ...i })).filter((i) => !taken.has(i.path))),
        ...(parsedInput.ok ? [] : parsedInput.issues.map((i) => prefixed({ in: "input", ...i }))),
      ]);
    }
    let outcome: Awaited<ReturnType<typeof proposeBlockSizesAsync>>;
    try {
      // In slices of ~20 ms: the server keeps answering other requests during a long search.
      outcome = await proposeBlockSizesAsync(body.input, options);
    } catch (e) {
      // As in /calculate: an input the contract accepts can still be numerically impossible
      // (a density of 1e308), and the engine then refuses it. That is the caller's input, so
      // a 400, logged so that a fault of the engine or the assistant is still seen.
      console.error("[sizing] the search refused an input that passed the contract:", e instanceof Error ? e.message : e);
      throw invalid([{ path: "input", message: "values too large or too small to analyse: check the input's units and magnitudes" }]);
    }
    if (!outcome.ok) throw invalid(outcome.issues.map(prefixed));
    return outcome.result;
  },
});
