// Labels along a plot's frequency axis: coinciding operating speeds are merged into one
// label, nearby ones staggered, so none prints over another.
import { describe, expect, it } from "vitest";
import { DEFAULT_LABEL_LAYOUT, labelsOverlap, placeAxisLabels } from "@/modules/desk/plot-labels";

describe("axis labels", () => {
  it("merges a motor and the pump it drives at the same speed into one label", () => {
    const placed = placeAxisLabels([
      { x: 120, text: "M-1 motor" },
      { x: 120, text: "P-1 impeller" },
      { x: 300, text: "B-2 blower" },
    ]);
    expect(placed).toEqual([
      { x: 120, text: "M-1 motor · P-1 impeller", row: 0, merged: 2 },
      { x: 300, text: "B-2 blower", row: 0, merged: 1 },
    ]);
  });

  it("writes a repeated text once when merging", () => {
    expect(placeAxisLabels([{ x: 50, text: "f1" }, { x: 51.5, text: "f1" }])).toEqual([{ x: 50, text: "f1", row: 0, merged: 2 }]);
  });

  it("staggers labels that are apart but would overlap, and none overlaps another", () => {
    // "rotor n" is 7 characters, about 35 px: the first three collide, the fourth clears the first.
    const labels = [100, 110, 120, 145].map((x, i) => ({ x, text: `rotor ${i + 1}` }));
    const placed = placeAxisLabels(labels);
    expect(placed.map((p) => p.row)).toEqual([0, 1, 2, 0]);
    for (const a of placed) for (const b of placed) if (a !== b) expect(labelsOverlap(a, b)).toBe(false);
    // Printed on one row, they would overlap.
    expect(labelsOverlap({ ...placed[0]!, row: 0 }, { ...placed[1]!, row: 0 })).toBe(true);
  });

  it("keeps labels far enough apart on the first row", () => {
    const placed = placeAxisLabels([
      { x: 10, text: "f1" },
      { x: 40, text: "f2" },
      { x: 70, text: "f3" },
    ]);
    expect(placed.map((p) => p.row)).toEqual([0, 0, 0]);
  });

  it("takes the least crowded row when the rows run out, and ignores positions that are not numbers", () => {
    const placed = placeAxisLabels(
      [
        { x: 0, text: "aaaaaaaaaa" },
        { x: 1e-3 + 5, text: "bbbbbbbbbb" },
        { x: 12, text: "cccccccccc" },
        { x: Number.NaN, text: "nowhere" },
      ],
      { ...DEFAULT_LABEL_LAYOUT, maxRows: 2 },
    );
    expect(placed.map((p) => p.text)).toEqual(["aaaaaaaaaa", "bbbbbbbbbb", "cccccccccc"]);
    expect(placed.map((p) => p.row)).toEqual([0, 1, 0]);
  });
});
