// POST /api/v1/calculate answers a plot-sized sweep by default (?series=plot), the whole sweep
// with ?series=full and none with ?series=none; everything outside the sweep is the same in all.
import { readFileSync, readdirSync } from "node:fs";
import { gzipSync } from "node:zlib";
import { beforeAll, describe, expect, it } from "vitest";
import { ENGINE_VERSION, analyse, parseAnalysisInput, type AnalysisResult } from "@/modules/calc";
import { POST } from "@/app/api/v1/calculate/route";
import { callRoute, getFixture, makeRequest, type Fixture } from "./support/fixture";

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});

const examples = readdirSync("examples")
  .filter((f) => f.endsWith(".json"))
  .map((f) => ({ name: f, doc: JSON.parse(readFileSync(`examples/${f}`, "utf8")) as unknown }));

async function calculate(doc: unknown, query = ""): Promise<Response> {
  return POST(makeRequest("POST", `/api/v1/calculate${query}`, { cookie: fx.cookies.designer, body: doc }), { params: Promise.resolve({}) });
}

function engineResult(doc: unknown): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error("example does not parse");
  return analyse(parsed.input);
}

type Sampled = AnalysisResult & { sweep: AnalysisResult["sweep"] & { sampling?: { mode: string; points: number; fullPoints: number } } };

describe("POST /api/v1/calculate sweep series", () => {
  it("has examples to check", () => expect(examples.length).toBeGreaterThanOrEqual(5));

  it.each(examples)("$name: the default answer is at most 100 KB compressed, a plot's worth of points, and keeps every peak", async ({ doc }) => {
    const res = await calculate(doc);
    expect(res.status).toBe(200);
    const text = await res.text();
    // next start compresses with gzip (next.config compress, the default); the bound is on what crosses the wire
    expect(gzipSync(text).length).toBeLessThanOrEqual(100 * 1024);
    const lean = JSON.parse(text) as Sampled;
    const full = engineResult(doc);
    const { sweep: leanSweep, ...leanRest } = lean;
    const { sweep: fullSweep, ...fullRest } = full;
    // outside the sweep, the answer is the engine's to the last digit
    expect(leanRest).toStrictEqual(JSON.parse(JSON.stringify(fullRest)));
    expect(leanSweep.sampling).toEqual({ mode: "plot", points: leanSweep.frequencyHz.length, fullPoints: fullSweep.frequencyHz.length });
    expect(leanSweep.frequencyHz.length).toBeLessThan(fullSweep.frequencyHz.length / 3);
    expect(leanSweep.frequencyHz[0]).toBe(fullSweep.frequencyHz[0]);
    expect(leanSweep.frequencyHz.at(-1)).toBe(fullSweep.frequencyHz.at(-1));
    expect(leanSweep.series).toHaveLength(fullSweep.series.length);
    fullSweep.series.forEach((s, k) => {
      const l = leanSweep.series[k]!;
      expect({ ...l, displacementPeak: [], velocityPeak: [] }).toEqual({ ...s, displacementPeak: [], velocityPeak: [] });
      expect(l.displacementPeak).toHaveLength(leanSweep.frequencyHz.length);
      // the largest value of every curve survives, at its own frequency
      expect(Math.max(...l.displacementPeak)).toBe(Math.max(...s.displacementPeak));
      expect(Math.max(...l.velocityPeak)).toBe(Math.max(...s.velocityPeak));
      const at = s.displacementPeak.indexOf(Math.max(...s.displacementPeak));
      expect(leanSweep.frequencyHz[l.displacementPeak.indexOf(Math.max(...l.displacementPeak))]).toBe(fullSweep.frequencyHz[at]);
      // every kept value is the full sweep's own at that frequency
      leanSweep.frequencyHz.forEach((f, i) => expect(l.velocityPeak[i]).toBe(s.velocityPeak[fullSweep.frequencyHz.indexOf(f)]));
    });
    (fullSweep.transmissibility ?? []).forEach((t, k) => expect(Math.max(...leanSweep.transmissibility![k]!.values)).toBe(Math.max(...t.values)));
    // the grid point nearest each natural frequency in the band is kept
    for (const m of full.modes) {
      const f = fullSweep.frequencyHz;
      if (m.frequencyHz < f[0]! || m.frequencyHz > f.at(-1)!) continue;
      const nearest = f.reduce((b, x) => (Math.abs(x - m.frequencyHz) < Math.abs(b - m.frequencyHz) ? x : b), f[0]!);
      expect(leanSweep.frequencyHz).toContain(nearest);
    }
  });

  it.each(examples)("$name: ?series=full answers the whole sweep, identical to analyse", async ({ doc }) => {
    const res = await calculate(doc, "?series=full");
    expect(res.status).toBe(200);
    expect(await res.text()).toBe(JSON.stringify(engineResult(doc)));
  });

  it("?series=none answers no series and the same checks", async () => {
    const doc = examples[0]!.doc;
    const res = await calculate(doc, "?series=none");
    expect(res.status).toBe(200);
    const none = (await res.json()) as Sampled;
    expect(none.sweep.series).toEqual([]);
    expect(none.sweep.frequencyHz).toEqual([]);
    expect(none.sweep.sampling?.mode).toBe("none");
    expect(none.checks).toEqual(JSON.parse(JSON.stringify(engineResult(doc).checks)));
  });

  it("refuses an unknown series value with 400 naming the parameter", async () => {
    const res = await calculate(examples[0]!.doc, "?series=everything");
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues.map((i) => i.path)).toEqual(["series"]);
  });

  it("GET /api/v1/engine names the server's engine, which the workspace compares with its own", async () => {
    const res = await callRoute("v1/engine", "GET", {}, { cookie: fx.cookies.viewer });
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ engineVersion: ENGINE_VERSION, schemaVersion: 1 });
    expect((await callRoute("v1/engine", "GET", {}, { cookie: null })).status).toBe(401);
  });
});
