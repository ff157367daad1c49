// The workspace's engine in the browser: a Web Worker (started by use-calculation.ts) that runs
// the same modules/calc code as the server, so typing needs no round trip. The handler is a plain
// function, exported so a unit test can hold its answers against `analyse` to the last digit.
// The server stays the authority: saving and issuing recompute there and store its result.
import { ENGINE_VERSION, analyse, parseAnalysisInput, type AnalysisResult } from "../../../modules/calc";

export interface CalcWorkerRequest {
  seq: number;
  document: unknown;
  /** With the start-up and coast-down runs the input asks for (slow: hundreds of ms); without, they are left out. */
  ramps: boolean;
}

export type CalcWorkerReply =
  | { seq: number; ramps: boolean; ok: true; engineVersion: string; result: AnalysisResult }
  | { seq: number; ramps: boolean; ok: false; status: 400; message: string; issues: { path: string; message: string }[] };

/** The answer POST /api/v1/calculate?series=full gives, as a message (same parser, same engine, same words). */
export function handleCalcRequest(req: CalcWorkerRequest): CalcWorkerReply {
  const { seq, ramps } = req;
  const parsed = parseAnalysisInput(req.document);
  if (!parsed.ok) return { seq, ramps, ok: false, status: 400, message: "The analysis input has problems.", issues: parsed.issues };
  const input = ramps || !parsed.input.transient ? parsed.input : { ...parsed.input, transient: undefined };
  try {
    return { seq, ramps, ok: true, engineVersion: ENGINE_VERSION, result: analyse(input) };
  } catch {
    // as the route: an input the contract accepts that the engine cannot analyse is the caller's input
    return {
      seq,
      ramps,
      ok: false,
      status: 400,
      message: "These values cannot be analysed: check the input's units and magnitudes.",
      issues: [{ path: "(root)", message: "values too large or too small to analyse" }],
    };
  }
}

// Only inside a dedicated worker (not when a test imports this file).
declare const WorkerGlobalScope: unknown;
if (typeof WorkerGlobalScope !== "undefined" && typeof self !== "undefined") {
  const scope = self as unknown as { onmessage: ((e: MessageEvent<CalcWorkerRequest>) => void) | null; postMessage: (m: CalcWorkerReply) => void };
  scope.onmessage = (e) => scope.postMessage(handleCalcRequest(e.data));
}
