// Vertical shafts (axis "z", vertical pumps): the unbalance force turns in the plan, so the load
// cases are horizontal along x, horizontal along y and rotating in the horizontal plane. Checked by
// identities against the horizontal-shaft cases (the same force direction gives the same response)
// and by the rotating case being the 90-degree combination of the two horizontal ones.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { bearingWeights, forceDirection, loadCasesFor, unitLoads } from "@/modules/calc/unbalance";
import type { RotorInput } from "@/modules/calc/schema";
import { relClose, symmetricBlock } from "./helpers";

const rotor = (over: Partial<RotorInput>): RotorInput => ({
  name: "R",
  mass: 800,
  speedRpm: 1480,
  serviceFactor: 1,
  balanceGrade: 6.3,
  axis: "z",
  unbalanceMode: "static",
  bearings: [
    [0.3, 0.2, 1.8],
    [0.3, 0.2, 2.6],
  ],
  ...over,
});

function run(over: Partial<RotorInput>) {
  const doc = symmetricBlock({ rotor: { ...rotor(over), name: "R" }, materialDamping: 0.03 });
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}

describe("vertical-shaft load cases", () => {
  it("are horizontal-x, horizontal-y and rotating, with no vertical force", () => {
    expect(loadCasesFor("z")).toEqual(["horizontal-x", "horizontal-y", "rotating"]);
    const loads = unitLoads(rotor({}), rotor({}).bearings);
    expect(loads.map((l) => l.case)).toEqual(["horizontal-x", "horizontal-y", "rotating"]);
    for (const l of loads) {
      expect(l.re[2]).toBe(0);
      expect(l.im[2]).toBe(0);
    }
    // Rotating about +z by the right-hand rule: F = [cos wt, sin wt, 0] -> [1, -i, 0].
    expect(forceDirection("z", "rotating")).toEqual({ re: [1, 0, 0], im: [0, -1, 0] });
    expect(loads[2]!.combine).toEqual({ a: 0, b: 1 });
  });

  it("horizontal-x of a vertical shaft equals the horizontal case of a shaft along y (both push along x)", () => {
    const bearings: RotorInput["bearings"] = [[0.3, 0.2, 2.2]];
    const vertical = run({ axis: "z", bearings });
    const alongY = run({ axis: "y", bearings });
    const a = vertical.rotors[0]!.cases.find((c) => c.case === "horizontal-x")!;
    const b = alongY.rotors[0]!.cases.find((c) => c.case === "horizontal")!;
    expect(a.points.length).toBe(b.points.length);
    a.points.forEach((p, i) => {
      for (let k = 0; k < 3; k++) expect(relClose(p.displacementPeak[k]!, b.points[i]!.displacementPeak[k]!, 1e-9, 1e-18)).toBe(true);
    });
    expect(relClose(a.transmissibility, b.transmissibility, 1e-9)).toBe(true);
  });

  it("the rotating case's per-axis amplitudes are those of the two horizontal cases (90 degrees apart)", () => {
    const r = run({});
    const byCase = Object.fromEntries(r.rotors[0]!.cases.map((c) => [c.case, c]));
    const rot = byCase.rotating!;
    const hx = byCase["horizontal-x"]!;
    const hy = byCase["horizontal-y"]!;
    // |U_rot| >= each single-direction amplitude on every axis is not an identity in general; but on the
    // symmetric block with the bearing on the vertical axis through O the x and y responses decouple:
    // x-motion comes from the x-force only, y-motion from the y-force only.
    const onAxis = run({ bearings: [[0, 0, 2.2]] });
    const c = Object.fromEntries(onAxis.rotors[0]!.cases.map((k) => [k.case, k]));
    const p = (name: string) => c[name]!.points[0]!.displacementPeak;
    expect(relClose(p("rotating")[0]!, p("horizontal-x")[0]!, 1e-9)).toBe(true);
    expect(relClose(p("rotating")[1]!, p("horizontal-y")[1]!, 1e-9)).toBe(true);
    expect(p("rotating")[2]!).toBeLessThan(1e-15);
    expect(rot.points.length).toBe(hx.points.length);
    expect(hy.points.length).toBe(hx.points.length);
  });

  it("couple unbalance weighs the end bearings along z, and needs them apart along the shaft", () => {
    expect(bearingWeights(rotor({}).bearings, "z", "couple")).toEqual([0.5, -0.5]);
    const flat = parseAnalysisInput(symmetricBlock({ rotor: rotor({ unbalanceMode: "couple", bearings: [[0, -0.5, 2], [0, 0.5, 2]] }) }));
    expect(flat.ok).toBe(false);
    if (!flat.ok) expect(flat.issues.map((i) => i.message).join(" ")).toMatch(/along the shaft axis/);
  });

  it("a speed ramp on a vertical shaft takes only the plan load cases", () => {
    const doc = symmetricBlock({ rotor: rotor({}) });
    const bad = parseAnalysisInput({ ...doc, transient: [{ machine: "M", rotor: "R", kind: "run-up", durationS: 10, case: "vertical" }] });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.issues.some((i) => i.path.includes("case") && /horizontal-x/.test(i.message))).toBe(true);
    const good = parseAnalysisInput({ ...doc, transient: [{ machine: "M", rotor: "R", kind: "run-up", durationS: 10, case: "horizontal-y" }] });
    expect(good.ok).toBe(true);
    const badH = parseAnalysisInput({ ...symmetricBlock(), transient: [{ machine: "M", rotor: "R", kind: "run-up", durationS: 10, case: "horizontal-x" }] });
    expect(badH.ok).toBe(false);
  });
});
