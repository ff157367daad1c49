// Issue 19, item 1, against the production server (`next start`): the probe's input is refused
// with the fields named, and /api/health keeps answering while the heaviest input the contract
// accepts is analysed (on the analysis pool that Next's build bundles). The property is that the
// server answers during the analysis, not after it: asserted by counts and by the health answers
// being short against the analysis itself, never by a wall-clock bound (the absolute latency is
// a speed figure and is measured by `npm run bench`).
import { beforeAll, describe, expect, it } from "vitest";
import { appUrl } from "./support/browser";
import { DEMO_PASSWORD, demo } from "./support/desk";
import { hostileInput, worstAcceptedInput } from "../support/limit-inputs";

let cookie: string;

beforeAll(async () => {
  const res = await fetch(`${appUrl}/api/v1/session`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email: demo.viewer.email, password: DEMO_PASSWORD }),
  });
  expect(res.status).toBe(200);
  cookie = (res.headers.get("set-cookie") ?? "").split(";")[0] ?? "";
  expect(cookie).toContain("=");
});

// ?series=full: the heaviest answer (the default is plot-sampled)
const calculate = (body: unknown) => fetch(`${appUrl}/api/v1/calculate?series=full`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body: JSON.stringify(body) });

describe("no single request stops the server", () => {
  it("refuses the probe's input (2,000 check points, 10,000 sweep points) with 400 naming both fields", async () => {
    const res = await calculate(hostileInput());
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues.map((i) => i.path)).toEqual(expect.arrayContaining(["checkPoints", "sweep.points"]));
  });

  it("keeps answering /api/health while the heaviest accepted input and the probe's input are analysed", async () => {
    let done = false;
    const started = performance.now();
    let analysisMs = 0;
    // `done` when the answer's headers arrive (the analysis is over); the 18 MB body is read after
    // the loop, so this process's own JSON parsing never counts against the server's latency.
    const heavy = calculate(worstAcceptedInput()).finally(() => {
      done = true;
      analysisMs = performance.now() - started;
    });
    const hostile = calculate(hostileInput()).then((r) => r.status);
    const latencies: number[] = [];
    while (!done) {
      const t0 = performance.now();
      const res = await fetch(`${appUrl}/api/health`);
      await res.arrayBuffer();
      latencies.push(performance.now() - t0);
      expect(res.status).toBe(200);
      await new Promise((r) => setTimeout(r, 25));
    }
    const response = await heavy;
    expect(response.status).toBe(200);
    const body = (await response.json()) as { sweep: { frequencyHz: number[] } };
    expect(body.sweep.frequencyHz).toHaveLength(worstAcceptedInput().sweep.points);
    expect(await hostile).toBe(400);
    expect(latencies.length).toBeGreaterThan(5);
    // A blocked server would answer the first health check only after the analysis: one long
    // latency close to the analysis time. Each answer must be a small part of it instead.
    expect(Math.max(...latencies)).toBeLessThan(analysisMs / 4);
    console.log(`[request-limits e2e] ${latencies.length} health checks during a ${analysisMs.toFixed(0)} ms analysis, max ${Math.max(...latencies).toFixed(1)} ms`);
  });
});
