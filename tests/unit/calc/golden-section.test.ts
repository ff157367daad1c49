// Golden-section search (Kiefer 1953; Press et al., Numerical Recipes 3rd ed., section 10.2):
// the bracket shrinks by 1/phi = 0.618... per evaluation and keeps the maximum of a unimodal f.
import { describe, expect, it } from "vitest";
import { GOLDEN_RATIO_INVERSE, goldenSectionMaximum } from "@/modules/calc/golden-section";

describe("goldenSectionMaximum", () => {
  it("finds the peak of a parabola to the tolerance and shrinks the bracket by 1/phi per step", () => {
    const r = goldenSectionMaximum((x) => -((x - 0.3) ** 2), 0, 1, { tolerance: 1e-9 });
    expect(r.b - r.a).toBeLessThanOrEqual(1e-9);
    expect(Math.abs((r.a + r.b) / 2 - 0.3)).toBeLessThan(1e-9);
    expect(GOLDEN_RATIO_INVERSE).toBeCloseTo(0.6180339887498949, 15);
    const n = goldenSectionMaximum((x) => Math.sin(x), 0, Math.PI, { iterations: 10 });
    expect(n.b - n.a).toBeCloseTo(Math.PI * GOLDEN_RATIO_INVERSE ** 10, 9);
    expect(n.x1).toBeLessThan(n.x2);
    expect(Math.abs(n.x1 - Math.PI / 2)).toBeLessThan(n.b - n.a);
  });

  it("counts its evaluations: two to start, one per step", () => {
    let calls = 0;
    goldenSectionMaximum((x) => {
      calls++;
      return -Math.abs(x - 2);
    }, 0, 5, { iterations: 25 });
    expect(calls).toBe(27);
  });

  it("a peak at an end of the interval is approached from inside", () => {
    const r = goldenSectionMaximum((x) => x, 0, 1, { tolerance: 1e-6 });
    expect(r.b).toBe(1);
    expect(r.a).toBeGreaterThan(1 - 1e-6 - 1e-12);
  });
});
