// The design form keeps the designer's acceptances of band exceedances (the contract's
// `acceptances`), so they are saved with the draft and frozen in the revision's input.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { draftFormSchema, formFromInput, toInputDocument, withAcceptance } from "@/modules/desk/draft-form";

const demo = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../../examples/raw-water-pump-train.json"), "utf8")) as AnalysisInputDocument;
const KEY = "frequency-separation@soil-upper/Motor RWM-101/rotor/mode-6";
const TEXT = "Site tests bound G at 1.2 x nominal; see the geotechnical addendum (demo text).";

describe("acceptances in the design form", () => {
  it("round-trip through the form into the input document, and the engine marks the check accepted", () => {
    const parsed = parseAnalysisInput({ ...demo, acceptances: [{ checkKey: KEY, justification: TEXT }] });
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const form = formFromInput(parsed.input);
    expect(form.acceptances).toEqual([{ checkKey: KEY, justification: TEXT }]);
    const again = parseAnalysisInput(toInputDocument(form));
    if (!again.ok) throw new Error(JSON.stringify(again.issues));
    expect(again.input.acceptances).toEqual([{ checkKey: KEY, justification: TEXT }]);
    const c = analyse(again.input).checks.find((x) => x.key === KEY)!;
    expect(c.pass).toBe(false);
    expect(c.acceptance?.justification).toBe(TEXT);
  });

  it("a blank justification is no acceptance; withAcceptance sets, changes and withdraws one", () => {
    let list = withAcceptance([], KEY, "draft");
    expect(list).toEqual([{ checkKey: KEY, justification: "draft" }]);
    list = withAcceptance(list, KEY, TEXT);
    expect(list).toEqual([{ checkKey: KEY, justification: TEXT }]);
    expect(withAcceptance(list, KEY, "")).toEqual([]);
    const parsed = parseAnalysisInput(demo);
    if (!parsed.ok) throw new Error("demo invalid");
    const form = { ...formFromInput(parsed.input), acceptances: [{ checkKey: KEY, justification: "   " }] };
    expect((toInputDocument(form) as { acceptances?: unknown }).acceptances).toBeUndefined();
  });

  it("the browser's validation asks for a written justification", async () => {
    const parsed = parseAnalysisInput(demo);
    if (!parsed.ok) throw new Error("demo invalid");
    const form = { ...formFromInput(parsed.input), acceptances: [{ checkKey: KEY, justification: "too short" }] };
    await expect(draftFormSchema.validateAt("acceptances[0].justification", form)).rejects.toThrow(/at least 20 characters/);
    await expect(draftFormSchema.validateAt("acceptances[0].justification", { ...form, acceptances: [{ checkKey: KEY, justification: TEXT }] })).resolves.toBe(TEXT);
  });
});
