import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInput, type CheckResult } from "@/modules/calc";
import { compareChecks, isNoise, kindOfPath, labelOfPath, readableDiff, readableDiffCsv } from "@/modules/revisions";

function example(file: string): AnalysisInput {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", file), "utf8")));
  if (!parsed.ok) throw new Error(`${file} is not valid`);
  return parsed.input;
}

const demo = example("raw-water-pump-train.json");
const demoResult = analyse(demo);

const check = (over: Partial<CheckResult> & { key: string }): CheckResult => ({ id: over.key, label: over.key, value: 1, limit: 1, pass: true, source: "s", comparison: "max", ...over });

describe("verdict rows", () => {
  it("a verdict flipped by a relaxed criterion shows both limits and values and says the limit moved", () => {
    // The demo's mass ratio (2.92) fails the default least ratio 3; relaxing it to 2.5 passes it.
    const relaxed = { ...structuredClone(demo), criteria: { minMassRatio: 2.5 } };
    const d = readableDiff({ input: demo, result: demoResult }, { input: relaxed, result: analyse(relaxed) }, "si");
    const flip = d.verdicts.find((v) => v.key === "mass-ratio");
    expect(flip).toMatchObject({ flipped: true, oldVerdict: "fail", newVerdict: "pass", direction: "better", moved: "limit", oldLimit: 3, newLimit: 2.5, oldLimitText: "3.000", newLimitText: "2.500" });
    expect(flip!.oldValueText).toBe(flip!.newValueText);
    expect(d.verdicts[0]?.key).toBe("mass-ratio");
    // The changed criterion is listed first among the inputs.
    expect(d.inputs[0]).toMatchObject({ path: "criteria.minMassRatio", change: "added", label: "criteria · least block-to-machine mass ratio" });
    expect(d.inputs.find((r) => r.path === "criteria.minMassRatio.value")).toMatchObject({ label: "criterion as used · least block-to-machine mass ratio", oldText: "3.000", newText: "2.500", deltaText: "-0.500" });
    expect(d.inputs.findIndex((r) => r.path === "criteria.minMassRatio.value")).toBeLessThan(d.inputs.findIndex((r) => !r.path.startsWith("criteria")) >>> 0);
  });

  it("says the value moved, or both, and marks a value that got worse while the verdict improved or stayed pass", () => {
    const rows = compareChecks(
      [
        check({ key: "sep", comparison: "min", value: 0.15, limit: 0.2, pass: false }),
        check({ key: "disp", unit: "m", value: 10e-6, limit: 30e-6, pass: true }),
        check({ key: "vel", unit: "m/s", value: 2.5e-3, limit: 2e-3, pass: false }),
        check({ key: "ratio", comparison: "min", value: 2.5, limit: 3, pass: false }),
      ],
      [
        // separation shrank 0.15 -> 0.13 but the limit was relaxed to 0.12: passes, worse
        check({ key: "sep", comparison: "min", value: 0.13, limit: 0.12, pass: true }),
        // displacement grew 10 -> 20 µm, still passes: worse while pass
        check({ key: "disp", unit: "m", value: 20e-6, limit: 30e-6, pass: true }),
        // velocity fell below the limit: better value, better verdict
        check({ key: "vel", unit: "m/s", value: 1.5e-3, limit: 2e-3, pass: true }),
        // ratio rose with the limit unchanged
        check({ key: "ratio", comparison: "min", value: 3.2, limit: 3, pass: true }),
      ],
      "si",
    );
    const by = Object.fromEntries(rows.map((r) => [r.key, r]));
    expect(by.sep).toMatchObject({ flipped: true, moved: "both", worseWhileBetter: true });
    expect(by.disp).toMatchObject({ flipped: false, moved: "value", worseWhileBetter: true, oldValueText: "10.00", newValueText: "20.00", unit: "µm" });
    expect(by.vel).toMatchObject({ flipped: true, moved: "value", worseWhileBetter: false, newValueText: "1.500", unit: "mm/s" });
    expect(by.ratio).toMatchObject({ flipped: true, moved: "value", worseWhileBetter: false });
    // flipped first, then the unflipped one
    expect(rows.at(-1)?.key).toBe("disp");
  });

  it("keeps a band check's soil bound and an acceptance's justification", () => {
    const key = "frequency-separation@soil-upper/Motor RWM-101/rotor/mode-6";
    const justification = "Site tests bound G at 1.2 x nominal (demo text).";
    const accepted = { ...structuredClone(demo), acceptances: [{ checkKey: key, justification }] };
    const d = readableDiff({ input: demo, result: demoResult }, { input: accepted, result: analyse(accepted) }, "si");
    expect(d.verdicts.find((v) => v.key === key)).toMatchObject({ flipped: true, oldVerdict: "fail", newVerdict: "accepted", moved: "neither", soilCase: "upper", justification });
  });

  it("lists nothing between a revision and itself", () => {
    const d = readableDiff({ input: demo, result: demoResult }, { input: demo, result: demoResult }, "si");
    expect([d.verdicts, d.frequencies, d.amplitudes, d.inputs, d.results].flat()).toEqual([]);
  });
});

describe("numeric noise", () => {
  it("leaves out a change below the floor or the relative tolerance and lists one above, on both sides", () => {
    // displacement floor 1 nm: 3e-16 -> 5e-16 m is +67 % of nothing
    expect(isNoise("displacement", 3e-16, 5e-16)).toBe(true);
    expect(isNoise("displacement", 1e-6, 1.0009e-6)).toBe(true); // 0.9 nm
    expect(isNoise("displacement", 1e-6, 1.0011e-6)).toBe(false); // 1.1 nm
    // relative 1e-6 on a large value
    expect(isNoise("largeMass", 150_000, 150_000.1)).toBe(true);
    expect(isNoise("largeMass", 150_000, 150_000.2)).toBe(false);
    expect(isNoise("ratio", 0.2, 0.12)).toBe(false);
  });

  it("does not list noise in the results and counts what it left out", () => {
    const a = structuredClone(demoResult);
    const b = structuredClone(demoResult);
    const point = b.rotors[0]!.cases[0]!.points[0]!;
    point.displacementPeak = [point.displacementPeak[0] * (1 + 1e-9), point.displacementPeak[1], point.displacementPeak[2]];
    b.modes[0]!.frequencyHz += 0.01; // a real change
    const d = readableDiff({ input: demo, result: a }, { input: demo, result: b }, "si");
    expect(d.amplitudes).toEqual([]);
    expect(d.noiseCount).toBe(1);
    expect(d.frequencies.map((r) => r.label)).toEqual(["mode 1 · natural frequency"]);
    expect(d.frequencies[0]?.worseWhileBetter).toBeUndefined();
  });

  it("marks a frequency ratio that moved nearer resonance and an amplitude that grew while no verdict got worse", () => {
    const b = structuredClone(demoResult);
    const rotor = b.rotors[0]!;
    const i = 0;
    rotor.frequencyRatios[i] = rotor.frequencyRatios[i]! + (1 - rotor.frequencyRatios[i]!) / 2;
    const point = b.rotors[0]!.cases[0]!.points[0]!;
    point.displacementPeak = [point.displacementPeak[0] * 1.5, point.displacementPeak[1], point.displacementPeak[2]];
    const d = readableDiff({ input: demo, result: demoResult }, { input: demo, result: b }, "si");
    expect(d.frequencies.find((r) => r.path.endsWith(`frequencyRatios[${i}]`))?.worseWhileBetter).toBe(true);
    expect(d.amplitudes.find((r) => r.path.endsWith("displacementPeak[0]"))?.worseWhileBetter).toBe(true);
  });
});

describe("labels, groups and units", () => {
  it("names paths by the quantity, not by the document", () => {
    expect(labelOfPath('machines["Raw-water pump RWP-101"].rotors["impeller"].mass')).toBe("Raw-water pump RWP-101 · impeller · mass");
    expect(labelOfPath("soil.poissonRatio")).toBe("soil · Poisson's ratio");
    expect(labelOfPath('rotors["Motor RWM-101 / rotor"].frequencyRatios[5]')).toBe("Motor RWM-101 / rotor · frequency ratio · mode 6");
    expect(labelOfPath('rotors["M / r"].cases["vertical / static"].points["coupling"].displacementPeak[2]')).toBe("M / r · vertical / static · coupling · peak displacement · z");
    expect(kindOfPath('rotors["M / r"].cases["vertical / static"].points["coupling"].displacementPeak[2]')).toBe("displacement");
    expect(kindOfPath("impedance.stiffness.rx")).toBe("rotationalStiffness");
  });

  it("groups a re-design's changes as verdicts, frequencies and ratios, amplitudes, inputs, in display units", () => {
    const bigger = example("raw-water-pump-train-enlarged.json");
    const older = { input: demo, result: demoResult };
    const newer = { input: bigger, result: analyse(bigger) };
    const si = readableDiff(older, newer, "si");
    const us = readableDiff(older, newer, "us");
    expect(si.verdicts[0]).toMatchObject({ key: "mass-ratio", flipped: true, moved: "value" });
    expect(si.frequencies.some((r) => r.path === "modes[0].frequencyHz" && r.unit === "Hz" && r.label === "mode 1 · natural frequency")).toBe(true);
    expect(si.frequencies.some((r) => r.path === "massProperties.massRatio")).toBe(true);
    const amp = si.amplitudes.find((r) => r.quantity === "displacement");
    expect(amp?.unit).toBe("µm");
    const ampUs = us.amplitudes.find((r) => r.path === amp!.path);
    expect(ampUs?.unit).toBe("mil");
    // 1 mil = 25.4 µm
    expect(Number(ampUs!.oldText) * 25.4).toBeCloseTo(Number(amp!.oldText), 1);
    const mat = si.inputs.find((r) => r.path === 'block.solids["mat"].x[0]');
    expect(mat).toMatchObject({ label: "block · mat · x · from", unit: "m", oldText: "-3.800", newText: "-4.200", deltaText: "-0.400" });
    expect(us.inputs.find((r) => r.path === mat!.path)).toMatchObject({ unit: "ft", oldText: "-12.47" });
    const bracketed = [...si.frequencies, ...si.amplitudes, ...si.inputs, ...si.results].filter((r) => r.label.includes("[")).map((r) => r.label);
    expect(bracketed).toEqual([]);
    // the sweep is compared as plots: twice the sweep points give the same rows (size bound)
    const denser = { ...bigger, sweep: { ...bigger.sweep, points: (newer.result.sweep.frequencyHz.length ?? 100) * 2 } };
    const dense = readableDiff(older, { input: denser, result: analyse(denser) }, "si");
    expect(dense.amplitudes.length + dense.frequencies.length).toBe(si.amplitudes.length + si.frequencies.length);
    expect(dense.inputs.length).toBe(si.inputs.length + 1);
  });

  it("writes a CSV with label, raw path, SI and shown values, and defuses formula-like text", () => {
    const rows = readableDiffCsv({
      units: "si",
      noise: "",
      noiseCount: 0,
      verdicts: compareChecks([check({ key: "mass-ratio", label: "=cmd", comparison: "min", value: 2.9, limit: 3, pass: false })], [check({ key: "mass-ratio", label: "=cmd", comparison: "min", value: 2.9, limit: 2.5, pass: true })], "si"),
      frequencies: [],
      amplitudes: [],
      inputs: [],
      results: [],
    }).split("\r\n");
    expect(rows[0]).toMatch(/^group,label,path,change,old_si,new_si/);
    expect(rows[1]).toBe(`verdicts,'=cmd,"checks[""mass-ratio""]",verdict changed,2.9,2.9,2.900,2.900,,3.000,2.500,fail,pass,limit,,,`);
  });
});


describe("springs on a base block (engine 1.8.0) in the comparison", () => {
  it("names the base's inputs and its results (mass, force into the ground) in words with their units", () => {
    const a = example("fan-on-springs-base-block.json");
    const b = structuredClone(a);
    if (b.impedance.method !== "springs" || !b.impedance.base) throw new Error("example has no base");
    b.impedance.base.z = [-2.4, -0.3];
    const d = readableDiff({ input: a, result: analyse(a) }, { input: b, result: analyse(b) }, "si");
    const z = d.inputs.find((r) => r.path === "impedance.base.z[0]");
    expect(z).toMatchObject({ label: "impedance · base block under the springs · z · from", quantity: "length", unit: "m", oldText: "-2.100", newText: "-2.400" });
    const mass = d.results.find((r) => r.path === "springs.base.mass");
    expect(mass?.quantity).toBe("largeMass");
    expect(mass?.unit).toBe("t");
    const ground = [...d.results, ...d.amplitudes].find((r) => /groundForce\[2\]$/.test(r.path));
    expect(ground?.label).toMatch(/force into the ground · z$/);
    expect(ground?.quantity).toBe("force");
    expect(kindOfPath("springs.base.soilStiffness.rx")).toBe("rotationalStiffness");
    expect(labelOfPath("impedance.base.support.method")).toBe("impedance · base block under the springs · soil under the base · method");
  });
});
