// Round trip of the soil calibration: a "measured" resonance made by the engine itself at a
// known G (analyse on the same input with the shear modulus set to 1.3 x the design's) must give
// that G back within 1 % (the search's own tolerance is 0.01 %).
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInput } from "@/modules/calc";
import { calibrateShearModulus, predictedPeakHz, CALIBRATION_BOUNDS } from "@/modules/commissioning/calibrate";
import { buildResponseModel, findPoint, modelPoints, SoilResponse } from "@/modules/commissioning/response";
import { traceResonances } from "@/modules/commissioning/prediction";

function example(name: string): AnalysisInput {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", name), "utf8")));
  if (!parsed.ok) throw new Error(`${name} does not parse`);
  return parsed.input;
}

/** The same input with G stated directly as `g` (Pa): an independent way of changing the soil. */
function withShearModulus(input: AnalysisInput, g: number): AnalysisInput {
  const soil = { ...input.soil, shearModulus: g } as AnalysisInput["soil"] & { shearWaveVelocity?: number };
  delete soil.shearWaveVelocity;
  return { ...input, soil };
}

describe("calibrateShearModulus (round trip through the engine)", () => {
  const input = example("raw-water-pump-train.json");
  const design = analyse(input);
  const g0 = design.impedance.shearModulus as number;

  const model = buildResponseModel(input);
  const bearing = findPoint(modelPoints(model), "Motor RWM-101 rotor bearing 1")!;
  // the shaft is along x: horizontal is y (axis 1), vertical z (axis 2)
  const horizontal = { point: bearing, axis: 1 as const };
  const vertical = { point: bearing, axis: 2 as const };

  it("gives back 1.3 G0 from the natural frequency the engine computes at 1.3 G0 (three modes in turn, each read where it moves the bearing)", () => {
    const truth = analyse(withShearModulus(input, 1.3 * g0));
    expect(truth.impedance.shearModulus).toBeCloseTo(1.3 * g0, 0);
    for (const [k, at] of [[0, horizontal], [2, vertical], [5, horizontal]] as const) {
      const measured = truth.modes[k]!.frequencyHz;
      const fit = calibrateShearModulus(input, [{ kind: "natural", hz: measured, at }]);
      expect(fit.ok).toBe(true);
      if (!fit.ok) return;
      expect(fit.designShearModulus).toBeCloseTo(g0, 0);
      expect(Math.abs(fit.fittedShearModulus / (1.3 * g0) - 1)).toBeLessThan(0.01);
      expect(fit.atBound).toBeNull();
      expect(Math.abs(fit.fittedHz[0]! / measured - 1)).toBeLessThan(1e-3);
    }
  });

  it("gives back 0.7 G0 from two resonances at once (golden-section on ln G)", () => {
    const truth = analyse(withShearModulus(input, 0.7 * g0));
    const fit = calibrateShearModulus(input, [
      { kind: "natural", hz: truth.modes[0]!.frequencyHz, at: horizontal },
      { kind: "natural", hz: truth.modes[2]!.frequencyHz, at: vertical },
    ]);
    expect(fit.ok && Math.abs(fit.fittedShearModulus / (0.7 * g0) - 1)).toBeLessThan(0.01);
  });

  it("gives back 1.3 G0 from a synthetic run-up trace: the engine's own response at 1.3 G0, its peak found and fitted", () => {
    const truth = new SoilResponse(model, 1.3);
    const point = bearing;
    // horizontal (y) displacement peak-to-peak from 300 to 2400 rpm: the heavily damped
    // rocking-sliding response has its (broad) peak near 1200 rpm at 1.3 G0
    const samples = Array.from({ length: 211 }, (_, i) => 300 + i * 10).map((rpm) => ({ rpm, value: 2 * truth.at(point, 1, rpm).displacementPeak }));
    const trace = { bearing: point.name, direction: "horizontal" as const, quantity: "displacement peak-to-peak" as const, unit: "µm", samples };
    const peaks = traceResonances(trace);
    expect(peaks.length).toBeGreaterThan(0);
    const fromRpm = samples[0]!.rpm;
    const toRpm = samples.at(-1)!.rpm;
    const fit = calibrateShearModulus(input, [{ kind: "peak", hz: peaks[0]! / 60, point, axis: 1, quantity: "displacement peak-to-peak", fromRpm, toRpm }]);
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    // the trace's 10 rpm steps limit how well its peak is placed: 1 % on G is about 0.5 % on the frequency
    expect(Math.abs(fit.fittedShearModulus / (1.3 * g0) - 1)).toBeLessThan(0.01);
    expect(predictedPeakHz(fit.fitted, { kind: "peak", hz: 0, point, axis: 1, quantity: "displacement peak-to-peak", fromRpm, toRpm })).not.toBeNull();
  });

  it("stops at the bound, and says so, for a resonance the model cannot reach", () => {
    const fit = calibrateShearModulus(input, [{ kind: "natural", hz: design.modes[0]!.frequencyHz * 10 }]);
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.atBound).toBe("upper");
    expect(fit.fittedShearModulus / g0).toBeCloseTo(CALIBRATION_BOUNDS.upperFactor, 6);
    expect(fit.notes.join(" ")).toMatch(/upper bound/);
  });

  it("refuses a foundation on springs (no G to fit)", () => {
    const springs = example("fan-on-springs.json");
    const fit = calibrateShearModulus(springs, [{ kind: "natural", hz: 5 }]);
    expect(fit.ok).toBe(false);
  });
});
