// Issue 16 on the desk: a block on steel springs keeps its springs, dampers and damping ratio
// through the design form (form -> document gives back the same parsed input), so a save from
// the workspace does not lose them.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput, parseDraftInput, type AnalysisInputDocument } from "@/modules/calc";
import { draftFormSchema, formCompleteness, formFieldOfIssue, formFromDraftDocument, formFromInput, newSpringsBase, toInputDocument } from "@/modules/desk/draft-form";
import { springsBaseOf, springsOf } from "@/modules/desk/spring-layout";

const read = (name: string) => JSON.parse(readFileSync(path.join(process.cwd(), "examples", `${name}.json`), "utf8")) as AnalysisInputDocument;

function parsed(doc: unknown) {
  const p = parseAnalysisInput(doc);
  if (!p.ok) throw new Error(JSON.stringify(p.issues));
  return p.input;
}

describe("the design form keeps the springs", () => {
  it("springs with the default damping survive form -> document", () => {
    const input = parsed(read("fan-on-springs"));
    const form = formFromInput(input);
    expect(form.impedance.method).toBe("springs");
    expect(form.impedance.springs).toHaveLength(4);
    expect(form.impedance.springsDampingRatio).toBeNull();
    expect(parsed(toInputDocument(form))).toEqual(input);
  });

  it("a damping ratio, and dampers on every spring, survive form -> document and a stored draft", () => {
    const base = read("fan-on-springs");
    if (base.impedance.method !== "springs") throw new Error("example is not on springs");
    const withRatio = { ...base, impedance: { ...base.impedance, dampingRatio: 0.03 } };
    const a = parsed(withRatio);
    expect(parsed(toInputDocument(formFromInput(a)))).toEqual(a);
    const withDampers = { ...base, impedance: { method: "springs" as const, springs: base.impedance.springs.map((s) => ({ ...s, cz: 2000, ch: 1500 })) } };
    const b = parsed(withDampers);
    expect(parsed(toInputDocument(formFromInput(b)))).toEqual(b);
    expect(parsed(toInputDocument(formFromDraftDocument(JSON.parse(JSON.stringify(withDampers)))))).toEqual(b);
  });
});

describe("the springs the drawing shows (modules/desk/spring-layout.ts)", () => {
  it("every spring with a complete position, numbered by its table row, with its damper; blank rows left out", () => {
    const form = formFromInput(parsed(read("fan-on-springs")));
    const rows = form.impedance.springs!;
    rows[1] = { ...rows[1]!, cz: 2000 };
    rows[2] = { ...rows[2]!, x: null };
    const drawn = springsOf(form)!;
    expect(drawn.map((s) => s.n)).toEqual([1, 2, 4]);
    expect(drawn.map((s) => s.damper)).toEqual([false, true, false]);
    expect(drawn[2]).toMatchObject({ x: 1.3, y: 0.8, kz: 4e5, kh: 3e5 });
  });
  it("nothing to draw for another method or an empty table", () => {
    const form = formFromInput(parsed(read("fan-on-springs")));
    expect(springsOf({ ...form, impedance: { ...form.impedance, method: "gazetas" } })).toBeNull();
    expect(springsOf({ ...form, impedance: { ...form.impedance, springs: [] } })).toBeNull();
  });
});

describe("the design form keeps a base block under the springs (engine 1.8.0)", () => {
  it("the example on a base block, and a base with its own density and a user or Pais & Kausel support, survive form -> document", () => {
    const input = parsed(read("fan-on-springs-base-block"));
    const form = formFromInput(input);
    expect(form.impedance.springsBase?.restsOn).toBe("base");
    expect(form.impedance.springsBase?.x).toEqual([-3.25, 3.25]);
    expect(parsed(toInputDocument(form))).toEqual(input);
    const doc = read("fan-on-springs-base-block");
    if (doc.impedance.method !== "springs" || !doc.impedance.base) throw new Error("example has no base");
    const k = 3e8;
    const user = { ...doc, impedance: { ...doc.impedance, base: { ...doc.impedance.base, concreteDensity: 2300, support: { method: "user" as const, stiffness: { x: k, y: k, z: k, rx: k, ry: k, rz: k }, dampingRatio: { x: 0.1, y: 0.1, z: 0.2, rx: 0.05, ry: 0.05, rz: 0.05 } } } } };
    const a = parsed(user);
    expect(parsed(toInputDocument(formFromInput(a)))).toEqual(a);
    expect(parsed(toInputDocument(formFromDraftDocument(JSON.parse(JSON.stringify(user)))))).toEqual(a);
    const pk = { ...doc, impedance: { ...doc.impedance, base: { ...doc.impedance.base, support: { method: "gazetas" as const, gazetasDynamic: "pais-kausel" as const } } } };
    const b = parsed(pk);
    expect(parsed(toInputDocument(formFromInput(b)))).toEqual(b);
  });

  it("switching back to a rigid floor drops the base from the document; the engine's base paths land on the base's fields", () => {
    const form = formFromInput(parsed(read("fan-on-springs-base-block")));
    const floor = { ...form, impedance: { ...form.impedance, springsBase: { ...form.impedance.springsBase!, restsOn: "floor" as const } } };
    const doc = toInputDocument(floor) as { impedance: Record<string, unknown> };
    expect(doc.impedance.base).toBeUndefined();
    const withoutBase = read("fan-on-springs-base-block") as unknown as { impedance: Record<string, unknown> };
    delete withoutBase.impedance.base;
    expect(parsed(doc)).toEqual(parsed(withoutBase));
    expect(formFieldOfIssue("impedance.base.z", "springs")).toBe("impedance.springsBase.z");
    expect(formFieldOfIssue("impedance.base.x[1]", "springs")).toBe("impedance.springsBase.x.1");
    expect(formFieldOfIssue("impedance.base.support.stiffness.rz", "springs")).toBe("impedance.stiffness.rz");
    expect(formFieldOfIssue("impedance.springs[0]", "springs")).toBe("impedance.springs[0]");
  });
});

describe("the base block the drawing shows (springsBaseOf)", () => {
  it("the base's box, ordered, when the springs rest on it with six coordinates; nothing on a rigid floor or with a blank", () => {
    const form = formFromInput(parsed(read("fan-on-springs-base-block")));
    expect(springsBaseOf(form)).toEqual({ x: [-3.25, 3.25], y: [-2.25, 2.25], z: [-2.1, -0.3] });
    const floor = { ...form, impedance: { ...form.impedance, springsBase: { ...form.impedance.springsBase!, restsOn: "floor" as const } } };
    expect(springsBaseOf(floor)).toBeNull();
    const blank = { ...form, impedance: { ...form.impedance, springsBase: { ...form.impedance.springsBase!, z: [null, -0.3] as [null, number] } } };
    expect(springsBaseOf(blank)).toBeNull();
    expect(springsBaseOf(formFromInput(parsed(read("fan-on-springs"))))).toBeNull();
  });
});

describe("a base block with blanks keeps the draft incomplete, not invalid", () => {
  it("blank base coordinates are missing values in the form and in the draft schema; a wrong order is invalid", async () => {
    const form = formFromInput(parsed(read("fan-on-springs")));
    const blank = { ...form, impedance: { ...form.impedance, springsBase: newSpringsBase() } };
    const errorsOf = async (f: typeof form) => {
      try {
        await draftFormSchema.validate(f, { abortEarly: false });
        return {};
      } catch (e) {
        return Object.fromEntries((e as { inner: { path?: string; message: string }[] }).inner.map((i) => [i.path ?? "", i.message]));
      }
    };
    const errors = await errorsOf(blank);
    expect(Object.keys(errors).some((k) => k.startsWith("impedance.springsBase.z"))).toBe(true);
    expect(formCompleteness(errors)).toBe("incomplete");
    const draft = parseDraftInput(toInputDocument(blank));
    expect(draft).toMatchObject({ ok: true, complete: false });
    if (draft.ok && !draft.complete) expect(draft.missing.some((i) => i.path.startsWith("impedance.base.z"))).toBe(true);
    const reversed = { ...blank, impedance: { ...blank.impedance, springsBase: { ...newSpringsBase(), x: [2, -2] as [number, number], y: [-1, 1] as [number, number], z: [-1, -0.3] as [number, number] } } };
    expect(formCompleteness(await errorsOf(reversed))).toBe("invalid");
  });
});
