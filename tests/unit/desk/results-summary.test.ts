// The workspace's compact results summary, on the demo pump train: the governing check, the
// frequencies, each rotor's ratio nearest to resonance, and the soil band's verdict.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument, type AnalysisResult } from "@/modules/calc";
import { summariseResults } from "@/modules/desk/results-summary";

const examples = path.resolve(import.meta.dirname, "../../../examples");
const load = () => JSON.parse(readFileSync(path.join(examples, "raw-water-pump-train.json"), "utf8")) as AnalysisInputDocument;
function run(doc: AnalysisInputDocument): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}
const JUSTIFICATION = "Measured G at the site stays below 1.2 x nominal (demo text for the test).";

describe("results summary", () => {
  const result = run(load());
  const s = summariseResults(result);

  it("names the governing check (the separation at the upper soil bound) and counts the failures", () => {
    expect(s.governing?.label).toMatch(/^At the upper soil bound/);
    expect(s.governing?.verdict).toBe("fail");
    expect(s.failing).toBe(3);
    expect(s.total).toBe(result.checks.length);
  });

  it("gives every natural frequency and, per rotor, the ratio nearest to 1", () => {
    expect(s.frequenciesHz).toEqual(result.modes.map((m) => m.frequencyHz));
    expect(s.rotors.length).toBe(result.rotors.length);
    for (const [i, r] of s.rotors.entries()) {
      const rotor = result.rotors[i]!;
      // 1785 rpm against each mode: r = (1785 / 60) / f_i
      const ratios = result.modes.map((m) => rotor.speedRpm / 60 / m.frequencyHz);
      const nearest = Math.min(...ratios.map((q) => Math.abs(q - 1)));
      expect(Math.abs(r.nearestRatio - 1)).toBeCloseTo(nearest, 9);
      expect(r.nearestRatio).toBeCloseTo(ratios[r.mode - 1]!, 9);
    }
  });

  it("says the soil band fails while a band check fails openly, and 'accepted' once every band failure is accepted", () => {
    expect(s.soilBand?.verdict).toBe("fail");
    expect(s.soilBand?.total).toBe(result.checks.filter((c) => c.soilCase).length);
    expect(s.soilBand?.failing).toBe(2);
    const doc = load();
    const keys = result.checks.filter((c) => !c.pass && c.soilCase).map((c) => c.key!);
    const accepted = summariseResults(run({ ...doc, acceptances: keys.map((checkKey) => ({ checkKey, justification: JUSTIFICATION })) }));
    expect(accepted.soilBand?.verdict).toBe("accepted");
    expect(accepted.soilBand?.accepted).toBe(2);
    // the mass ratio still fails at nominal soil: the governing verdict stays a failure
    expect(accepted.governing?.verdict).toBe("fail");
  });
});
