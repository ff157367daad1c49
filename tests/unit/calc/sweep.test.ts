// The sweep series (one factorisation per frequency shared by every load) agree with the
// rated-speed results computed on their own path, and carry what the plots need.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { relClose } from "./helpers";

const doc = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../../examples/raw-water-pump-train.json"), "utf8"));

describe("frequency sweep", () => {
  it("at the rated speed every series equals the rated-speed point and transmissibility results", () => {
    const ratedHz = 1785 / 60;
    // 0.5 Hz steps from ratedHz - 10 put one sweep point exactly on the rated speed
    const parsed = parseAnalysisInput({ ...doc, sweep: { fromHz: ratedHz - 10, toHz: ratedHz + 10, points: 41 } });
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const result = analyse(parsed.input);
    const k = result.sweep.frequencyHz.findIndex((f) => Math.abs(f - ratedHz) < 1e-9);
    expect(k).toBe(20);
    const rotorCount = result.rotors.length;
    expect(rotorCount).toBe(2);
    for (const r of result.rotors) {
      for (const c of r.cases) {
        for (const p of c.points) {
          const s = result.sweep.series.find(
            (x) => x.machine === r.machine && x.rotor === r.rotor && x.case === c.case && x.unbalanceMode === c.unbalanceMode && x.point === p.name,
          )!;
          expect(relClose(s.displacementPeak[k]!, Math.max(...p.displacementPeak), 1e-9)).toBe(true);
          expect(relClose(s.velocityPeak[k]!, Math.max(...p.velocityPeak), 1e-9)).toBe(true);
        }
        const t = result.sweep.transmissibility!.find(
          (x) => x.machine === r.machine && x.rotor === r.rotor && x.case === c.case && x.unbalanceMode === c.unbalanceMode,
        )!;
        expect(relClose(t.values[k]!, c.transmissibility, 1e-9)).toBe(true);
      }
    }
  });

  it("has one series per rotor, case, unbalance mode and point, the operating ranges and the avoidance bands", () => {
    const parsed = parseAnalysisInput(doc);
    if (!parsed.ok) throw new Error("invalid");
    const result = analyse(parsed.input);
    // motor: static + couple x 3 cases x (2 bearings + 2 check points); pump: 3 cases x 4 points
    expect(result.sweep.series).toHaveLength(6 * 4 + 3 * 4);
    expect(result.sweep.frequencyHz).toHaveLength(600);
    for (const s of result.sweep.series) expect(s.displacementPeak).toHaveLength(600);
    expect(result.sweep.avoidanceBandsHz).toHaveLength(6);
    const band = result.sweep.avoidanceBandsHz![0]!;
    expect(band.fromHz).toBeCloseTo(result.modes[0]!.frequencyHz * 0.8, 12);
    expect(band.toHz).toBeCloseTo(result.modes[0]!.frequencyHz * 1.2, 12);
  });
});
