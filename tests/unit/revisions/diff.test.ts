import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInput } from "@/modules/calc";
import { diffDocuments, diffRevisions, flippedChecks, listLeafPaths } from "@/modules/revisions";

function example(file: string): AnalysisInput {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", file), "utf8")));
  if (!parsed.ok) throw new Error(`${file} is not valid`);
  return parsed.input;
}

const clone = <T>(v: T): T => structuredClone(v);

describe("diffDocuments on nested inputs", () => {
  it("reports a changed leaf deep inside named arrays with old, new, absolute and per-cent change", () => {
    const a = example("raw-water-pump-train.json");
    const b = clone(a);
    const rotor = b.machines[1]?.rotors[0];
    if (!rotor) throw new Error("example has no pump rotor");
    rotor.mass = 1210;
    b.soil.poissonRatio = 0.33;
    const d = diffDocuments(a, b);
    expect(d.entries).toEqual([
      { path: "soil.poissonRatio", group: "soil", kind: "changed", old: 0.3, new: 0.33, absoluteChange: expect.closeTo(0.03, 12), percentChange: expect.closeTo(10, 9) },
      {
        path: 'machines["Raw-water pump RWP-101"].rotors["impeller"].mass',
        group: "machines",
        kind: "changed",
        old: 1100,
        new: 1210,
        absoluteChange: 110,
        percentChange: expect.closeTo(10, 9),
      },
    ]);
    expect(d.unchanged.block).toBeGreaterThan(20);
  });

  it("finds nothing between a document and a copy with its keys in another order", () => {
    const a = example("aeration-blower.json");
    const reverseKeys = (v: unknown): unknown =>
      Array.isArray(v) ? v.map(reverseKeys) : v && typeof v === "object" ? Object.fromEntries(Object.entries(v).reverse().map(([k, x]) => [k, reverseKeys(x)])) : v;
    const reordered = reverseKeys(a);
    expect(Object.keys(reordered as object)[0]).not.toBe(Object.keys(a)[0]);
    expect(diffDocuments(a, reordered).entries).toEqual([]);
  });

  it("lists an added optional member and a removed one as whole subtrees", () => {
    const d = diffDocuments({ soil: { density: 1900 } }, { soil: { density: 1900, embedmentDepth: 0.5 }, checkPoints: [{ name: "coupling", position: [0, 0, 2] }] });
    expect(d.entries.map((e) => [e.kind, e.path, e.new])).toEqual([
      ["added", "soil.embedmentDepth", 0.5],
      ["added", 'checkPoints["coupling"].name', "coupling"],
      ["added", 'checkPoints["coupling"].position[0]', 0],
      ["added", 'checkPoints["coupling"].position[1]', 0],
      ["added", 'checkPoints["coupling"].position[2]', 2],
    ]);
    const back = diffDocuments({ a: { b: [1, 2] } }, {});
    expect(back.entries.map((e) => [e.kind, e.path, e.old])).toEqual([
      ["removed", "a.b[0]", 1],
      ["removed", "a.b[1]", 2],
    ]);
  });

  it("reports a change of type (number to object) as removed then added", () => {
    const d = diffDocuments({ k: 3 }, { k: { v: 3 } });
    expect(d.entries.map((e) => `${e.kind} ${e.path}`)).toEqual(["removed k", "added k.v"]);
  });
});

describe("boxes added, removed and reordered", () => {
  const base = example("raw-water-pump-train.json");

  it("a reordered list of named boxes is no change", () => {
    const b = clone(base);
    b.block.solids.reverse();
    expect(diffDocuments(base, b).entries).toEqual([]);
  });

  it("an added box is added, a removed box is removed, and the others are matched by name", () => {
    const b = clone(base);
    b.block.solids = b.block.solids.filter((s) => s.name !== "drain pit");
    b.block.solids.unshift({ name: "cable trench", x: [-1, 1], y: [1.2, 1.6], z: [0.8, 1.1], void: true });
    const d = diffDocuments(base, b);
    const kinds = new Map<string, Set<string>>();
    for (const e of d.entries) {
      const box = /solids\["([^"]+)"\]/.exec(e.path)?.[1] ?? "?";
      (kinds.get(box) ?? kinds.set(box, new Set()).get(box))?.add(e.kind);
    }
    expect(Object.fromEntries([...kinds].map(([k, v]) => [k, [...v]]))).toEqual({ "drain pit": ["removed"], "cable trench": ["added"] });
    expect(d.entries.find((e) => e.path === 'block.solids["cable trench"].void')).toMatchObject({ kind: "added", new: true });
  });

  it("falls back to positions when names repeat, so duplicates are still compared", () => {
    const a = { block: { solids: [{ name: "pier", x: [0, 1] }, { name: "pier", x: [2, 3] }] } };
    const b = { block: { solids: [{ name: "pier", x: [0, 1] }, { name: "pier", x: [2, 3.5] }] } };
    expect(diffDocuments(a, b).entries).toMatchObject([{ path: "block.solids[1].x[1]", old: 3, new: 3.5, kind: "changed" }]);
  });

  it("matches machines and rotors by name even when both lists are reordered", () => {
    const b = clone(base);
    b.machines.reverse();
    const motor = b.machines.find((m) => m.name === "Motor RWM-101");
    if (!motor) throw new Error("no motor");
    motor.mass = 9800;
    expect(diffDocuments(base, b).entries.map((e) => e.path)).toEqual(['machines["Motor RWM-101"].mass']);
  });

  it("compares bearings (unnamed coordinates) by position in the list", () => {
    const b = clone(base);
    const bearings = b.machines[0]?.rotors[0]?.bearings;
    if (!bearings) throw new Error("no bearings");
    bearings.reverse();
    const d = diffDocuments(base, b);
    expect(d.entries.map((e) => e.path)).toEqual([
      'machines["Motor RWM-101"].rotors["rotor"].bearings[0][0]',
      'machines["Motor RWM-101"].rotors["rotor"].bearings[1][0]',
    ]);
  });
});

describe("numeric tolerance", () => {
  it("treats values within the relative tolerance (1e-9 by default) as equal", () => {
    expect(diffDocuments({ v: 1000 }, { v: 1000 * (1 + 5e-10) }).entries).toEqual([]);
    expect(diffDocuments({ v: 1000 }, { v: 1000 * (1 + 5e-9) }).entries).toHaveLength(1);
    expect(diffDocuments({ v: 0 }, { v: 0 }).entries).toEqual([]);
  });

  it("takes a looser relative or an absolute tolerance when asked", () => {
    expect(diffDocuments({ v: 1000 }, { v: 1000.5 }, { relativeTolerance: 1e-3 }).entries).toEqual([]);
    expect(diffDocuments({ v: 0 }, { v: 1e-14 }).entries).toHaveLength(1);
    expect(diffDocuments({ v: 0 }, { v: 1e-14 }, { absoluteTolerance: 1e-12 }).entries).toEqual([]);
  });

  it("gives no per-cent change from zero, only the absolute one", () => {
    const [e] = diffDocuments({ v: 0 }, { v: 2 }).entries;
    expect(e).toEqual({ path: "v", group: "v", kind: "changed", old: 0, new: 2, absoluteChange: 2 });
  });

  it("counts the unchanged leaves of each group for folding", () => {
    const d = diffDocuments({ a: { x: 1, y: 2 }, b: [1, 2, 3] }, { a: { x: 1, y: 2.5 }, b: [1, 2, 3] });
    expect(d.unchanged).toEqual({ a: 1, b: 3 });
  });
});

describe("diffRevisions", () => {
  it("puts the checks whose verdict flipped first, with old and new values, and leaves the sweep to the plots", () => {
    const failing = example("raw-water-pump-train.json");
    const passing = example("raw-water-pump-train-enlarged.json");
    const older = { input: failing, result: analyse(failing) };
    const newer = { input: passing, result: analyse(passing) };
    const d = diffRevisions(older, newer);
    expect(d.flippedChecks.map((f) => [f.key, f.oldPass, f.newPass])).toEqual([["mass-ratio", false, true]]);
    expect(d.flippedChecks[0]?.newValue).toBeGreaterThan(4);
    expect(d.result.entries.some((e) => e.path.startsWith("sweep"))).toBe(false);
    expect(d.result.entries.find((e) => e.path === "massProperties.massRatio")).toMatchObject({ kind: "changed" });
    expect(d.input.entries.find((e) => e.path === 'block.solids["mat"].x[0]')).toMatchObject({ old: -3.8, new: -4.2 });
  });

  it("lists a band check whose verdict flipped at the upper soil bound, and a failure newly accepted with its justification", () => {
    const demo = example("raw-water-pump-train.json");
    // upper factor 1: the upper bound is the nominal soil, where mode 6 clears the running speed
    const before = { ...demo, soilBand: { upperFactor: 1 } };
    const older = { input: before, result: analyse(before) };
    const newer = { input: demo, result: analyse(demo) };
    const keys = ["frequency-separation@soil-upper/Motor RWM-101/rotor/mode-6", "frequency-separation@soil-upper/Raw-water pump RWP-101/impeller/mode-6"];
    const flips = diffRevisions(older, newer).flippedChecks.filter((f) => f.soilCase === "upper");
    expect(flips.map((f) => [f.key, f.oldVerdict, f.newVerdict])).toEqual(keys.map((k) => [k, "pass", "fail"]));
    expect(flips[0]!.newValue).toBeCloseTo(0.0231, 4);
    const justification = "Site tests bound G at 1.2 x nominal; see the geotechnical addendum (demo text).";
    const accepted = { ...demo, acceptances: [{ checkKey: keys[0]!, justification }] };
    const d = diffRevisions(newer, { input: accepted, result: analyse(accepted) });
    expect(d.flippedChecks.map((f) => [f.key, f.oldVerdict, f.newVerdict, f.newPass, f.justification])).toEqual([[keys[0], "fail", "accepted", false, justification]]);
    expect(d.input.entries.some((e) => e.path.startsWith("acceptances") && e.kind === "added")).toBe(true);
  });

  it("orders newly failing checks before newly passing ones", () => {
    const check = (key: string, pass: boolean) => ({ id: key, key, label: key, value: 1, limit: 1, pass, source: "s" });
    const flips = flippedChecks([check("b", false), check("a", true), check("c", true)], [check("b", true), check("a", false), check("c", true)]);
    expect(flips.map((f) => `${f.key}:${f.newPass}`)).toEqual(["a:false", "b:true"]);
  });

  it("finds no difference between a revision and itself", () => {
    const input = example("aeration-blower.json");
    const rev = { input, result: analyse(input) };
    const d = diffRevisions(rev, rev);
    expect(d.flippedChecks).toEqual([]);
    expect(d.input.entries).toEqual([]);
    expect(d.result.entries).toEqual([]);
  });
});

describe("listLeafPaths", () => {
  it("names every input field with the same paths the diff uses", () => {
    const paths = listLeafPaths(example("raw-water-pump-train.json")).map((p) => p.path);
    expect(paths).toContain("soil.poissonRatio");
    expect(paths).toContain('machines["Raw-water pump RWP-101"].rotors["impeller"].mass');
    expect(paths).toContain('block.solids["mat"].z[1]');
  });
});
