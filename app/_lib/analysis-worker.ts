// The analysis worker (a worker thread of app/_lib/analysis-pool.ts): runs one job at a time
// and answers JSON text, which crosses threads as one string copy instead of a clone of a
// large object graph on the request thread. Relative imports: Next bundles this file itself.
import { parentPort } from "node:worker_threads";
import { analyse } from "../../modules/calc/analyse";
import { withSeries } from "../../modules/calc/sweep-downsample";
import { governingCheck } from "../../modules/desk/foundation-summary";
import { proposeBlockSizes } from "../../modules/sizing/search";
import { evaluateMeasurement } from "../../modules/desk/measurement-evaluate";
import type { AnalysisJob } from "./analysis-jobs";

function run(job: AnalysisJob): string {
  switch (job.kind) {
    case "analyse":
      // thinned here, so only the answer's own size crosses back to the request thread
      return JSON.stringify(withSeries(analyse(job.input), job.series ?? "full"));
    case "governing":
      return JSON.stringify(governingCheck(analyse(job.input)));
    case "sizing":
      return JSON.stringify(proposeBlockSizes(job.document, job.options, job.limits));
    case "commission":
      // site measurement: verdicts, and the soil calibration (many engine runs)
      return JSON.stringify(evaluateMeasurement(job.evaluation));
    case "spin":
      // tests of the time limit only: a job that never ends
      for (;;);
  }
}

parentPort?.on("message", (msg: { id: number; job: AnalysisJob }) => {
  try {
    parentPort?.postMessage({ id: msg.id, ok: true, json: run(msg.job) });
  } catch (e) {
    parentPort?.postMessage({ id: msg.id, ok: false, message: e instanceof Error ? e.message : String(e) });
  }
});
parentPort?.postMessage({ ready: true });
