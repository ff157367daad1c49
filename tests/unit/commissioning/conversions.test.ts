// Conversion identities for a sinusoid x(t) = X sin(w t), checked against a sampled signal
// (the definitions of r.m.s., peak and peak-to-peak, ISO 20816-1 §3), not against the formulas.
import { describe, expect, it } from "vitest";
import { displacementPeakToPeakToVelocityPeak, fromDesignBasis, peakToRms, rmsToPeak, toDesignBasis, toVelocityRms, velocityPeakToDisplacementPeakToPeak } from "@/modules/commissioning/conversions";

function sampled(amplitude: number, hz: number) {
  const n = 20000;
  const w = 2 * Math.PI * hz;
  const xs: number[] = [];
  const vs: number[] = [];
  for (let i = 0; i < n; i++) {
    const t = i / (n * hz);
    xs.push(amplitude * Math.sin(w * t));
    vs.push(amplitude * w * Math.cos(w * t));
  }
  const rms = (a: number[]) => Math.sqrt(a.reduce((s, v) => s + v * v, 0) / a.length);
  return { xPp: Math.max(...xs) - Math.min(...xs), vPeak: Math.max(...vs.map(Math.abs)), vRms: rms(vs) };
}

describe("single-frequency conversions", () => {
  it("peak = sqrt 2 x r.m.s. of a sampled sine, both ways", () => {
    const s = sampled(40e-6, 29.75);
    expect(rmsToPeak(s.vRms)).toBeCloseTo(s.vPeak, 9);
    expect(peakToRms(s.vPeak)).toBeCloseTo(s.vRms, 9);
  });

  it("velocity = omega x displacement: peak-to-peak displacement from the velocity peak and back", () => {
    const s = sampled(40e-6, 29.75);
    expect(velocityPeakToDisplacementPeakToPeak(s.vPeak, 29.75) / s.xPp).toBeCloseTo(1, 6);
    expect(displacementPeakToPeakToVelocityPeak(s.xPp, 29.75) / s.vPeak).toBeCloseTo(1, 6);
  });

  it("readings into the design basis (peak) and the zone basis (velocity r.m.s.)", () => {
    expect(toDesignBasis("velocity rms", 2e-3)).toEqual({ kind: "velocity", value: 2e-3 * Math.SQRT2, basis: "peak" });
    expect(toDesignBasis("velocity peak", 2e-3).value).toBe(2e-3);
    expect(toDesignBasis("displacement peak-to-peak", 50e-6)).toEqual({ kind: "displacement", value: 25e-6, basis: "peak" });
    const s = sampled(25e-6, 50);
    expect(toVelocityRms("displacement peak-to-peak", s.xPp, 50) / s.vRms).toBeCloseTo(1, 6);
    expect(fromDesignBasis("velocity rms", toDesignBasis("velocity rms", 3e-3).value)).toBeCloseTo(3e-3, 12);
    expect(fromDesignBasis("displacement peak-to-peak", 25e-6)).toBeCloseTo(50e-6, 15);
  });
});
