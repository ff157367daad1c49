// The design form's model against the contract's own schema: every example input
// survives form -> document -> parse unchanged, blanks become the contract's
// defaults, and the browser's yup limits match the contract's on the edges.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { draftFormSchema, emptyDraftForm, formFromInput, toInputDocument } from "@/modules/desk/draft-form";
import { withProjectDefaults } from "@/modules/desk/project-settings";
import { governingCheck, sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";
import { vsFromSpt } from "@/modules/desk/balance-grades";

const examplesDir = path.join(process.cwd(), "examples");
const examples = readdirSync(examplesDir).filter((f) => f.endsWith(".json"));

describe("form model round trip", () => {
  it.each(examples)("%s: form -> document parses to the same input", (file) => {
    const raw = JSON.parse(readFileSync(path.join(examplesDir, file), "utf8")) as AnalysisInputDocument;
    const first = parseAnalysisInput(raw);
    expect(first.ok).toBe(true);
    if (!first.ok) return;
    const again = parseAnalysisInput(toInputDocument(formFromInput(first.input)));
    expect(again.ok).toBe(true);
    if (again.ok) expect(again.input).toEqual(first.input);
  });

  it("an empty draft names the missing soil fields by their contract paths", () => {
    const r = parseAnalysisInput(toInputDocument(emptyDraftForm()));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const paths = r.issues.map((i) => i.path);
    expect(paths).toContain("soil.poissonRatio");
    expect(paths).toContain("soil.density");
    expect(paths).toContain("machines[0].mass");
  });

  it("yup refuses Poisson's ratio 0.5 and accepts 0.33, like the contract", async () => {
    const f = formFromInput((parseAnalysisInput(JSON.parse(readFileSync(path.join(examplesDir, "aeration-blower.json"), "utf8"))) as { ok: true; input: never }).input);
    await expect(draftFormSchema.validateAt("soil.poissonRatio", { ...f, soil: { ...f.soil, poissonRatio: 0.5 } })).rejects.toThrow(/\(0, 0.5\)/);
    await expect(draftFormSchema.validateAt("soil.poissonRatio", { ...f, soil: { ...f.soil, poissonRatio: 0.33 } })).resolves.toBe(0.33);
  });
});

describe("project defaults", () => {
  it("fill blank criteria and keep the draft's own values", () => {
    const doc = withProjectDefaults({ schemaVersion: 1, criteria: { minMassRatio: 5 } }, { criteriaDefaults: { minMassRatio: 3, maxEccentricity: 0.04 }, soilBand: { upperFactor: 2 } }) as {
      criteria: Record<string, number>;
      soilBand: Record<string, number>;
    };
    expect(doc.criteria).toEqual({ minMassRatio: 5, maxEccentricity: 0.04 });
    expect(doc.soilBand).toEqual({ upperFactor: 2 });
  });

  it("a project mass-ratio default of 3.5 turns the pump train's ratio check into the governing failure", () => {
    const raw = JSON.parse(readFileSync(path.join(examplesDir, "raw-water-pump-train-enlarged.json"), "utf8")) as Record<string, unknown>;
    const parsed = parseAnalysisInput(withProjectDefaults({ ...raw, criteria: undefined }, { criteriaDefaults: { minMassRatio: 50 }, soilBand: {} }));
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const g = governingCheck(analyse(parsed.input));
    expect(g?.pass).toBe(false);
    expect(g?.label).toMatch(/mass/i);
  });
});

describe("governing check", () => {
  it("puts failures first, then the check closest to its limit", () => {
    const base = { source: "s", id: "x" };
    const sorted = sortChecksGoverningFirst([
      { ...base, label: "a", value: 0.5, limit: 1, pass: true, comparison: "max" },
      { ...base, label: "b", value: 0.9, limit: 1, pass: true, comparison: "max" },
      { ...base, label: "c", value: 2, limit: 3, pass: false, comparison: "min" },
    ]);
    expect(sorted.map((c) => c.label)).toEqual(["c", "b", "a"]);
  });
});

describe("SPT correlation", () => {
  it("Imai & Tonouchi (1982): Vs = 97.0 N^0.314 m/s, e.g. N = 10 gives 200.0 m/s", () => {
    // 97.0 * 10^0.314 = 97.0 * 2.0606 = 199.9 m/s (computed by hand from the published formula).
    expect(vsFromSpt(10)).toBeCloseTo(199.88, 1);
    expect(vsFromSpt(1)).toBe(97);
  });
});
