// The desk's side of the sizing assistant: the panel's starting bounds come from the mat in
// the form, and loading a proposal changes exactly the coordinates applySizingProposal moves,
// leaving every other input (blank criteria included) as the designer typed it.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { applySizingProposal, proposeBlockSizes } from "@/modules/sizing";
import { emptyDraftForm, formFromInput, toInputDocument, type DraftForm } from "@/modules/desk/draft-form";
import { loadProposalIntoForm, matDimensionsOfForm, suggestedMatBounds } from "@/modules/desk/mat-sizing";

const pumpTrainForm = (): DraftForm =>
  formFromInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples/raw-water-pump-train.json"), "utf8")) as AnalysisInputDocument);

describe("starting bounds", () => {
  it("reads the demo mat (7.6 m x 3.2 m x 1.1 m) and starts the bounds from it, growing on the 0.1 m grid", () => {
    const form = pumpTrainForm();
    expect(matDimensionsOfForm(form)).toEqual({ length: 7.6, width: expect.closeTo(3.2, 12), thickness: expect.closeTo(1.1, 12) });
    expect(suggestedMatBounds(form)).toEqual({
      length: { min: 7.6, max: 9.9, step: 0.1 },
      width: { min: 3.2, max: 4.2, step: 0.1 },
      thickness: { min: 1.1, max: 1.6, step: 0.1 },
    });
  });

  it("contains the present mat when it is off the grid, with no smaller candidate than one step below it", () => {
    const form = pumpTrainForm();
    form.block.solids[0]!.x = [-3.825, 3.825]; // 7.65 m
    form.block.solids[0]!.y = [-1.5, 1.5]; // 3 m exactly
    form.block.solids[0]!.z = [0, 0.95];
    const b = suggestedMatBounds(form)!;
    const present = matDimensionsOfForm(form)!;
    for (const d of ["length", "width", "thickness"] as const) {
      expect(b[d].min).toBeLessThanOrEqual(present[d] + 1e-9);
      expect(b[d].max).toBeGreaterThan(present[d]);
      expect(present[d] - b[d].min).toBeLessThan(b[d].step);
    }
    expect(b.length).toEqual({ min: 7.6, max: 10, step: 0.1 });
    expect(b.width).toEqual({ min: 3, max: 3.9, step: 0.1 });
    expect(b.thickness).toEqual({ min: 0.9, max: 1.5, step: 0.1 });
  });

  it("gives bounds the assistant accepts, and its first candidate is no smaller than the present mat on the grid", () => {
    const form = pumpTrainForm();
    const b = suggestedMatBounds(form)!;
    const out = proposeBlockSizes(toInputDocument(form), { dimensions: b, maxAnalyses: 50 });
    if (!out.ok) throw new Error(JSON.stringify(out.issues));
    for (const p of out.result.proposals) {
      expect(p.dimensions.length).toBeGreaterThanOrEqual(7.6);
      expect(p.dimensions.width).toBeGreaterThanOrEqual(3.2 - 1e-9);
      expect(p.dimensions.thickness).toBeGreaterThanOrEqual(1.1 - 1e-9);
    }
    expect(out.result.found).toBe(true);
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

  it("loads the closest-to-passing candidate of a search that found nothing, like a proposal", () => {
    const form = pumpTrainForm();
    // Only sizes up to the present mat: every one is too light (the demo's mass ratio is 2.916 < 3).
    const out = proposeBlockSizes(toInputDocument(form), { dimensions: { length: { min: 7.4, max: 7.6 } } });
    if (!out.ok) throw new Error(JSON.stringify(out.issues));
    const nearest = out.result.nearest;
    expect(out.result.found).toBe(false);
    if (!nearest) throw new Error("no closest candidate");
    const loaded = loadProposalIntoForm(form, nearest);
    if (!loaded.ok) throw new Error(JSON.stringify(loaded.issues));
    expect(matDimensionsOfForm(loaded.form)).toEqual({ length: nearest.dimensions.length, width: expect.closeTo(3.2, 9), thickness: expect.closeTo(1.1, 9) });
    const applied = applySizingProposal(toInputDocument(form), nearest);
    if (!applied.ok) throw new Error(JSON.stringify(applied.issues));
    expect(toInputDocument(loaded.form)).toEqual(applied.document);
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
