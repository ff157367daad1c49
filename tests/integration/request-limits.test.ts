// Issue 19, item 1: no single request can stop the server. The contract's limits refuse the
// probe's input with the fields named (calculate and draft PUT), the draft refuses numbers the
// engine refuses, bodies are cut off while they are read, and analyses run on the worker pool
// with a queue limit (503 + Retry-After) and a time limit, while /api/health keeps answering.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { foundations } from "@/db/schema";
import { createFoundation } from "@/db/queries/projects";
import { INPUT_LIMITS } from "@/modules/calc";
import { resetAnalysisPool, spinInPool } from "@/app/_lib/analysis-pool";
import { POST as calculatePost } from "@/app/api/v1/calculate/route";
import { callRoute, getFixture, type Fixture } from "./support/fixture";
import { hostileInput, pumpTrainInput, worstAcceptedInput } from "../support/limit-inputs";

const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";
const L = INPUT_LIMITS;

interface ErrorBody {
  error: { code: string; message: string; issues?: { path: string; message: string }[] };
}

let fx: Fixture;
let params: { projectId: string; foundationId: string };

beforeAll(async () => {
  fx = await getFixture();
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const own = await createFoundation(manager, fx.projectId, { tag: `IT-LIMITS-${Date.now()}`, machineTrain: "Test train", location: "Test bay" });
  params = { projectId: fx.projectId, foundationId: own.id };
  await resetAnalysisPool();
});

afterAll(async () => {
  await getDb().delete(foundations).where(eq(foundations.id, params.foundationId));
  await resetAnalysisPool();
});

const calculate = (body: unknown, cookie: string | null = fx.cookies.viewer) => callRoute("v1/calculate", "POST", {}, { cookie, body });
const putDraft = async (input: unknown) => {
  const current = (await (await callRoute(DRAFT, "GET", params, { cookie: fx.cookies.designer })).json()) as { draft: { version: number; input: unknown } };
  return callRoute(DRAFT, "PUT", params, { cookie: fx.cookies.designer, body: { version: current.draft.version, input } });
};
const issuePaths = async (res: Response) => ((await res.json()) as ErrorBody).error.issues?.map((i) => i.path) ?? [];

type Doc = ReturnType<typeof pumpTrainInput>;
const overLimit: [string, (d: Doc) => void][] = [
  ["block.solids", (d) => (d.block.solids = Array.from({ length: L.maxSolids + 1 }, (_, i) => ({ name: `s${i}`, x: [i, i + 1], y: [0, 1], z: [0, 1] })))],
  ["machines", (d) => (d.machines = Array.from({ length: L.maxMachines + 1 }, (_, i) => ({ ...d.machines[0], name: `m${i}`, rotors: [] })))],
  ["machines[0].rotors", (d) => (d.machines[0].rotors = Array.from({ length: L.maxRotorsPerMachine + 1 }, (_, i) => ({ ...d.machines[0].rotors[0], name: `r${i}`, mass: 1 })))],
  ["machines[0].rotors[0].bearings", (d) => (d.machines[0].rotors[0].bearings = Array.from({ length: L.maxBearingsPerRotor + 1 }, (_, i) => [0.1 * i, 0.1 * i, 1]))],
  ["checkPoints", (d) => (d.checkPoints = Array.from({ length: L.maxCheckPoints + 1 }, (_, i) => ({ name: `p${i}`, position: [0, 0, 1] })))],
  ["sweep.points", (d) => (d.sweep.points = L.maxSweepPoints + 1)],
  ["transient", (d) => (d.transient = Array.from({ length: L.maxTransientRuns + 1 }, () => ({ machine: d.machines[0].name, rotor: d.machines[0].rotors[0].name, kind: "run-up", durationS: 10 })))],
  ["transient[0].outputPoints", (d) => (d.transient = [{ machine: d.machines[0].name, rotor: d.machines[0].rotors[0].name, kind: "run-up", durationS: 10, outputPoints: L.maxTransientOutputPoints + 1 }])],
];

describe("the contract's limits over HTTP", () => {
  it("refuses the probe's input (2,000 check points, 10,000 sweep points) with 400 naming both fields", async () => {
    const res = await calculate(hostileInput());
    expect(res.status).toBe(400);
    expect(await issuePaths(res)).toEqual(expect.arrayContaining(["checkPoints", "sweep.points"]));
    const draft = await putDraft(hostileInput());
    expect(draft.status).toBe(400);
    expect(await issuePaths(draft)).toEqual(expect.arrayContaining(["checkPoints", "sweep.points"]));
  });

  it.each(overLimit)("%s over its maximum: 400 naming it, from calculate and from the draft PUT", async (path, change) => {
    const doc = pumpTrainInput();
    change(doc);
    const res = await calculate(doc);
    expect(res.status).toBe(400);
    expect(await issuePaths(res)).toContain(path);
    const draft = await putDraft(doc);
    expect(draft.status).toBe(400);
    expect(await issuePaths(draft)).toContain(path);
  });

  it("the draft PUT refuses 1e308 (and stores nothing), as the calculation does", async () => {
    expect((await putDraft(pumpTrainInput())).status).toBe(200);
    const before = (await (await callRoute(DRAFT, "GET", params, { cookie: fx.cookies.designer })).json()) as { draft: { version: number; input: { block: { concreteDensity: number } } } };
    const doc = pumpTrainInput();
    doc.block.concreteDensity = 1e308;
    const res = await putDraft(doc);
    expect(res.status).toBe(400);
    expect(await issuePaths(res)).toContain("block.concreteDensity");
    expect((await calculate(doc)).status).toBe(400);
    const after = (await (await callRoute(DRAFT, "GET", params, { cookie: fx.cookies.designer })).json()) as typeof before;
    expect(after.draft.version).toBe(before.draft.version);
    expect(after.draft.input.block.concreteDensity).toBe(pumpTrainInput().block.concreteDensity);
  });
});

describe("request bodies", () => {
  it("a chunked body without Content-Length is refused with 413 once past 1 MB, without reading it whole", async () => {
    let pulled = 0;
    const chunk = new TextEncoder().encode(" ".repeat(64 * 1024));
    const total = 300 * 1024 * 1024;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (pulled >= total) return controller.close();
        pulled += chunk.byteLength;
        controller.enqueue(chunk);
      },
    });
    const request = new Request("http://127.0.0.1:3100/api/v1/calculate", {
      method: "POST",
      headers: { host: "127.0.0.1:3100", cookie: fx.cookies.viewer, "content-type": "application/json", "transfer-encoding": "chunked" },
      body,
      duplex: "half",
    } as RequestInit);
    expect(request.headers.get("content-length")).toBeNull();
    const res = await calculatePost(request, { params: Promise.resolve({}) });
    expect(res.status).toBe(413);
    expect(((await res.json()) as ErrorBody).error.code).toBe("payload_too_large");
    // 1 MB and at most a few chunks of look-ahead, never the 300 MB
    expect(pulled).toBeLessThan(2 * 1024 * 1024);
  });
});

describe("the analysis pool", () => {
  it("keeps /api/health answering within 200 ms while the heaviest accepted input and the probe's input are posted", async () => {
    await resetAnalysisPool();
    // a warm worker, so that the timing below is of analyses, not of loading the engine
    expect((await calculate(pumpTrainInput())).status).toBe(200);
    let done = false;
    const heavy = calculate(worstAcceptedInput()).finally(() => (done = true));
    const hostile = calculate(hostileInput());
    const latencies: number[] = [];
    while (!done) {
      const t0 = performance.now();
      const res = await callRoute("health", "GET", {});
      latencies.push(performance.now() - t0);
      expect(res.status).toBe(200);
      await new Promise((r) => setTimeout(r, 20));
    }
    const heavyRes = await heavy;
    expect(heavyRes.status).toBe(200);
    const result = (await heavyRes.json()) as { sweep: { frequencyHz: number[]; sampling?: { fullPoints: number } }; transient?: unknown[] };
    // the default answer is plot-sampled; the sweep behind it had every point
    expect(result.sweep.sampling?.fullPoints).toBe(worstAcceptedInput().sweep.points);
    expect(result.transient).toHaveLength(L.maxTransientRuns);
    expect((await hostile).status).toBe(400);
    // the analysis took long enough for many health checks to be sent meanwhile
    expect(latencies.length).toBeGreaterThan(5);
    expect(Math.max(...latencies)).toBeLessThan(200);
    console.log(`[request-limits] ${latencies.length} health checks during the analysis, max ${Math.max(...latencies).toFixed(1)} ms`);
  }, 60_000);

  it("answers 503 busy with Retry-After when every worker is busy and the queue is full", async () => {
    await resetAnalysisPool({ size: 1, queue: 1, timeoutMs: 20_000 });
    const spins = [spinInPool(), spinInPool()].map((p) => p.catch((e: Error) => e));
    const res = await calculate(pumpTrainInput());
    expect(res.status).toBe(503);
    expect(res.headers.get("retry-after")).toMatch(/^\d+$/);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.code).toBe("busy");
    await resetAnalysisPool();
    await Promise.all(spins);
    expect((await calculate(pumpTrainInput())).status).toBe(200);
  }, 60_000);

  it("stops an analysis past its time limit with a clear 422, and the next analysis gets a fresh worker", async () => {
    await resetAnalysisPool({ timeoutMs: 150 });
    // warm the worker (its start does not count towards the limit)
    await spinInPool().catch(() => undefined);
    const res = await calculate(worstAcceptedInput());
    expect(res.status).toBe(422);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.code).toBe("analysis_limit");
    expect(body.error.message).toMatch(/longer than 0.15 s/);
    expect((await calculate(pumpTrainInput())).status).toBe(200);
    await resetAnalysisPool();
  }, 60_000);
});
