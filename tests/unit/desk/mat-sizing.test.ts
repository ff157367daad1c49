// The desk's side of the sizing assistant: the panel's starting bounds come from the mat in
// the form, and loading a proposal changes exactly the coordinates applySizingProposal moves,
// leaving every other input (blank criteria included) as the designer typed it.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { applySizingProposal } from "@/modules/sizing";
import { emptyDraftForm, formFromInput, toInputDocument, type DraftForm } from "@/modules/desk/draft-form";
import { loadProposalIntoForm, matDimensionsOfForm, suggestedMatBounds } from "@/modules/desk/mat-sizing";

const pumpTrainForm = (): DraftForm =>
  formFromInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples/raw-water-pump-train.json"), "utf8")) as AnalysisInputDocument);

describe("starting bounds", () => {
  it("reads the demo mat (7.6 m x 3.2 m x 1.1 m) and brackets it on the 0.1 m grid", () => {
    const form = pumpTrainForm();
    expect(matDimensionsOfForm(form)).toEqual({ length: 7.6, width: expect.closeTo(3.2, 12), thickness: expect.closeTo(1.1, 12) });
    expect(suggestedMatBounds(form)).toEqual({
      length: { min: 6.0, max: 9.9, step: 0.1 },
      width: { min: 2.5, max: 4.2, step: 0.1 },
      thickness: { min: 0.9, max: 1.6, step: 0.1 },
    });
  });

  it("takes the lowest solid that is not a void, wherever it is listed", () => {
    const form = emptyDraftForm();
    form.block.solids = [
      { name: "plinth", x: [-1, 1], y: [-0.5, 0.5], z: [1, 1.4], void: false },
      { name: "pit", x: [-0.2, 0.2], y: [-0.2, 0.2], z: [0, 0.5], void: true },
      { name: "mat", x: [-2.5, 2.5], y: [-1.5, 1.5], z: [0, 1], void: false },
    ];
    expect(matDimensionsOfForm(form)).toEqual({ length: 5, width: 3, thickness: 1 });
  });

  it("has no bounds to offer while the mat's coordinates are blank", () => {
    const form = emptyDraftForm();
    form.block.solids[0]!.x = [null, 2];
    expect(matDimensionsOfForm(form)).toBeNull();
    expect(suggestedMatBounds(form)).toBeNull();
  });
});

describe("loading a proposal into the form", () => {
  const proposal = { dimensions: { length: 8.1, width: 3.4, thickness: 1.2 }, placement: { mode: "current" as const } };

  it("gives the form whose document is applySizingProposal's document, and changes nothing else", () => {
    const form = pumpTrainForm();
    const out = loadProposalIntoForm(form, proposal);
    if (!out.ok) throw new Error(JSON.stringify(out.issues));
    const applied = applySizingProposal(toInputDocument(form), proposal);
    if (!applied.ok) throw new Error(JSON.stringify(applied.issues));
    expect(toInputDocument(out.form)).toEqual(applied.document);

    expect(out.form.block.solids[0]).toMatchObject({ name: "mat", x: [-4.05, 4.05], y: [-1.7, 1.7], z: [0, 1.2] });
    // The plinths, the machines and the bearings rise with the 0.1 m thicker mat.
    expect(out.form.block.solids[1]!.z).toEqual([1.2, 1.5]);
    expect(out.form.machines[0]!.cg[2]).toBeCloseTo(2.3, 12);
    expect(out.form.machines[1]!.rotors[0]!.bearings[0]![2]).toBeCloseTo(2.3, 12);
    // Everything that is not a coordinate stays as it was, blanks included.
    for (const key of ["soil", "impedance", "criteria", "soilBand", "sweep"] as const) expect(out.form[key]).toEqual(form[key]);
    expect(out.form.criteria.minMassRatio).toBeNull();
    expect(out.form.machines.map((m) => [m.name, m.mass, m.rotors.map((r) => [r.mass, r.speedRpm, r.balanceGrade, r.serviceFactor])])).toEqual(
      form.machines.map((m) => [m.name, m.mass, m.rotors.map((r) => [r.mass, r.speedRpm, r.balanceGrade, r.serviceFactor])]),
    );
    // The form given is not changed.
    expect(form.block.solids[0]!.x).toEqual([-3.8, 3.8]);
  });

  it("turns the failing demo into one passing every nominal check for a size big enough", () => {
    const out = loadProposalIntoForm(pumpTrainForm(), proposal);
    if (!out.ok) throw new Error(JSON.stringify(out.issues));
    const parsed = parseAnalysisInput(toInputDocument(out.form));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    // nominal soil: the separation at the upper soil bound is a band check (band-checks.test.ts)
    expect(analyse(parsed.input).checks.filter((c) => !c.pass && !c.soilCase)).toEqual([]);
  });

  it("refuses a size that cannot hold the plinths, naming the dimension", () => {
    const out = loadProposalIntoForm(pumpTrainForm(), { ...proposal, dimensions: { ...proposal.dimensions, length: 5 } });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.issues.map((i) => `${i.in}.${i.path}`)).toContain("proposal.dimensions.length");
  });

  it("refuses a form that is not a complete input, naming the field", () => {
    const form = pumpTrainForm();
    form.soil.density = null;
    const out = loadProposalIntoForm(form, proposal);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.issues).toContainEqual(expect.objectContaining({ in: "input", path: "soil.density" }));
  });
});
