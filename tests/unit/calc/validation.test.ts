// Input validation: every physically impossible input is refused with its JSON path.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput, parseAnalysisInputText } from "@/modules/calc";

const examplePath = path.resolve(import.meta.dirname, "../../../examples/raw-water-pump-train.json");
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Json = any;
const base = (): Json => JSON.parse(readFileSync(examplePath, "utf8"));

function issuesOf(doc: unknown) {
  const parsed = parseAnalysisInput(doc);
  if (parsed.ok) throw new Error("expected the input to be refused");
  return parsed.issues;
}

function expectIssue(doc: unknown, path: string, message?: RegExp) {
  const issues = issuesOf(doc);
  const hit = issues.find((i) => i.path === path);
  expect(hit, `issues: ${JSON.stringify(issues)}`).toBeDefined();
  if (message) expect(hit!.message).toMatch(message);
}

describe("analysis input validation", () => {
  it("accepts the example and fills the defaults", () => {
    const parsed = parseAnalysisInput(base());
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const d = { ...base() };
    delete d.soil.materialDamping;
    const again = parseAnalysisInput(d);
    expect(again.ok && again.input.soil.materialDamping).toBe(0);
    expect(again.ok && again.input.machines[0]!.rotors[0]!.serviceFactor).toBe(2);
  });

  it.each([0, 0.5, -0.1, 0.7])("refuses Poisson's ratio %s outside (0, 0.5)", (nu) => {
    const d = base();
    d.soil.poissonRatio = nu;
    expectIssue(d, "soil.poissonRatio", /\(0, 0\.5\)/);
  });

  it("refuses non-positive masses, densities, moduli and speeds", () => {
    const cases: [(d: Json) => void, string][] = [
      [(d) => (d.machines[0].mass = 0), "machines[0].mass"],
      [(d) => (d.machines[1].rotors[0].mass = -5), "machines[1].rotors[0].mass"],
      [(d) => (d.block.concreteDensity = 0), "block.concreteDensity"],
      [(d) => (d.soil.density = -1900), "soil.density"],
      [(d) => (d.soil.shearWaveVelocity = 0), "soil.shearWaveVelocity"],
      [(d) => (d.machines[0].rotors[0].speedRpm = 0), "machines[0].rotors[0].speedRpm"],
      [(d) => (d.soil.allowableBearingPressure = 0), "soil.allowableBearingPressure"],
    ];
    for (const [edit, p] of cases) {
      const d = base();
      edit(d);
      expectIssue(d, p, /greater than 0/);
    }
  });

  it("refuses NaN and Infinity", () => {
    const d = base();
    d.soil.density = Number.NaN;
    expectIssue(d, "soil.density");
    const e = base();
    e.machines[0].cg[2] = Number.POSITIVE_INFINITY;
    expectIssue(e, "machines[0].cg[2]");
  });

  it("needs exactly one of shearModulus and shearWaveVelocity", () => {
    const both = base();
    both.soil.shearModulus = 4e7;
    expectIssue(both, "soil", /exactly one of shearModulus and shearWaveVelocity/);
    const neither = base();
    delete neither.soil.shearWaveVelocity;
    expectIssue(neither, "soil", /exactly one/);
  });

  it("refuses inverted ranges", () => {
    const d = base();
    d.block.solids[0].x = [3.8, -3.8];
    expectIssue(d, "block.solids[0].x", /from < to/);
    const s = base();
    s.machines[0].rotors[0].speedRangeRpm = [1800, 1200];
    expectIssue(s, "machines[0].rotors[0].speedRangeRpm", /from <= to/);
    const w = base();
    w.sweep = { fromHz: 30, toHz: 10 };
    expectIssue(w, "sweep.toHz", /greater than fromHz/);
  });

  it("refuses a rated speed outside its speed range", () => {
    const d = base();
    d.machines[0].rotors[0].speedRangeRpm = [1000, 1500];
    expectIssue(d, "machines[0].rotors[0].speedRangeRpm", /inside/);
  });

  it("refuses voids that cut outside the solids or leave no mass", () => {
    const d = base();
    d.block.solids[3].x = [3.5, 4.5]; // the drain pit poking out of the mat
    expectIssue(d, "block.solids[3]", /cuts outside/);
    const e = base();
    e.block.solids = [e.block.solids[0], { ...e.block.solids[0], name: "hole", void: true }];
    expect(issuesOf(e).some((i) => i.path === "block.solids" && /no \(or negative\) concrete mass/.test(i.message))).toBe(true);
  });

  it("refuses a base with no contact area", () => {
    const d = base();
    // a void filling the bottom 0.2 m of the mat footprint leaves nothing on the soil at z = 0
    d.block.solids[3] = { name: "undercut", x: [-3.8, 3.8], y: [-1.6, 1.6], z: [0, 0.2], void: true };
    expectIssue(d, "block.solids", /no contact area/);
  });

  it("refuses overlapping solids (concrete counted twice)", () => {
    const d = base();
    d.block.solids[1].z = [1.0, 1.4];
    expectIssue(d, "block.solids[1]", /counted twice/);
  });

  it("refuses a rotor with no bearing, and couple unbalance without two end bearings", () => {
    const d = base();
    d.machines[0].rotors[0].bearings = [];
    expectIssue(d, "machines[0].rotors[0].bearings", /at least one bearing/);
    const c = base();
    c.machines[0].rotors[0].bearings = [[-3, 0, 2.2]];
    expectIssue(c, "machines[0].rotors[0].bearings", /two bearings/);
  });

  it("refuses rotors heavier than their machine and ambiguous unbalance data", () => {
    const d = base();
    d.machines[1].rotors[0].mass = 20000;
    expectIssue(d, "machines[1].rotors", /exceed the machine mass/);
    const e = base();
    e.machines[1].rotors[0].unbalanceForce = 1000;
    expectIssue(e, "machines[1].rotors[0]", /exactly one of balanceGrade and unbalanceForce/);
  });

  it("refuses unknown fields with their path", () => {
    const d = base();
    d.soil.frictionAngle = 32;
    d.extra = true;
    const issues = issuesOf(d);
    expect(issues).toContainEqual({ path: "soil.frictionAngle", message: "unknown field" });
    expect(issues).toContainEqual({ path: "extra", message: "unknown field" });
  });

  it("names missing fields and a wrong impedance method", () => {
    const d = base();
    delete d.soil.poissonRatio;
    expectIssue(d, "soil.poissonRatio", /required/);
    const m = base();
    m.impedance = { method: "winkler" };
    expectIssue(m, "impedance.method", /equivalent-radius/);
  });

  it("refuses sidewall contact deeper than the embedment and undamped user springs", () => {
    const d = base();
    d.soil.embedmentDepth = 0.5;
    d.soil.sidewallContactHeight = 0.8;
    expectIssue(d, "soil.sidewallContactHeight", /cannot exceed/);
    const u = base();
    u.soil.materialDamping = 0;
    u.impedance = { method: "user", stiffness: { x: 1e9, y: 1e9, z: 1e9, rx: 1e9, ry: 1e9, rz: 1e9 }, dampingRatio: { x: 0.1, y: 0.1, z: 0, rx: 0.1, ry: 0.1, rz: 0.1 } };
    expectIssue(u, "impedance.dampingRatio.z", /greater than 0/);
  });

  it("a text that is not JSON is one problem at the root", () => {
    const parsed = parseAnalysisInputText("{ not json");
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.issues[0]!.message).toMatch(/not valid JSON/);
  });
});
