// Issue 16 on the desk: a block on steel springs keeps its springs, dampers and damping ratio
// through the design form (form -> document gives back the same parsed input), so a save from
// the workspace does not lose them.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { formFromDraftDocument, formFromInput, toInputDocument } from "@/modules/desk/draft-form";
import { springsOf } from "@/modules/desk/spring-layout";

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
