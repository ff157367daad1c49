import { z } from "zod";
import { parseAnalysisInput } from "@/modules/calc";
import { AppError } from "@/modules/platform/errors";
import { defineRoute } from "@/app/_lib/route";
import { AnalysisRefusedError, analyseToJson } from "@/app/_lib/analysis-pool";
import { SERIES_MODES, type SeriesMode } from "@/modules/calc/sweep-downsample";

export const dynamic = "force-dynamic";

/** 1 MB: far above any real foundation model, low enough to keep parsing cheap. */
const MAX_INPUT_BYTES = 1_000_000;

/**
 * `?series=plot` (the default) thins the sweep series for a plot (modules/calc/sweep-downsample.ts:
 * every local extremum, the neighbourhood of every natural frequency and an even stride, each value
 * the full sweep's own), `?series=full` answers the whole sweep, `?series=none` none of it. Every
 * other part of the result is the same in all three; `sweep.sampling` says what was kept.
 */
function seriesMode(request: Request): SeriesMode {
  const asked = new URL(request.url).searchParams.get("series");
  if (asked === null) return "plot";
  if ((SERIES_MODES as readonly string[]).includes(asked)) return asked as SeriesMode;
  throw new AppError("invalid_input", "The query parameter series must be plot, full or none.", [{ path: "series", message: `Expected one of ${SERIES_MODES.join(", ")}` }]);
}

// The wrapper reads the JSON (413, empty or non-JSON 400); the contract's parser then
// gives every problem its JSON path in the contract's own words, the input limits included.
// The analysis runs on the analysis pool (503 busy when its queue is full, 422 past its time
// limit), and its JSON text is answered as the worker wrote it.
export const POST = defineRoute({
  access: { kind: "signedIn" },
  body: z.unknown(),
  maxBodyBytes: MAX_INPUT_BYTES,
  handler: async (ctx, body) => {
    const series = seriesMode(ctx.request);
    const parsed = parseAnalysisInput(body);
    if (!parsed.ok) throw new AppError("invalid_input", "The analysis input has problems.", parsed.issues);
    try {
      return new Response(await analyseToJson(parsed.input, series), { headers: { "content-type": "application/json" } });
    } catch (e) {
      if (!(e instanceof AnalysisRefusedError)) throw e;
      // An input the contract accepts can still be numerically impossible (a block 1e15 m
      // tall): the engine then refuses (no NaN or Infinity ever leaves it, or a factorisation
      // fails). That is the caller's input, so a 400, logged so an engine fault on ordinary
      // input is still seen.
      console.error("[calculate] analysis refused an input that passed the contract:", e.message);
      throw new AppError("invalid_input", "These values cannot be analysed: check the input's units and magnitudes.", [{ path: "(root)", message: "values too large or too small to analyse" }]);
    }
  },
});
