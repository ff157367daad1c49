// Start-up and coast-down runs in the revision comparison: each run is named by its rotor,
// ramp and load case (not by its place in the list), its settings, peaks, model and warnings
// are compared field by field, and its envelope series are left out of the lists like the
// frequency sweep.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInput, type AnalysisInputDocument, type TransientRequestDocument } from "@/modules/calc";
import { diffRevisions, listLeafPaths, withoutLongSeries } from "@/modules/revisions";

const MOTOR = "Motor RWM-101";
const PUMP = "Raw-water pump RWP-101";

function pumpTrain(runs?: TransientRequestDocument[]): AnalysisInput {
  const doc = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")) as AnalysisInputDocument;
  if (runs) doc.transient = runs;
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; "));
  return parsed.input;
}

const revision = (input: AnalysisInput) => ({ input, result: analyse(input) });

// Short ramps keep the integration quick; the comparison does not depend on their length.
const startUp: TransientRequestDocument = { machine: MOTOR, rotor: "rotor", kind: "run-up", durationS: 2, outputPoints: 50 };
const coastDown: TransientRequestDocument = { machine: MOTOR, rotor: "rotor", kind: "coast-down", durationS: 3, outputPoints: 50 };
const pumpStart: TransientRequestDocument = { machine: PUMP, rotor: "impeller", kind: "run-up", durationS: 2, outputPoints: 50 };

describe("speed ramps in the revision comparison", () => {
  const without = revision(pumpTrain());
  const withRuns = revision(pumpTrain([startUp, coastDown]));

  it("names an added run by rotor, ramp and load case in the inputs, and by unbalance as well in the results", () => {
    const d = diffRevisions(without, withRuns);
    const startKey = `transient[${JSON.stringify(`${MOTOR} / rotor / run-up / rotating`)}]`;
    const coastKey = `transient[${JSON.stringify(`${MOTOR} / rotor / coast-down / rotating`)}]`;
    expect(d.input.entries.filter((e) => e.group === "transient").map((e) => [e.kind, e.path, e.new])).toEqual([
      ["added", `${startKey}.machine`, MOTOR],
      ["added", `${startKey}.rotor`, "rotor"],
      ["added", `${startKey}.kind`, "run-up"],
      ["added", `${startKey}.durationS`, 2],
      ["added", `${startKey}.case`, "rotating"],
      ["added", `${startKey}.outputPoints`, 50],
      ["added", `${coastKey}.machine`, MOTOR],
      ["added", `${coastKey}.rotor`, "rotor"],
      ["added", `${coastKey}.kind`, "coast-down"],
      ["added", `${coastKey}.durationS`, 3],
      ["added", `${coastKey}.case`, "rotating"],
      ["added", `${coastKey}.outputPoints`, 50],
    ]);
    const peak = d.result.entries.find((e) => e.path === `transient[${JSON.stringify(`${MOTOR} / rotor / run-up / rotating / static`)}].peakDisplacement.value`);
    expect(peak).toMatchObject({ kind: "added", new: withRuns.result.transient?.[0]?.peakDisplacement.value });
    expect(d.result.entries.some((e) => e.path.endsWith(".steadyStateMax.velocityPeak") && e.path.includes("coast-down"))).toBe(true);
  });

  it("leaves the envelope series out of the lists, and nothing else of the run", () => {
    const d = diffRevisions(without, withRuns);
    const transientPaths = d.result.entries.filter((e) => e.group === "transient").map((e) => e.path);
    expect(transientPaths.some((p) => p.includes(".series"))).toBe(false);
    const run = withRuns.result.transient?.[0];
    if (!run) throw new Error("no run in the result");
    // every leaf of the run but its series is listed: settings, peaks, model, points, warnings
    const listed = transientPaths.filter((p) => p.includes("run-up")).length;
    const { series, ...rest } = run;
    expect(series.timeS).toHaveLength(50);
    expect(listed).toBe(listLeafPaths(rest).length);
    expect(listLeafPaths(withoutLongSeries(withRuns.result)).some((p) => p.path.includes("series") || p.path.startsWith("sweep"))).toBe(false);
    expect(withRuns.result.transient?.[0]?.series.timeS).toHaveLength(50);
  });

  it("matches runs by name, not by place: reordering them is no change, a longer ramp is one", () => {
    const reordered = revision(pumpTrain([coastDown, startUp]));
    const same = diffRevisions(withRuns, reordered);
    expect(same.input.entries).toEqual([]);
    expect(same.result.entries.filter((e) => e.group === "transient")).toEqual([]);

    const longer = revision(pumpTrain([{ ...startUp, durationS: 4 }, coastDown]));
    const d = diffRevisions(withRuns, longer);
    expect(d.input.entries).toEqual([
      {
        path: `transient[${JSON.stringify(`${MOTOR} / rotor / run-up / rotating`)}].durationS`,
        group: "transient",
        kind: "changed",
        old: 2,
        new: 4,
        absoluteChange: 2,
        percentChange: 100,
      },
    ]);
    expect(d.result.entries.some((e) => e.path.includes("run-up") && e.path.endsWith(".durationS"))).toBe(true);
    expect(d.result.entries.some((e) => e.path.includes("coast-down"))).toBe(false);
  });

  it("falls back to the place in the list when two runs share rotor, ramp and case", () => {
    const twice = revision(pumpTrain([startUp, { ...startUp, durationS: 3 }, pumpStart]));
    const d = diffRevisions(withRuns, twice);
    expect(d.input.entries.find((e) => e.path === "transient[1].kind")).toMatchObject({ kind: "changed", old: "coast-down", new: "run-up" });
    expect(d.input.entries.find((e) => e.path === "transient[2].machine")).toMatchObject({ kind: "added", new: PUMP });
  });
});
