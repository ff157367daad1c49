import bcrypt from "bcryptjs";
import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";

// bcrypt cost 10 (the floor we accept; raise it when sign-in latency allows).
export const BCRYPT_COST = 10;

// A bcrypt of cost 10 is ~70 ms of pure CPU in bcryptjs. On the request thread it would stall
// every other request of the server (or, in its async form, interleave so that fifty
// simultaneous sign-ins all finish late together), so hashing and comparing run first come,
// first served on a small pool of worker threads that can use the other cores.
const WORKER_SOURCE = `
const { parentPort } = require("node:worker_threads");
const bcrypt = require("bcryptjs");
parentPort.on("message", (job) => {
  try {
    const value = job.kind === "hash" ? bcrypt.hashSync(job.password, job.cost) : bcrypt.compareSync(job.password, job.hash);
    parentPort.postMessage({ id: job.id, ok: true, value });
  } catch (e) {
    parentPort.postMessage({ id: job.id, ok: false, message: e instanceof Error ? e.message : String(e) });
  }
});
`;

type Job = { kind: "hash"; password: string; cost: number } | { kind: "compare"; password: string; hash: string };
interface Pending {
  job: Job & { id: number };
  resolve: (v: string | boolean) => void;
  reject: (e: Error) => void;
}
interface PoolWorker {
  worker: Worker;
  busy: Pending | null;
}

const POOL_SIZE = Math.max(1, Math.min(2, availableParallelism()));
let pool: PoolWorker[] | null = null;
let poolBroken = false;
const queue: Pending[] = [];
let nextId = 1;

function startWorker(): PoolWorker {
  const entry: PoolWorker = { worker: new Worker(WORKER_SOURCE, { eval: true }), busy: null };
  // Idle workers must not keep a script (the seed, a test) alive.
  entry.worker.unref();
  entry.worker.on("message", (msg: { id: number; ok: boolean; value?: string | boolean; message?: string }) => {
    const done = entry.busy;
    entry.busy = null;
    entry.worker.unref();
    if (done && done.job.id === msg.id) {
      if (msg.ok && msg.value !== undefined) done.resolve(msg.value);
      else done.reject(new Error(msg.message ?? "password worker failed"));
    }
    pump();
  });
  entry.worker.on("error", (e) => {
    // A dead worker fails its job; the pool replaces it for the next one.
    entry.busy?.reject(e instanceof Error ? e : new Error(String(e)));
    entry.busy = null;
    if (pool) pool = pool.filter((p) => p !== entry);
    pump();
  });
  return entry;
}

function pump(): void {
  if (!pool) return;
  while (queue.length) {
    let free = pool.find((p) => !p.busy);
    if (!free && pool.length < POOL_SIZE) {
      free = startWorker();
      pool.push(free);
    }
    if (!free) return;
    const next = queue.shift() as Pending;
    free.busy = next;
    free.worker.ref();
    free.worker.postMessage(next.job);
  }
}

function run(job: Job): Promise<string | boolean> {
  if (!pool && !poolBroken) {
    try {
      pool = [startWorker()];
    } catch {
      // No worker threads here (an unusual runtime): bcryptjs on this thread still works.
      poolBroken = true;
    }
  }
  if (poolBroken) return job.kind === "hash" ? bcrypt.hash(job.password, job.cost) : bcrypt.compare(job.password, job.hash);
  return new Promise((resolve, reject) => {
    queue.push({ job: { ...job, id: nextId++ }, resolve, reject });
    pump();
  });
}

export async function hashPassword(password: string): Promise<string> {
  return (await run({ kind: "hash", password, cost: BCRYPT_COST })) as string;
}

export async function verifyPassword(password: string, hash: string): Promise<boolean> {
  return (await run({ kind: "compare", password, hash })) === true;
}

let dummyHash: string | undefined;

/** A hash to compare against when the account does not exist, so both paths take as long. */
export function getDummyHash(): string {
  dummyHash ??= bcrypt.hashSync("no-such-account-placeholder", BCRYPT_COST);
  return dummyHash;
}
