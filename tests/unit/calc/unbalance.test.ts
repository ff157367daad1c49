// Rotating unbalance loads: ISO 1940-1 balance grade, vendor force, load-case phasors, static and
// couple unbalance, moments p x f at O.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { bearingWeights, forceAtRatedSpeed, forceDirection, unitLoads } from "@/modules/calc/unbalance";
import type { RotorInput } from "@/modules/calc/schema";
import { relClose, symmetricBlock } from "./helpers";

const rotor = (over: Partial<RotorInput>): RotorInput => ({
  name: "R",
  mass: 1200,
  speedRpm: 1800,
  serviceFactor: 1,
  axis: "x",
  unbalanceMode: "static",
  bearings: [[-1, 0, 2], [1, 0, 2]],
  ...over,
});

describe("ISO 1940-1 unbalance force", () => {
  it("F0 = serviceFactor m_r e w^2 with e = G / w (G in mm/s)", () => {
    const w = (1800 * 2 * Math.PI) / 60;
    const e = 6.3 / 1000 / w;
    expect(relClose(forceAtRatedSpeed(rotor({ balanceGrade: 6.3, serviceFactor: 2 })), 2 * 1200 * e * w * w, 1e-12)).toBe(true);
  });

  it("a vendor force is used at rated speed and scales with (w / w_rated)^2 elsewhere", () => {
    const input = parseAnalysisInput(
      symmetricBlock({ rotor: { balanceGrade: undefined, unbalanceForce: 900, speedRpm: 1500, speedRangeRpm: [750, 1500], serviceFactor: 1.5 } }),
    );
    if (!input.ok) throw new Error("invalid");
    const result = analyse(input.input);
    expect(result.rotors[0]!.forceAmplitude).toBeCloseTo(1350, 9);
    // the sweep's transmissibility at 0 Hz-like low frequency is that of a unit static load: 1
    const tr = result.sweep.transmissibility![0]!.values[0]!;
    expect(tr).toBeGreaterThan(0.99);
  });
});

describe("load cases (phasors with u(t) = Re(U e^{i w t}))", () => {
  it("rotating load turns by the right-hand rule about +shaft: shaft x [0, cos, sin], shaft y [sin, 0, cos]", () => {
    const x = forceDirection("x", "rotating");
    expect([...x.re, ...x.im]).toEqual([0, 1, 0, 0, 0, -1]);
    const y = forceDirection("y", "rotating");
    expect([...y.re, ...y.im]).toEqual([0, 0, 1, -1, 0, 0]);
    // at w t = pi / 2 the shaft-x force points along +z: Re([0, 1, -i] e^{i pi/2}) = [0, 0, 1]
    const t = Math.PI / 2;
    expect(x.re[2] * Math.cos(t) - x.im[2] * Math.sin(t)).toBeCloseTo(1, 12);
    expect(forceDirection("y", "horizontal").re).toEqual([1, 0, 0]);
    expect(forceDirection("x", "horizontal").re).toEqual([0, 1, 0]);
  });

  it("static unbalance shares F equally; couple puts +F/2 and -F/2 at the end bearings", () => {
    const b: [number, number, number][] = [[-1, 0, 2], [0.2, 0, 2], [1.5, 0, 2]];
    expect(bearingWeights(b, "x", "static")).toEqual([1 / 3, 1 / 3, 1 / 3]);
    expect(bearingWeights(b, "x", "couple")).toEqual([0.5, 0, -0.5]);
  });

  it("a force f at p adds the moment p x f at O", () => {
    const loads = unitLoads(rotor({ balanceGrade: 2.5, unbalanceMode: "both" }), [[-1, 0.5, 2], [1, 0.5, 2]]);
    const vertical = loads.find((l) => l.case === "vertical" && l.unbalanceMode === "static")!;
    // f = [0, 0, 1/2] at each bearing: sum Fz = 1; Mx = sum y fz = 0.5; My = -sum x fz = 0
    expect(Array.from(vertical.re)).toEqual([0, 0, 1, 0.5, 0, 0]);
    const couple = loads.find((l) => l.case === "vertical" && l.unbalanceMode === "couple")!;
    // +1/2 at x = -1, -1/2 at x = +1: My = -(-1)(1/2) - (1)(-1/2) = 1
    expect(Array.from(couple.re)).toEqual([0, 0, 0, 0, 1, 0]);
    expect(loads).toHaveLength(6);
  });
});
