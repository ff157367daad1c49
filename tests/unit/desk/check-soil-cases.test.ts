// The verdicts table's folding of the soil band (modules/desk/check-soil-cases.ts) on the demo
// pump train (examples/raw-water-pump-train.json: soil band on, three checks fail, two of them
// at the upper bound) and on made-up rows for the cases the demo does not show.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, checkVerdict, parseAnalysisInput, type CheckResult } from "@/modules/calc";
import { foldableSoilCases, soilCaseGroupOf } from "@/modules/desk/check-soil-cases";
import { checkUtilisation, sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";

function demoChecks(): CheckResult[] {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")));
  if (!parsed.ok) throw new Error("example does not parse");
  return analyse(parsed.input).checks;
}

const row = (over: Partial<CheckResult> & Pick<CheckResult, "id" | "key">): CheckResult => ({
  label: over.key ?? over.id,
  value: 2,
  limit: 1,
  comparison: "max",
  unit: "m",
  source: "test",
  pass: false,
  ...over,
});

describe("soilCaseGroupOf", () => {
  it("gives the nominal check and its band checks one key", () => {
    expect(soilCaseGroupOf({ id: "frequency-separation", key: "frequency-separation/Motor/rotor/mode-6" })).toBe("frequency-separation/Motor/rotor/mode-6");
    expect(soilCaseGroupOf({ id: "frequency-separation@soil-upper", key: "frequency-separation@soil-upper/Motor/rotor/mode-6" })).toBe("frequency-separation/Motor/rotor/mode-6");
    expect(soilCaseGroupOf({ id: "velocity-combined@soil-lower", key: "velocity-combined@soil-lower/pt/x" })).toBe("velocity-combined/pt/x");
    expect(soilCaseGroupOf({ id: "mass-ratio", key: undefined })).toBeNull();
  });
});

describe("foldableSoilCases on the demo pump train", () => {
  const sorted = sortChecksGoverningFirst(demoChecks());
  const fold = foldableSoilCases(sorted);
  const groups = new Set(sorted.map((c, i) => soilCaseGroupOf(c) ?? `row-${i}`));

  it("shows one row per check (its governing case) and folds the other two cases", () => {
    expect(sorted.length).toBe(472);
    // 160 checks: 156 checked at three soil cases (12 separations, 4 x 36 amplitudes), 4 at nominal soil only (mass ratio, eccentricity x and y, bearing)
    expect(groups.size).toBe(160);
    expect(fold.filter((f) => !f).length).toBe(groups.size);
    expect(fold.filter(Boolean).length).toBe(472 - 160);
  });

  it("folds only passing rows, each behind a shown row of its check that uses at least as much of its limit", () => {
    const shown = new Map<string, CheckResult>();
    sorted.forEach((c, i) => {
      const g = soilCaseGroupOf(c);
      if (!fold[i] && g && !shown.has(g)) shown.set(g, c);
      if (!fold[i]) return;
      expect(checkVerdict(c)).toBe("pass");
      const governing = shown.get(g!);
      expect(governing).toBeDefined();
      expect(checkUtilisation(governing!)).toBeGreaterThanOrEqual(checkUtilisation(c));
    });
    // the three failing checks (the mass ratio, two separations at the upper bound) all stay shown
    expect(sorted.filter((c, i) => !c.pass && !fold[i]).length).toBe(3);
  });
});

describe("foldableSoilCases on made-up rows", () => {
  it("never folds a failing or accepted case, even when another case of the check governs", () => {
    const rows = sortChecksGoverningFirst([
      row({ id: "displacement", key: "displacement/pt/x", value: 1.5 }),
      row({ id: "displacement@soil-upper", key: "displacement@soil-upper/pt/x", value: 3 }),
      row({ id: "displacement@soil-lower", key: "displacement@soil-lower/pt/x", value: 1.2, acceptance: { justification: "made-up text for the test" } }),
    ]);
    expect(foldableSoilCases(rows)).toEqual([false, false, false]);
  });
  it("folds passing cases behind the governing one, and leaves checks without a key alone", () => {
    const rows = sortChecksGoverningFirst([
      row({ id: "velocity", key: "velocity/pt/y", value: 0.5, pass: true }),
      row({ id: "velocity@soil-lower", key: "velocity@soil-lower/pt/y", value: 0.9, pass: true }),
      row({ id: "velocity@soil-upper", key: "velocity@soil-upper/pt/y", value: 0.3, pass: true }),
      row({ id: "mass-ratio", key: undefined, value: 0.2, pass: true }),
      row({ id: "mass-ratio", key: undefined, value: 0.1, pass: true }),
    ]);
    expect(rows.map((r) => r.id)).toEqual(["velocity@soil-lower", "velocity", "velocity@soil-upper", "mass-ratio", "mass-ratio"]);
    expect(foldableSoilCases(rows)).toEqual([false, true, true, false, false]);
  });
});
