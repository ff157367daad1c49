import "server-only";
import { availableParallelism } from "node:os";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import type { AnalysisInput, AnalysisResult } from "@/modules/calc";
import type { SeriesMode } from "@/modules/calc/sweep-downsample";
import type { GoverningSummary } from "@/modules/desk/foundation-summary";
import type { SizingLimits, SizingOutcome } from "@/modules/sizing";
import { AppError } from "@/modules/platform/errors";
import { getServerEnv, runsFromSources } from "@/modules/platform/env";
import type { AnalysisJob } from "./analysis-jobs";
import type { MeasurementEvaluation, MeasurementEvaluationJob } from "@/modules/desk/measurement-evaluate";

// Analyses run on a small pool of worker threads, never on the request thread: one heavy input
// then holds one worker, while health checks, pages and other users are still answered. Each job
// has a time limit (the worker is terminated and replaced) and a memory limit; jobs wait in a
// bounded queue, past which the caller gets a 503 with Retry-After.

export interface AnalysisPoolOptions {
  size: number;
  queue: number;
  timeoutMs: number;
  sizingTimeoutMs: number;
  /** Heap of one worker (MB): an analysis at the input limits needs about 200. */
  heapMb: number;
}

/** Refused by the engine (an input the contract accepts that cannot be analysed): the caller's 400. */
export class AnalysisRefusedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "AnalysisRefusedError";
  }
}

interface Pending {
  id: number;
  job: AnalysisJob;
  timeoutMs: number;
  resolve: (json: string) => void;
  reject: (e: Error) => void;
}
interface PoolWorker {
  worker: Worker;
  /** Loaded and listening (the time limit does not count the start of a worker). */
  ready: boolean;
  busy: Pending | null;
  timer: NodeJS.Timeout | null;
}

function defaultOptions(): AnalysisPoolOptions {
  const env = getServerEnv();
  return {
    size: env.PLINTH_ANALYSIS_WORKERS ?? Math.max(1, Math.min(4, availableParallelism() - 1)),
    queue: env.PLINTH_ANALYSIS_QUEUE,
    timeoutMs: env.PLINTH_ANALYSIS_TIMEOUT_MS,
    sizingTimeoutMs: env.PLINTH_SIZING_TIMEOUT_MS,
    heapMb: 512,
  };
}

let options: AnalysisPoolOptions | null = null;
let workers: PoolWorker[] = [];
let queue: Pending[] = [];
let nextId = 1;

function currentOptions(): AnalysisPoolOptions {
  options ??= defaultOptions();
  return options;
}

// From the sources (vitest, tsx scripts) the worker is TypeScript: a small bootstrap registers
// tsx's loader in the worker, then imports it.
const FROM_SOURCE_BOOTSTRAP = `
const { workerData } = require("node:worker_threads");
import("tsx/esm/api")
  .then((tsx) => { tsx.register(); return import(workerData.workerUrl); })
  .catch((e) => { console.error(e); process.exit(1); });
`;

function spawn(): Worker {
  const resourceLimits = { maxOldGenerationSizeMb: currentOptions().heapMb };
  // Not import.meta.url's suffix: Turbopack keeps the source path there. The path is derived by
  // a string replace, so that Turbopack does not copy the .ts file as an asset.
  if (runsFromSources()) {
    const workerUrl = pathToFileURL(fileURLToPath(import.meta.url).replace(/analysis-pool\.ts$/, "analysis-worker.ts")).href;
    return new Worker(FROM_SOURCE_BOOTSTRAP, { eval: true, workerData: { workerUrl }, resourceLimits });
  }
  // In Next's build, Turbopack bundles the worker file it finds in `new Worker(new URL(...))`.
  return new Worker(new URL("./analysis-worker.ts", import.meta.url), { resourceLimits });
}

function retire(entry: PoolWorker): void {
  workers = workers.filter((w) => w !== entry);
  if (entry.timer) clearTimeout(entry.timer);
  entry.timer = null;
  void entry.worker.terminate();
}

/** A worker that cannot even start fails what waits, rather than being restarted for ever. */
function failWaiting(e: Error): void {
  const waiting = queue;
  queue = [];
  console.error("[analysis pool] a worker failed to start:", e.message);
  for (const p of waiting) p.reject(e);
}

function startWorker(): PoolWorker {
  const entry: PoolWorker = { worker: spawn(), ready: false, busy: null, timer: null };
  entry.worker.unref();
  entry.worker.on("message", (msg: { id: number; ok: boolean; json?: string; message?: string } | { ready: true }) => {
    if ("ready" in msg) {
      entry.ready = true;
      pump();
      return;
    }
    const done = entry.busy;
    if (!done || done.id !== msg.id) return;
    entry.busy = null;
    if (entry.timer) clearTimeout(entry.timer);
    entry.timer = null;
    entry.worker.unref();
    if (msg.ok && msg.json !== undefined) done.resolve(msg.json);
    else done.reject(new AnalysisRefusedError(msg.message ?? "the analysis failed"));
    pump();
  });
  entry.worker.on("error", (e) => {
    // Out of memory (ERR_WORKER_OUT_OF_MEMORY) or a crash: the job fails, the worker is replaced.
    const done = entry.busy;
    entry.busy = null;
    retire(entry);
    if (!entry.ready) failWaiting(e);
    if (done) {
      const oom = (e as { code?: string }).code === "ERR_WORKER_OUT_OF_MEMORY";
      done.reject(oom ? new AppError("analysis_limit", "The analysis needed more memory than the server allows and was stopped: lower sweep.points, the check points or the speed-ramp runs.") : e);
    }
    pump();
  });
  entry.worker.on("exit", () => {
    if (workers.includes(entry)) {
      const done = entry.busy;
      entry.busy = null;
      retire(entry);
      if (!entry.ready) failWaiting(new Error("the analysis worker stopped while starting"));
      done?.reject(new Error("the analysis worker stopped"));
      pump();
    }
  });
  return entry;
}

function pump(): void {
  const { size } = currentOptions();
  while (queue.length) {
    const free = workers.find((w) => w.ready && !w.busy);
    if (!free) {
      const starting = workers.filter((w) => !w.ready).length;
      for (let i = starting; i < queue.length && workers.length < size; i++) workers.push(startWorker());
      return;
    }
    const next = queue.shift() as Pending;
    const entry = free;
    entry.busy = next;
    entry.worker.ref();
    entry.timer = setTimeout(() => {
      // Past the time limit: the worker is stopped mid-analysis and a fresh one takes its place.
      if (entry.busy !== next) return;
      entry.busy = null;
      retire(entry);
      next.reject(new AppError("analysis_limit", `The analysis took longer than ${next.timeoutMs / 1000} s and was stopped: lower sweep.points, the check points or the speed-ramp runs.`));
      pump();
    }, next.timeoutMs);
    entry.worker.postMessage({ id: next.id, job: next.job });
  }
}

function submit(job: AnalysisJob, timeoutMs?: number): Promise<string> {
  const opts = currentOptions();
  const inFlight = workers.filter((w) => w.busy).length + queue.length;
  if (inFlight >= opts.size + opts.queue) {
    // a rough hint: the queue drains in about one time limit per worker
    const retryAfterS = Math.max(1, Math.ceil(opts.timeoutMs / 1000));
    return Promise.reject(new AppError("busy", undefined, [], { retryAfterS }));
  }
  return new Promise((resolve, reject) => {
    queue.push({ id: nextId++, job, timeoutMs: timeoutMs ?? opts.timeoutMs, resolve, reject });
    pump();
  });
}

/** The analysis result of a valid input, as the JSON text of an AnalysisResult (sweep series as asked, full by default). */
export function analyseToJson(input: AnalysisInput, series: SeriesMode = "full"): Promise<string> {
  return submit({ kind: "analyse", input, series });
}

/** The analysis result of a valid input. */
export async function analyseInPool(input: AnalysisInput): Promise<AnalysisResult> {
  return JSON.parse(await analyseToJson(input)) as AnalysisResult;
}

/** The governing check of a valid input (the analysis stays in the worker). */
export async function governingInPool(input: AnalysisInput): Promise<GoverningSummary | null> {
  return JSON.parse(await submit({ kind: "governing", input })) as GoverningSummary | null;
}

/** The block-sizing search, under its own (longer) time limit. */
export async function proposeBlockSizesInPool(document: unknown, sizingOptions: unknown, limits: SizingLimits): Promise<SizingOutcome> {
  return JSON.parse(await submit({ kind: "sizing", document, options: sizingOptions, limits }, currentOptions().sizingTimeoutMs)) as SizingOutcome;
}

/** A site measurement judged against its revision and the soil calibrated from it (modules/desk/measurement-evaluate.ts). */
export async function evaluateInPool(evaluation: MeasurementEvaluationJob): Promise<MeasurementEvaluation> {
  return JSON.parse(await submit({ kind: "commission", evaluation }, currentOptions().sizingTimeoutMs)) as MeasurementEvaluation;
}

/** Tests only: a job that never ends, to show the time limit. */
export function spinInPool(): Promise<string> {
  return submit({ kind: "spin" });
}

/** Tests only: stop every worker, fail what waits, and start again with other options. */
export async function resetAnalysisPool(next: Partial<AnalysisPoolOptions> = {}): Promise<void> {
  const old = workers;
  workers = [];
  const waiting = queue;
  queue = [];
  for (const p of waiting) p.reject(new Error("the analysis pool was reset"));
  for (const w of old) {
    if (w.timer) clearTimeout(w.timer);
    w.busy?.reject(new Error("the analysis pool was reset"));
    await w.worker.terminate();
  }
  options = { ...defaultOptions(), ...next };
}
