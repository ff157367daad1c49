// What the desk draws beside a speed ramp: the harmonic steady state of the frequency sweep
// over the ramp's speeds, the operating range, the natural frequencies passed, and the time
// at which a speed is reached.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument, type AnalysisResult, type TransientRequestDocument } from "@/modules/calc";
import { operatingRangeRpm, passedNaturalFrequencies, speedRampTitle, steadyStateCurve, timeAtRpm } from "@/modules/desk/speed-ramps";

function analysed(file: string, runs: TransientRequestDocument[]): AnalysisResult {
  const doc = JSON.parse(readFileSync(path.join(process.cwd(), "examples", file), "utf8")) as AnalysisInputDocument;
  const parsed = parseAnalysisInput({ ...doc, transient: runs });
  if (!parsed.ok) throw new Error(parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; "));
  return analyse(parsed.input);
}

describe("speed-ramp figures", () => {
  const pump = analysed("raw-water-pump-train.json", [
    { machine: "Motor RWM-101", rotor: "rotor", kind: "run-up", durationS: 3, outputPoints: 100 },
    { machine: "Raw-water pump RWP-101", rotor: "impeller", kind: "coast-down", toRpm: 600, durationS: 4, case: "vertical", outputPoints: 100 },
  ]);
  const [startUp, coastDown] = pump.transient ?? [];
  if (!startUp || !coastDown) throw new Error("two runs expected");

  it("the steady-state curve is the sweep's envelope over the run's bearings, inside the run's speeds, never above the engine's largest steady state", () => {
    const curve = steadyStateCurve(pump, coastDown);
    expect(curve.rpm.length).toBeGreaterThan(50);
    expect(Math.min(...curve.rpm)).toBeGreaterThanOrEqual(600);
    expect(Math.max(...curve.rpm)).toBeLessThanOrEqual(1785);
    const bearings = coastDown.points.map((p) => p.name);
    const series = pump.sweep.series.filter((s) => s.rotor === "impeller" && s.case === "vertical" && s.unbalanceMode === "static" && bearings.includes(s.point));
    expect(series).toHaveLength(bearings.length);
    const i = pump.sweep.frequencyHz.findIndex((f) => f * 60 >= 600);
    expect(curve.displacement[0]).toBe(Math.max(...series.map((s) => s.displacementPeak[i] as number)));
    expect(curve.velocity[0]).toBe(Math.max(...series.map((s) => s.velocityPeak[i] as number)));
    // the engine's maximum is refined between sweep speeds, so the sampled curve cannot exceed it
    expect(Math.max(...curve.displacement)).toBeLessThanOrEqual(coastDown.steadyStateMax.displacementPeak * (1 + 1e-9));
    expect(Math.max(...curve.displacement)).toBeGreaterThan(0.9 * coastDown.steadyStateMax.displacementPeak);
  });

  it("a run on a case the sweep lacks gives no curve rather than another case's", () => {
    expect(steadyStateCurve(pump, { ...startUp, case: "horizontal", unbalanceMode: "couple", rotor: "no such rotor" }).rpm).toEqual([]);
  });

  it("places speeds in time on a constant-rate ramp, either way", () => {
    expect(timeAtRpm(startUp, 1785 / 2)).toBeCloseTo(1.5, 12);
    expect(timeAtRpm(coastDown, 600)).toBeCloseTo(4, 12);
    expect(timeAtRpm(coastDown, 1785)).toBeCloseTo(0, 12);
  });

  it("takes the operating range from the result, the rated speed alone for a fixed-speed rotor", () => {
    expect(operatingRangeRpm(pump, startUp)).toEqual([1785, 1785]);
    const blower = analysed("aeration-blower.json", [{ machine: "Blower motor ABM-201", rotor: "rotor", kind: "run-up", durationS: 1, outputPoints: 20 }]);
    const run = blower.transient?.[0];
    if (!run) throw new Error("no run");
    const range = operatingRangeRpm(blower, run);
    expect(range?.[0]).toBeCloseTo(2500, 9);
    expect(range?.[1]).toBeCloseTo(3570, 9);
  });

  it("lists the natural frequencies the ramp passes, with their mode numbers", () => {
    const passed = passedNaturalFrequencies(coastDown);
    const all = coastDown.model.naturalFrequenciesHz;
    expect(passed.map((m) => m.frequencyHz)).toEqual(all.filter((f) => f * 60 >= 600 && f * 60 <= 1785));
    for (const m of passed) expect(all[m.mode - 1]).toBe(m.frequencyHz);
    expect(passedNaturalFrequencies(startUp)).toHaveLength(all.filter((f) => f * 60 <= 1785).length);
  });

  it("titles a run with its ramp, speeds, duration and load", () => {
    expect(speedRampTitle(coastDown)).toBe("coast-down of Raw-water pump RWP-101 · impeller, 1785 → 600 rpm in 4 s (vertical, static unbalance)");
  });
});
