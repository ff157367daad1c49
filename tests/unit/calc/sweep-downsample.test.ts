// The plot sampling of the sweep (POST /api/v1/calculate's default): which grid points it keeps.
import { describe, expect, it } from "vitest";
import { MODE_NEIGHBOURS, PLOT_BASE_POINTS, plotIndices } from "@/modules/calc/sweep-downsample";
import type { SweepResult } from "@/modules/calc";

function sweepOf(values: number[], velocity = values): SweepResult {
  return {
    frequencyHz: values.map((_, i) => i * 0.1),
    series: [{ machine: "m", rotor: "r", case: "vertical", unbalanceMode: "static", point: "p", displacementPeak: values, velocityPeak: velocity }],
  };
}

describe("plotIndices", () => {
  it("keeps the ends and an even stride of about PLOT_BASE_POINTS on a curve without peaks", () => {
    const n = 600;
    const idx = plotIndices(sweepOf(Array.from({ length: n }, (_, i) => i)), []);
    const stride = Math.ceil(n / PLOT_BASE_POINTS);
    expect(idx[0]).toBe(0);
    expect(idx.at(-1)).toBe(n - 1);
    expect(idx.filter((i) => i % stride === 0)).toHaveLength(Math.ceil(n / stride));
    expect(idx.length).toBe(Math.ceil(n / stride) + 1);
  });

  it("keeps every local maximum (a plateau once, at its start), off the stride", () => {
    const v = Array.from({ length: 600 }, () => 0);
    v[101] = 5; // a spike
    v[203] = 3;
    v[204] = 3; // a plateau
    v[205] = 3;
    const idx = plotIndices(sweepOf(v), []);
    expect(idx).toContain(101);
    expect(idx).toContain(203);
    expect(idx).not.toContain(204);
    // a peak of the velocity series alone counts too
    const w = Array.from({ length: 600 }, () => 0);
    w[307] = 1;
    expect(plotIndices(sweepOf(v, w), [])).toContain(307);
  });

  it("keeps the grid point nearest each natural frequency in the band and MODE_NEIGHBOURS either side; ignores one outside", () => {
    const flat = Array.from({ length: 600 }, () => 1);
    const idx = plotIndices(sweepOf(flat), [33.33, 1000]);
    for (let k = -MODE_NEIGHBOURS; k <= MODE_NEIGHBOURS; k++) expect(idx).toContain(333 + k);
    expect(idx.every((i) => i >= 0 && i < 600)).toBe(true);
  });

  it("keeps a grid of two points or fewer whole", () => {
    expect(plotIndices(sweepOf([1, 2]), [])).toEqual([0, 1]);
  });
});
