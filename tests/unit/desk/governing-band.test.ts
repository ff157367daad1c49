// The project table's governing check with the band checks at both soil bounds
// (modules/calc/band-checks.ts): a band failure can govern, and an accepted one stays a failure.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument, type AnalysisResult } from "@/modules/calc";
import { governingCheck, sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";

const examples = path.resolve(import.meta.dirname, "../../../examples");
const load = (file: string) => JSON.parse(readFileSync(path.join(examples, file), "utf8")) as AnalysisInputDocument;
function run(doc: AnalysisInputDocument): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}
const JUSTIFICATION = "Measured G at the site stays below 1.2 x nominal (demo text for the test).";
const upperKeys = (r: AnalysisResult) => r.checks.filter((c) => !c.pass && c.soilCase === "upper").map((c) => c.key!);

describe("governing check with the soil band", () => {
  it("the demo pump train is governed by the separation at the upper soil bound, not by the mass ratio", () => {
    const g = governingCheck(run(load("raw-water-pump-train.json")))!;
    expect(g.verdict).toBe("fail");
    expect(g.pass).toBe(false);
    expect(g.soil).toBe("upper soil bound (G x 1.5)");
    expect(g.label).toMatch(/^At the upper soil bound \(G x 1\.5\): Mode 6/);
    expect(g.utilisation).toBeCloseTo(0.2 / 0.0231, 1);
    expect(g.failing).toBe(3);
    expect(g.accepted).toBe(0);
  });

  it("accepted band failures come after the open failures, and still count as failing", () => {
    const doc = load("raw-water-pump-train.json");
    const keys = upperKeys(run(doc));
    const g = governingCheck(run({ ...doc, acceptances: keys.map((checkKey) => ({ checkKey, justification: JUSTIFICATION })) }))!;
    expect(g.label).toMatch(/mass/i);
    expect(g.verdict).toBe("fail");
    expect(g.failing).toBe(3);
    expect(g.accepted).toBe(2);
  });

  it("when every failure is accepted, the governing check shows 'accepted' with the justification, never a pass", () => {
    const doc = load("raw-water-pump-train-enlarged.json");
    const keys = upperKeys(run(doc));
    expect(keys).toHaveLength(2);
    const result = run({ ...doc, acceptances: keys.map((checkKey) => ({ checkKey, justification: JUSTIFICATION })) });
    const g = governingCheck(result)!;
    expect(g.pass).toBe(false);
    expect(g.verdict).toBe("accepted");
    expect(g.justification).toBe(JUSTIFICATION);
    expect(g.accepted).toBe(2);
    const sorted = sortChecksGoverningFirst(result.checks);
    expect(sorted.slice(0, 2).every((c) => c.acceptance)).toBe(true);
    expect(sorted[2]!.pass).toBe(true);
  });
});
