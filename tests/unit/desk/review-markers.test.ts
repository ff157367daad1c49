import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput } from "@/modules/calc";
import { formFromInput } from "@/modules/desk/draft-form";
import { formFieldNameOf, placeComments, samePlacement } from "@/modules/desk/review-markers";

function exampleForm() {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")));
  if (!parsed.ok) throw new Error("example does not parse");
  return formFromInput(parsed.input);
}

describe("formFieldNameOf", () => {
  const form = exampleForm();
  it("maps revision paths to the workspace's field names, items found by name", () => {
    expect(formFieldNameOf("soil.poissonRatio", form)).toBe("soil.poissonRatio");
    expect(formFieldNameOf("block.concreteDensity", form)).toBe("block.concreteDensity");
    const pump = form.machines.findIndex((m) => m.name === "Raw-water pump RWP-101");
    expect(pump).toBeGreaterThanOrEqual(0);
    expect(formFieldNameOf('machines["Raw-water pump RWP-101"].rotors["impeller"].mass', form)).toBe(`machines[${pump}].rotors[0].mass`);
    expect(formFieldNameOf('block.solids["mat"].x[1]', form)).toBe("block.solids[0].x[1]");
  });

  it("follows a machine that moved, and finds nothing for results, removed items or groups", () => {
    const swapped = { ...form, machines: [...form.machines].reverse() };
    const pump = swapped.machines.findIndex((m) => m.name === "Raw-water pump RWP-101");
    expect(formFieldNameOf('machines["Raw-water pump RWP-101"].mass', swapped)).toBe(`machines[${pump}].mass`);
    expect(formFieldNameOf('checks["mass-ratio"].value', form)).toBeNull();
    expect(formFieldNameOf("massProperties.massRatio", form)).toBeNull();
    expect(formFieldNameOf('machines["Gone"].mass', form)).toBeNull();
    expect(formFieldNameOf("soil", form)).toBeNull();
    expect(formFieldNameOf("not a path[", form)).toBeNull();
  });

  it("groups comments by field and keeps the unplaced ones", () => {
    const comments = [
      { id: "1", fieldPath: "soil.poissonRatio" },
      { id: "2", fieldPath: "soil.poissonRatio" },
      { id: "3", fieldPath: "massProperties.massRatio" },
      { id: "4", fieldPath: null },
    ];
    const { placed, byField } = placeComments(comments, form);
    expect(byField.get("soil.poissonRatio")?.map((c) => c.id)).toEqual(["1", "2"]);
    expect(byField.size).toBe(1);
    expect(placed.filter((p) => p.fieldName === null).map((p) => p.comment.id)).toEqual(["3", "4"]);
  });
});

describe("samePlacement", () => {
  const form = exampleForm();
  const comments = [
    { id: "1", fieldPath: "soil.poissonRatio" },
    { id: "2", fieldPath: 'machines["Raw-water pump RWP-101"].mass' },
    { id: "3", fieldPath: null },
  ];
  it("holds for the same comments placed again on an edited form", () => {
    const edited = { ...form, soil: { ...form.soil, poissonRatio: 0.31 } };
    expect(samePlacement(placeComments(comments, form), placeComments(comments, edited))).toBe(true);
  });
  it("fails when a comment moves with its machine, or the comments differ", () => {
    const swapped = { ...form, machines: [...form.machines].reverse() };
    expect(samePlacement(placeComments(comments, form), placeComments(comments, swapped))).toBe(false);
    expect(samePlacement(placeComments(comments, form), placeComments(comments.slice(0, 2), form))).toBe(false);
    expect(samePlacement(placeComments(comments, form), placeComments([...comments.map((c) => ({ ...c }))], form))).toBe(false);
  });
});
