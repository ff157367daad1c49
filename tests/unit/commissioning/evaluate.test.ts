// Verdicts and prediction of a record against the pump-train example revision.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInput } from "@/modules/calc";
import { evaluateMeasurement } from "@/modules/desk/measurement-evaluate";
import { judgeReading, judgeRecord } from "@/modules/commissioning/judge";
import { Predictor } from "@/modules/commissioning/prediction";
import type { Reading } from "@/modules/commissioning/types";

function example(name: string): AnalysisInput {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", name), "utf8")));
  if (!parsed.ok) throw new Error(`${name} does not parse`);
  return parsed.input;
}

const reading = (over: Partial<Reading>): Reading => ({ bearing: "Motor RWM-101 rotor bearing 1", direction: "vertical", quantity: "velocity rms", value: 1e-3, given: 1, unit: "mm/s", ref: { sheet: "CSV", cell: "E2" }, ...over });

describe("judgeReading / judgeRecord", () => {
  const ctx = { runningHz: 29.75, group: 2 as const, criteria: { velocityPeak: { value: 1.4e-3 * Math.SQRT2, source: "test limit" }, displacementPeak: { value: 22e-6 * Math.SQRT2, source: "test limit" } } };

  it("compares r.m.s. velocity as peak against the peak criterion, and zones it as r.m.s.", () => {
    const inside = judgeReading(reading({ value: 1.3e-3 }), ctx);
    expect(inside.value).toBeCloseTo(1.3e-3 * Math.SQRT2, 12);
    expect(inside.basis).toBe("peak");
    expect(inside.zone).toBe("A");
    expect(inside.verdict).toBe("pass");
    // 1.5 mm/s r.m.s.: above the 1.4 mm/s limit (as peak, 2.12 > 1.98 mm/s) and zone B of group 2 rigid
    const over = judgeReading(reading({ value: 1.5e-3 }), ctx);
    expect(over.zone).toBe("B");
    expect(over.verdict).toBe("fail");
    expect(over.verdictText).toMatch(/above the design limit/);
  });

  it("halves peak-to-peak displacement for the peak criterion; a resonance is not judged; the record takes the worst", () => {
    const d = judgeReading(reading({ quantity: "displacement peak-to-peak", value: 40e-6 }), ctx);
    expect(d.kind).toBe("displacement");
    expect(d.value).toBeCloseTo(20e-6, 15);
    expect(d.verdict).toBe("pass");
    const res = judgeReading(reading({ quantity: "resonance", value: 12 }), ctx);
    expect(res.verdict).toBe("info");
    expect(judgeRecord([d, res]).verdict).toBe("pass");
    expect(judgeRecord([d, res, judgeReading(reading({ value: 5e-3 }), ctx)]).verdict).toBe("fail");
    expect(judgeRecord([res]).verdict).toBe("info");
  });
});

describe("Predictor (the revision's model at the measured speed)", () => {
  it("gives, for a single-rotor input at its rated speed, the engine's own rated-speed amplitude (worst load case) at the bearing", () => {
    // the user-springs example has one rotor: no other rotor adds to its bearings
    const input = example("user-springs.json");
    const result = analyse(input);
    const rotor = result.rotors[0]!;
    const predictor = new Predictor(input);
    const bearing = rotor.cases[0]!.points[0]!.name;
    const axis = input.machines[0]!.rotors[0]!.axis;
    const vertical = Math.max(...rotor.cases.map((c) => c.points.find((p) => p.name === bearing)!.displacementPeak[2]));
    const p = predictor.predictedPeak(reading({ bearing, direction: axis === "z" ? "z" : "vertical", quantity: "displacement peak-to-peak" }), rotor.speedRpm);
    expect(p! / vertical).toBeCloseTo(1, 9);
    const v = predictor.predictedPeak(reading({ bearing, direction: axis === "z" ? "z" : "vertical", quantity: "velocity rms" }), rotor.speedRpm);
    expect(v! / (vertical * (2 * Math.PI * rotor.speedRpm) / 60)).toBeCloseTo(1, 9);
  });
});

describe("evaluateMeasurement", () => {
  const input = example("raw-water-pump-train.json");
  const result = analyse(input);

  it("stores verdicts with the prediction and ratio, and no calibration without a resonance", () => {
    const e = evaluateMeasurement({ input, result, speedRpm: 1785, readings: [reading({ value: 0.8e-3 }), reading({ direction: "horizontal", value: 3e-3 })], trace: null });
    expect(e.calibration).toBeNull();
    expect(e.soilFlag).toBeUndefined();
    expect(e.verdicts.record.verdict).toBe("fail");
    const [a, b] = e.verdicts.readings;
    expect(a!.predicted).toBeGreaterThan(0);
    expect(a!.ratio! * a!.predicted!).toBeCloseTo(a!.value, 12);
    expect(b!.verdict).toBe("fail");
    expect(e.verdicts.zoneBasis).toMatch(/group 2/);
    expect(e.verdicts.notes.join(" ")).not.toMatch(/no longer gives/);
  });

  it("says so when the engine no longer gives the revision's stored natural frequencies", () => {
    const altered = { ...result, engineVersion: "0.9.0", modes: result.modes.map((m) => ({ ...m, frequencyHz: m.frequencyHz * 1.01 })) };
    const e = evaluateMeasurement({ input, result: altered, speedRpm: 1785, readings: [reading({})], trace: null });
    expect(e.verdicts.notes.join(" ")).toMatch(/no longer gives the revision's stored natural frequencies \(engine 0\.9\.0\)/);
  });

  it("calibrates from a resonance outside the band and asks for the soil flag", () => {
    const design = new Predictor(input).design;
    // the vertical mode as it would be at 0.4 x G (far below the band's 1 / 1.5)
    const hz = design.naturalHz[2]! * Math.sqrt(0.4);
    const e = evaluateMeasurement({ input, result, speedRpm: 1785, readings: [reading({ value: 0.8e-3 }), reading({ quantity: "resonance", value: hz })], trace: null });
    expect(e.calibration?.position).toBe("below");
    // equivalent-radius springs scale with G, so the frequency with sqrt(G): 0.4 comes back
    expect(e.calibration!.fittedShearModulus / e.calibration!.designShearModulus).toBeCloseTo(0.4, 2);
    expect(e.soilFlag).toMatchObject({ side: "below" });
    expect(e.calibration!.atOperating.length).toBeGreaterThan(3);
  });
});
