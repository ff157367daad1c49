import type { SizingIssue, SizingOutcome } from "@/modules/sizing";
import { SIZING_API_LIMITS, sizingRequestSchema } from "@/modules/desk/mat-sizing";
import { AppError, type FieldIssue } from "@/modules/platform/errors";
import { defineRoute } from "@/app/_lib/route";
import { AnalysisRefusedError, proposeBlockSizesInPool } from "@/app/_lib/analysis-pool";

export const dynamic = "force-dynamic";

/** 1 MB, as for /calculate: far above any real foundation model, low enough to keep parsing cheap. */
const MAX_BODY_BYTES = 1_000_000;
const ROOT = "(root)";

/** `input.soil.poissonRatio`, `options.dimensions.length.max`: the caller sees which document is wrong. */
function prefixed(issue: SizingIssue): FieldIssue {
  return { path: issue.path === ROOT ? issue.in : `${issue.in}.${issue.path}`, message: issue.message };
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
    let outcome: SizingOutcome;
    try {
      // Under the API's cap on analyses, on the analysis pool (its own, longer time limit), so
      // the server keeps answering other requests during a long search. Every problem of both
      // documents comes back in one answer.
      outcome = await proposeBlockSizesInPool(body.input, body.options, SIZING_API_LIMITS);
    } catch (e) {
      if (!(e instanceof AnalysisRefusedError)) throw e;
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
