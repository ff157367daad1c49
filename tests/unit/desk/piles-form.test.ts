// Issue 16 on the desk, method "piles": the pile group's fields survive the design form
// (form -> document gives back the same parsed input), blank pile fields make the draft
// incomplete (it saves, the analysis waits) rather than wrong, the engine's issue paths land on
// the form's fields, and a revision comparison names the pile inputs in the trade's words with
// their units.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { draftFormSchema, formCompleteness, formFieldOfIssue, formFromDraftDocument, formFromInput, newPileHead, toInputDocument } from "@/modules/desk/draft-form";
import { fieldLabel } from "@/modules/revisions/field-labels";
import { kindOfPath, labelOfPath } from "@/modules/revisions/readable-diff";

const example = () => JSON.parse(readFileSync(path.join(process.cwd(), "examples", "pile-cap.json"), "utf8")) as AnalysisInputDocument;

function parsed(doc: unknown) {
  const p = parseAnalysisInput(doc);
  if (!p.ok) throw new Error(JSON.stringify(p.issues));
  return p.input;
}

async function errorsOf(form: unknown): Promise<unknown> {
  try {
    await draftFormSchema.validate(form, { abortEarly: false });
    return {};
  } catch (e) {
    const out: Record<string, string> = {};
    for (const inner of (e as { inner: { path: string; message: string }[] }).inner) out[inner.path] = inner.message;
    return out;
  }
}

describe("the design form keeps the piles", () => {
  it("the pile-cap example survives form -> document and a stored draft", () => {
    const input = parsed(example());
    const form = formFromInput(input);
    expect(form.impedance.method).toBe("piles");
    expect(form.impedance.piles?.heads).toHaveLength(4);
    expect(parsed(toInputDocument(form))).toEqual(input);
    expect(parsed(toInputDocument(formFromDraftDocument(JSON.parse(JSON.stringify(example())))))).toEqual(input);
  });

  it("end-bearing, linear profile, no interaction and a pile density given through the API survive too", () => {
    const base = example();
    const doc = { ...base, impedance: { ...(base.impedance as object), tip: "end-bearing", soilProfile: "linear", interaction: "none", pileDensity: 7850 } };
    const input = parsed(doc);
    expect(parsed(toInputDocument(formFromInput(input)))).toEqual(input);
  });

  it("blank pile fields make the draft incomplete, not invalid; a complete group is complete", async () => {
    const form = formFromInput(parsed(example()));
    expect(formCompleteness(await errorsOf(form))).toBe("complete");
    const blank = structuredClone(form);
    blank.impedance.piles!.diameter = null;
    blank.impedance.piles!.heads.push(newPileHead());
    const errors = (await errorsOf(blank)) as Record<string, string>;
    expect(Object.keys(errors)).toEqual(expect.arrayContaining(["impedance.piles.diameter", "impedance.piles.heads[4].x"]));
    expect(formCompleteness(errors)).toBe("incomplete");
  });

  it("the engine's paths land on the form's pile fields", () => {
    expect(formFieldOfIssue("impedance.piles[1]", "piles")).toBe("impedance.piles.heads.1.x");
    expect(formFieldOfIssue("impedance.piles[0].y", "piles")).toBe("impedance.piles.heads.0.y");
    expect(formFieldOfIssue("impedance.length", "piles")).toBe("impedance.piles.length");
    expect(formFieldOfIssue("soil.poissonRatio", "piles")).toBe("soil.poissonRatio");
    expect(formFieldOfIssue("impedance.length", "gazetas")).toBe("impedance.length");
  });
});

describe("a comparison names the pile inputs", () => {
  it("with the trade's words and their quantity", () => {
    expect(labelOfPath("impedance.diameter")).toContain("pile diameter");
    expect(kindOfPath("impedance.diameter")).toBe("length");
    expect(kindOfPath("impedance.length")).toBe("length");
    expect(kindOfPath("impedance.youngsModulus")).toBe("modulus");
    expect(labelOfPath("impedance.youngsModulus")).toContain("Young's modulus of the pile");
    expect(labelOfPath("impedance.piles[2].x")).toBe("impedance · pile · no. 3 · x");
    expect(fieldLabel("impedance.tip")).toBe("Soil springs · pile tip");
    // the same words elsewhere keep their own meaning
    expect(kindOfPath("sizing.length")).toBeUndefined();
  });
});

describe("comparing two revisions of a pile cap", () => {
  it("lists the changed pile length and Ep as inputs, in their units, with the change", async () => {
    const { analyse } = await import("@/modules/calc");
    const { readableDiff } = await import("@/modules/revisions/readable-diff");
    const a = example();
    const b = { ...a, impedance: { ...(a.impedance as object), length: 16, youngsModulus: 3.4e10 } };
    const side = (doc: AnalysisInputDocument) => ({ input: doc, result: analyse(parsed(doc)) });
    const d = readableDiff(side(a), side(b as AnalysisInputDocument), "si");
    const length = d.inputs.find((r) => r.path === "impedance.length");
    expect(length?.label).toContain("pile length");
    expect(length?.unit).toBe("m");
    expect(length?.oldText).toBe("14.00");
    expect(length?.newText).toBe("16.00");
    const ep = d.inputs.find((r) => r.path === "impedance.youngsModulus");
    expect(ep?.unit).toBe("MPa");
    expect(ep?.deltaText).toBe("+4,000");
  });
});
