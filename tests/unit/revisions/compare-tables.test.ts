// The comparison's tables as HTML: names with the raw path on hover, both limits and values of a
// flipped check with what moved, the soil bound and the worse-while-better mark.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import type { CheckResult } from "@/modules/calc";
import { compareChecks } from "@/modules/revisions";
import { Group, VerdictTable } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/compare-tables";

const check = (over: Partial<CheckResult> & { key: string }): CheckResult => ({ id: over.key, label: over.key, value: 1, limit: 1, pass: true, source: "s", comparison: "max", ...over });

describe("compare tables", () => {
  it("show a flipped band check with both limits, what moved, its soil bound and the mark", () => {
    const key = "frequency-separation@soil-upper/Motor/rotor/mode-6";
    const rows = compareChecks(
      [check({ key, label: "Mode 6 against Motor rotor", comparison: "min", value: 0.15, limit: 0.2, pass: false, soilCase: "upper", soilFactor: 2 })],
      [check({ key, label: "Mode 6 against Motor rotor", comparison: "min", value: 0.13, limit: 0.12, pass: true, soilCase: "upper", soilFactor: 2 })],
      "si",
    );
    const html = renderToStaticMarkup(createElement(VerdictTable, { rows, olderLabel: "A", newerLabel: "B", testId: "t" }));
    expect(html).toContain(`title="checks[&quot;${key}&quot;]"`);
    expect(html).toContain("limit and value moved");
    expect(html).toContain("≥ 0.2000");
    expect(html).toContain("≥ 0.1200");
    expect(html).toContain("upper bound (× 2 on G)");
    expect(html).toContain('data-testid="worse-mark"');
  });

  it("show quantities by name in display units with the path as the title", () => {
    const html = renderToStaticMarkup(
      createElement(Group, {
        title: "Governing amplitudes",
        testId: "g",
        empty: "none",
        olderLabel: "A",
        newerLabel: "B",
        rows: [{ group: "amplitudes", label: "M / r · vertical / static · coupling · peak displacement · z", path: 'rotors["M / r"].cases["vertical / static"].points["coupling"].displacementPeak[2]', change: "changed", quantity: "displacement", unit: "µm", old: 1e-6, new: 2e-6, oldText: "1.000", newText: "2.000", deltaText: "+1.00", percentChange: 100, worseWhileBetter: true }],
      }),
    );
    expect(html).toContain("(1 changed)");
    expect(html).toContain('title="rotors[&quot;M / r&quot;].cases[&quot;vertical / static&quot;].points[&quot;coupling&quot;].displacementPeak[2]"');
    expect(html).toContain("µm");
    expect(html).toContain("+100 %");
    expect(html).toContain("worse, verdict not");
  });
});
