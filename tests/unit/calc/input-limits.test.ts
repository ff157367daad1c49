// The contract's size and magnitude limits (INPUT_LIMITS): the parser and the partial-document
// check name the same field; the heaviest accepted input still parses.
import { describe, expect, it } from "vitest";
import { checkInputBounds, formatPath, INPUT_LIMITS, parseAnalysisInput } from "@/modules/calc";
import { hostileInput, pumpTrainInput, worstAcceptedInput } from "../../support/limit-inputs";

const L = INPUT_LIMITS;
type Doc = ReturnType<typeof pumpTrainInput>;

const parserPaths = (doc: unknown) => {
  const parsed = parseAnalysisInput(doc);
  return parsed.ok ? [] : parsed.issues.map((i) => i.path);
};
const boundPaths = (doc: unknown) => checkInputBounds(doc).map((i) => formatPath(i.path));

const overLimit: [string, string, (d: Doc) => void][] = [
  ["solids", "block.solids", (d) => (d.block.solids = Array.from({ length: L.maxSolids + 1 }, (_, i) => ({ name: `s${i}`, x: [i, i + 1], y: [0, 1], z: [0, 1] })))],
  ["machines", "machines", (d) => (d.machines = Array.from({ length: L.maxMachines + 1 }, (_, i) => ({ ...d.machines[0], name: `m${i}`, rotors: [] })))],
  ["rotors per machine", "machines[0].rotors", (d) => (d.machines[0].rotors = Array.from({ length: L.maxRotorsPerMachine + 1 }, (_, i) => ({ ...d.machines[0].rotors[0], name: `r${i}`, mass: 1 })))],
  ["bearings per rotor", "machines[0].rotors[0].bearings", (d) => (d.machines[0].rotors[0].bearings = Array.from({ length: L.maxBearingsPerRotor + 1 }, (_, i) => [0.1 * i, 0.1 * i, 1]))],
  ["check points", "checkPoints", (d) => (d.checkPoints = Array.from({ length: L.maxCheckPoints + 1 }, (_, i) => ({ name: `p${i}`, position: [0, 0, 1] })))],
  ["sweep points", "sweep.points", (d) => (d.sweep.points = L.maxSweepPoints + 1)],
  ["speed-ramp runs", "transient", (d) => (d.transient = Array.from({ length: L.maxTransientRuns + 1 }, () => ({ machine: d.machines[0].name, rotor: d.machines[0].rotors[0].name, kind: "run-up", durationS: 10 })))],
  ["speed-ramp output points", "transient[0].outputPoints", (d) => (d.transient = [{ machine: d.machines[0].name, rotor: d.machines[0].rotors[0].name, kind: "run-up", durationS: 10, outputPoints: L.maxTransientOutputPoints + 1 }])],
  ["a text", "machines[0].name", (d) => (d.machines[0].name = "x".repeat(L.maxTextLength + 1))],
  ["a number's magnitude", "block.concreteDensity", (d) => (d.block.concreteDensity = 1e308)],
  ["a negative magnitude", "checkPoints[0].position[0]", (d) => (d.checkPoints[0].position[0] = -1e17)],
];

describe("input limits", () => {
  it("a band acceptance's justification may be a paragraph (up to maxJustificationLength), not a name's 100 characters", () => {
    const doc = pumpTrainInput() as Doc & { acceptances?: { checkKey: string; justification: string }[] };
    const paragraph = "Cross-hole tests on the compacted fill bound G at 1.2 x nominal; see the geotechnical addendum. ".repeat(4);
    expect(paragraph.length).toBeGreaterThan(L.maxTextLength);
    doc.acceptances = [{ checkKey: "frequency-separation@soil-upper/pump/impeller", justification: paragraph }];
    expect(boundPaths(doc)).toEqual([]);
    expect(parserPaths(doc).filter((p) => p.startsWith("acceptances[0].justification"))).toEqual([]);
    doc.acceptances[0]!.justification = "x".repeat(L.maxJustificationLength + 1);
    expect(boundPaths(doc)).toEqual(["acceptances[0].justification"]);
    expect(parserPaths(doc)).toContain("acceptances[0].justification");
  });

  it.each(overLimit)("%s: the parser and checkInputBounds both name %s", (_what, path, change) => {
    const doc = pumpTrainInput();
    change(doc);
    expect(parserPaths(doc)).toContain(path);
    expect(boundPaths(doc)).toContain(path);
  });

  it("rotors of all machines together, and the sweep's output budget", () => {
    const doc = worstAcceptedInput();
    doc.machines.push({ ...doc.machines[0], name: "one more", rotors: [doc.machines[0].rotors[0]] });
    expect(parserPaths(doc)).toContain("machines");
    expect(boundPaths(doc)).toContain("machines");
    const budget = worstAcceptedInput();
    budget.sweep.points += 1;
    expect(parserPaths(budget)).toEqual(["sweep.points"]);
    expect(boundPaths(budget)).toEqual(["sweep.points"]);
  });

  it("accepts the heaviest input at the limits and the example as it is", () => {
    expect(parseAnalysisInput(worstAcceptedInput()).ok).toBe(true);
    expect(checkInputBounds(worstAcceptedInput())).toEqual([]);
    expect(checkInputBounds(pumpTrainInput())).toEqual([]);
    // usual grids stay accepted
    const fine = pumpTrainInput();
    fine.sweep.points = L.maxSweepPoints;
    expect(parseAnalysisInput(fine).ok).toBe(true);
  });

  it("refuses the probe's input (2,000 check points, 10,000 sweep points) naming both fields", () => {
    expect(parserPaths(hostileInput())).toEqual(expect.arrayContaining(["checkPoints", "sweep.points"]));
    expect(boundPaths(hostileInput())).toEqual(expect.arrayContaining(["checkPoints", "sweep.points"]));
  });

  it("checks an incomplete or malformed document without requiring anything", () => {
    expect(checkInputBounds({})).toEqual([]);
    expect(checkInputBounds(null)).toEqual([]);
    expect(checkInputBounds({ soil: { density: 1900 } })).toEqual([]);
    expect(boundPaths({ soil: { density: 1e308 }, machines: "not a list", checkPoints: Array.from({ length: 30 }, () => ({})) })).toEqual(
      expect.arrayContaining(["soil.density", "checkPoints"]),
    );
    expect(boundPaths({ sweep: { points: 1e6 } })).toEqual(["sweep.points"]);
    // a deep nesting does not overflow the stack
    let deep: unknown = 1e300;
    for (let i = 0; i < 200_000; i++) deep = [deep];
    expect(checkInputBounds({ extra: deep })).toHaveLength(1);
  });
});
