// Issue 18 item 2: a draft may be saved incomplete. The draft schema (modules/calc/draft-input.ts)
// and the form model (modules/desk/draft-form.ts) tell a blank (saveable, "required") from a
// wrong value (refused), and an incomplete document opens in the form again.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput, parseDraftInput } from "@/modules/calc";
import { draftFormSchema, emptyDraftForm, formCompleteness, formFromDraftDocument, newMachine, toInputDocument, type DraftForm } from "@/modules/desk/draft-form";

const example = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "aeration-blower.json"), "utf8")) as Record<string, unknown>;

async function formErrors(form: DraftForm): Promise<Record<string, unknown>> {
  try {
    await draftFormSchema.validate(form, { abortEarly: false });
    return {};
  } catch (e) {
    const errors: Record<string, unknown> = {};
    for (const inner of (e as { inner: { path?: string; message: string }[] }).inner) errors[inner.path ?? ""] = inner.message;
    return errors;
  }
}

describe("draft schema: incomplete vs invalid", () => {
  it("a complete input is complete, with the contract's defaults applied", () => {
    const r = parseDraftInput(example);
    expect(r.ok && r.complete).toBe(true);
  });

  it("the new foundation's empty form is incomplete, not invalid, and names what is missing as required", () => {
    const r = parseDraftInput(toInputDocument(emptyDraftForm()));
    expect(r).toMatchObject({ ok: true, complete: false });
    if (!r.ok || r.complete) return;
    const byPath = Object.fromEntries(r.missing.map((i) => [i.path, i.message]));
    expect(byPath["soil.poissonRatio"]).toBe("is required");
    expect(byPath["soil.density"]).toBe("is required");
    expect(byPath["machines[0].mass"]).toBe("is required");
    expect(r.missing.every((i) => i.message === "is required")).toBe(true);
  });

  it("a machine with only a name, and no machine at all, are incomplete", () => {
    const form = emptyDraftForm();
    form.machines = [{ ...newMachine(1), name: "Pump" }];
    expect(parseDraftInput(toInputDocument(form))).toMatchObject({ ok: true, complete: false });
    form.machines = [];
    const none = parseDraftInput(toInputDocument(form));
    expect(none).toMatchObject({ ok: true, complete: false });
    if (none.ok && !none.complete) expect(none.missing.map((i) => i.path)).toContain("machines");
  });

  it("a wrong value that is there (a negative mass, an unknown field) is refused, the blanks named beside it", () => {
    const form = emptyDraftForm();
    form.machines[0]!.mass = -100;
    const r = parseDraftInput(toInputDocument(form));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues).toContainEqual({ path: "machines[0].mass", message: "must be greater than 0" });
    expect(r.issues).toContainEqual({ path: "soil.density", message: "is required" });
    const extra = parseDraftInput({ ...(toInputDocument(emptyDraftForm()) as object), colour: "grey" });
    expect(extra.ok).toBe(false);
    if (!extra.ok) expect(extra.issues).toContainEqual({ path: "colour", message: "unknown field" });
    // a value of the wrong type is not a blank
    const text = toInputDocument(emptyDraftForm()) as { soil: Record<string, unknown> };
    text.soil.density = "heavy";
    expect(parseDraftInput(text).ok).toBe(false);
  });

  it("the full contract names a blank as required, not as 'must be a finite number'", () => {
    const r = parseAnalysisInput(toInputDocument(emptyDraftForm()));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues.find((i) => i.path === "soil.density")?.message).toBe("is required");
    expect(r.issues.some((i) => /finite/.test(i.message))).toBe(false);
  });
});

describe("form model: incomplete vs invalid", () => {
  it("the empty form is incomplete: every error says Required", async () => {
    const errors = await formErrors(emptyDraftForm());
    expect(Object.keys(errors).length).toBeGreaterThan(0);
    expect(errors["soil.density"]).toMatch(/^Required/);
    expect(formCompleteness(errors)).toBe("incomplete");
  });

  it("a negative mass makes the form invalid even with blanks beside it", async () => {
    const form = emptyDraftForm();
    form.machines[0]!.mass = -5;
    expect(formCompleteness(await formErrors(form))).toBe("invalid");
  });

  it("no machines at all is incomplete", async () => {
    const form = emptyDraftForm();
    form.machines = [];
    const errors = await formErrors(form);
    expect(errors.machines).toMatch(/^Required/);
    expect(formCompleteness(errors)).toBe("incomplete");
  });

  it("reads Formik's nested errors too", () => {
    expect(formCompleteness({})).toBe("complete");
    expect(formCompleteness({ machines: [{ mass: "Required: the machine mass" }] })).toBe("incomplete");
    expect(formCompleteness({ machines: [{ mass: "The machine mass must be greater than 0" }], soil: { density: "Required: the soil density" } })).toBe("invalid");
  });

  it("an incomplete stored document opens in the form with its blanks and its values", () => {
    const form = emptyDraftForm();
    form.machines = [{ ...newMachine(1), name: "Pump", mass: 1200 }];
    const back = formFromDraftDocument(toInputDocument(form));
    expect(back.machines[0]?.name).toBe("Pump");
    expect(back.machines[0]?.mass).toBe(1200);
    expect(back.soil.density).toBeNull();
    expect(toInputDocument(back)).toEqual(toInputDocument(form));
    // a document missing whole parts still opens
    expect(formFromDraftDocument({ schemaVersion: 1 }).machines).toEqual([]);
  });
});
