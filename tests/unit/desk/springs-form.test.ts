// Issue 16 on the desk: a block on steel springs keeps its springs, dampers and damping ratio
// through the design form (form -> document gives back the same parsed input), so a save from
// the workspace does not lose them.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { formFromDraftDocument, formFromInput, toInputDocument } from "@/modules/desk/draft-form";

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
