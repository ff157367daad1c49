// Rotors responding together (combination.ts, issue 18 item 7): identities of the same-speed
// superposition (worst relative phase and in phase), the different-speed absolute sum, and the
// combined checks at nominal soil and at the band's bounds.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument, type AnalysisResult, type CombinedResult } from "@/modules/calc";
import { combinedPoints, sameSpeedCombination } from "@/modules/calc/combination";
import { buildModel } from "@/modules/calc/model";
import type { AnalysisInput } from "@/modules/calc/schema";
import { runSoilCase } from "@/modules/calc/soil-case";
import { symmetricBlock } from "./helpers";

type RotorDoc = NonNullable<AnalysisInputDocument["machines"][number]["rotors"]>[number];

function parse(doc: AnalysisInputDocument): AnalysisInput {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.input;
}
const run = (doc: AnalysisInputDocument): AnalysisResult => analyse(parse(doc));

/** The symmetric block with the machine's rotors replaced (a cg off the axis makes every mode couple). */
function withRotors(rotors: RotorDoc[], criteria?: AnalysisInputDocument["criteria"]): AnalysisInputDocument {
  const doc = symmetricBlock({ materialDamping: 0.03 });
  const m = doc.machines[0]!;
  m.mass = 8000;
  m.cg = [0.3, 0.2, 2.2];
  m.rotors = rotors;
  doc.checkPoints = [{ name: "corner", position: [3, 2, 1.5] }];
  if (criteria) doc.criteria = criteria;
  return doc;
}

const motor: RotorDoc = { name: "motor", mass: 900, speedRpm: 1480, speedRangeRpm: [1400, 1480], balanceGrade: 6.3, axis: "x", bearings: [[-2, 0.1, 2.2], [-0.8, 0.1, 2.2]] };
const pump: RotorDoc = { name: "pump", mass: 600, speedRpm: 1480, speedRangeRpm: [1400, 1480], balanceGrade: 6.3, axis: "x", bearings: [[0.6, 0.1, 2.0], [1.9, 0.1, 2.0]], unbalanceMode: "both" };
const fan: RotorDoc = { name: "fan", mass: 500, speedRpm: 2950, balanceGrade: 2.5, axis: "y", bearings: [[1, -1, 2.4], [1, 1, 2.4]] };

const caseOf = (c: CombinedResult, name: string, mode = "static") => c.cases.find((x) => x.case === name && x.unbalanceMode === mode)!;

describe("same-speed combination", () => {
  it("a single rotor's combination equals its own response at every point, case and speed-range envelope", () => {
    const model = buildModel(parse(withRotors([motor])));
    const sc = runSoilCase(model, 1);
    const rotor = model.rotors[0]!;
    const combo = sameSpeedCombination([rotor], combinedPoints(model, [rotor]), sc.solver, sc.modes.map((m) => m.frequencyHz));
    const own = sc.rotors[0]!;
    expect(combo.map((c) => `${c.case}/${c.unbalanceMode}`)).toEqual(own.cases.map((c) => `${c.case}/${c.unbalanceMode}`));
    combo.forEach((c, k) => {
      const ownCase = own.cases[k]!;
      expect(c.points.map((p) => p.name)).toEqual(ownCase.points.map((p) => p.name));
      c.points.forEach((p, i) => {
        const q = ownCase.points[i]!;
        for (let a = 0; a < 3; a++) {
          expect(p.displacementPeak[a]).toBeCloseTo(q.displacementPeak[a]!, 15);
          expect(p.inPhase.displacementPeak[a]).toBeCloseTo(q.displacementPeak[a]!, 15);
          expect(p.velocityPeak[a]).toBeCloseTo(q.velocityPeak[a]!, 15);
        }
        expect(p.overSpeedRange.displacementPeak).toBeCloseTo(q.overSpeedRange!.displacementPeak, 15);
        expect(p.overSpeedRange.velocityPeak).toBeCloseTo(q.overSpeedRange!.velocityPeak, 15);
      });
    });
  });

  it("two identical rotors at the same place and speed give exactly twice the single amplitude, in phase and at the worst phase", () => {
    const twin = { ...motor, name: "twin" };
    const result = run(withRotors([motor, twin]));
    expect(result.combined).toHaveLength(1);
    const combo = result.combined![0]!;
    expect(combo.rule).toBe("same-speed");
    expect(combo.speedRpm).toBe(1480);
    expect(combo.group).toEqual(["M motor", "M twin"]);
    const single = result.rotors[0]!;
    for (const c of single.cases) {
      const cc = caseOf(combo, c.case, c.unbalanceMode);
      // the combined points: motor's bearings, twin's bearings, then the check point
      expect(cc.points.map((p) => p.name)).toEqual(["M motor bearing 1", "M motor bearing 2", "M twin bearing 1", "M twin bearing 2", "corner"]);
      const pairs: [number, number][] = [[0, 0], [1, 1], [4, 2]];
      for (const [ci, si] of pairs) {
        const p = cc.points[ci]!;
        const q = c.points[si]!;
        for (let a = 0; a < 3; a++) {
          expect(p.inPhase.displacementPeak[a]! / q.displacementPeak[a]!).toBeCloseTo(2, 12);
          expect(p.displacementPeak[a]! / q.displacementPeak[a]!).toBeCloseTo(2, 12);
        }
        expect(p.inPhase.overSpeedRange.displacementPeak / q.overSpeedRange!.displacementPeak).toBeCloseTo(2, 12);
      }
    }
  });

  it("the worst phase is never below the in-phase case, and differs from it when the rotors are apart", () => {
    const result = run(withRotors([motor, pump]));
    const combo = result.combined![0]!;
    let strictly = 0;
    for (const c of combo.cases) {
      for (const p of c.points) {
        for (let a = 0; a < 3; a++) {
          expect(p.displacementPeak[a]).toBeGreaterThanOrEqual(p.inPhase.displacementPeak[a]! * (1 - 1e-12));
          if (p.displacementPeak[a]! > p.inPhase.displacementPeak[a]! * 1.001) strictly++;
        }
        expect(p.overSpeedRange.displacementPeak).toBeGreaterThanOrEqual(p.inPhase.overSpeedRange.displacementPeak * (1 - 1e-12));
      }
    }
    expect(strictly).toBeGreaterThan(0);
  });

  it("the worst phase per point and axis is the sum of the rotors' amplitudes there (each rotor's own response at that point)", () => {
    const result = run(withRotors([motor, pump]));
    const combo = result.combined![0]!;
    // the check point is a response point of every rotor: compare there
    for (const c of result.rotors[0]!.cases) {
      const cc = caseOf(combo, c.case, c.unbalanceMode);
      const p = cc.points.find((x) => x.name === "corner")!;
      const m = c.points.find((x) => x.name === "corner")!;
      // the pump has both modes; in the static combined case it takes its static case
      const pc = result.rotors[1]!.cases.find((x) => x.case === c.case && x.unbalanceMode === "static")!;
      const q = pc.points.find((x) => x.name === "corner")!;
      for (let a = 0; a < 3; a++) expect(p.displacementPeak[a]).toBeCloseTo(m.displacementPeak[a]! + q.displacementPeak[a]!, 15);
    }
    // the pump's couple cases appear as combined cases, with the motor's static response in them
    expect(combo.cases.map((c) => `${c.case}/${c.unbalanceMode}`)).toEqual([
      "vertical/static",
      "horizontal/static",
      "rotating/static",
      "vertical/couple",
      "horizontal/couple",
      "rotating/couple",
    ]);
  });
});

describe("rotors with different shaft axes at one speed", () => {
  it("a vertical shaft with a horizontal one: every case of either, a missing case taken from the rotor's rotating case", () => {
    const vertical: RotorDoc = { name: "vpump", mass: 400, speedRpm: 1480, speedRangeRpm: [1400, 1480], balanceGrade: 6.3, axis: "z", bearings: [[1.5, -1, 1.8], [1.5, -1, 2.6]] };
    const result = run(withRotors([motor, vertical]));
    const combo = result.combined![0]!;
    expect(combo.cases.map((c) => c.case)).toEqual(["vertical", "horizontal", "horizontal-x", "horizontal-y", "rotating"]);
    const at = (rotor: number, name: string) => result.rotors[rotor]!.cases.find((c) => c.case === name)!.points.find((p) => p.name === "corner")!;
    const pairs: [string, string, string][] = [
      ["vertical", "vertical", "rotating"],
      ["horizontal", "horizontal", "rotating"],
      ["horizontal-x", "rotating", "horizontal-x"],
      ["rotating", "rotating", "rotating"],
    ];
    for (const [key, m, v] of pairs) {
      const p = caseOf(combo, key).points.find((x) => x.name === "corner")!;
      for (let a = 0; a < 3; a++) expect(p.displacementPeak[a]).toBeCloseTo(at(0, m).displacementPeak[a]! + at(1, v).displacementPeak[a]!, 15);
    }
  });
});

describe("different speeds", () => {
  it("the all-speeds combination is the absolute sum of the speed groups' peaks, per point and axis and over the ranges", () => {
    const result = run(withRotors([motor, fan]));
    expect(result.combined).toHaveLength(1);
    const all = result.combined![0]!;
    expect(all.id).toBe("all-speeds");
    expect(all.speedRpm).toBeUndefined();
    expect(JSON.stringify(result)).not.toContain("null");
    expect(all.rule).toBe("different-speeds-sum");
    expect(all.ruleText).toMatch(/absolute sum/);
    for (const key of ["vertical", "horizontal", "rotating"]) {
      const m = result.rotors[0]!.cases.find((c) => c.case === key)!.points.find((p) => p.name === "corner")!;
      const f = result.rotors[1]!.cases.find((c) => c.case === key)!.points.find((p) => p.name === "corner")!;
      const p = caseOf(all, key).points.find((x) => x.name === "corner")!;
      for (let a = 0; a < 3; a++) {
        expect(p.displacementPeak[a]).toBeCloseTo(m.displacementPeak[a]! + f.displacementPeak[a]!, 15);
        expect(p.velocityPeak[a]).toBeCloseTo(m.velocityPeak[a]! + f.velocityPeak[a]!, 15);
        expect(p.inPhase.displacementPeak[a]).toBeCloseTo(m.displacementPeak[a]! + f.displacementPeak[a]!, 15);
      }
      expect(p.overSpeedRange.displacementPeak).toBeCloseTo(m.overSpeedRange!.displacementPeak + f.overSpeedRange!.displacementPeak, 15);
      expect(p.overSpeedRange.velocityPeak).toBeCloseTo(m.overSpeedRange!.velocityPeak + f.overSpeedRange!.velocityPeak, 15);
    }
  });

  it("a same-speed pair and a rotor at another speed: the pair's entry, then all speeds summing the pair's worst phase and the other rotor", () => {
    const result = run(withRotors([motor, pump, fan]));
    expect(result.combined!.map((c) => c.id)).toEqual(["rpm-1480-1400-1480", "all-speeds"]);
    const [pair, all] = result.combined as [CombinedResult, CombinedResult];
    const fanCorner = result.rotors[2]!.cases.find((c) => c.case === "rotating")!.points.find((p) => p.name === "corner")!;
    const pairCorner = caseOf(pair, "rotating").points.find((p) => p.name === "corner")!;
    const allCorner = caseOf(all, "rotating").points.find((p) => p.name === "corner")!;
    for (let a = 0; a < 3; a++) expect(allCorner.displacementPeak[a]).toBeCloseTo(pairCorner.displacementPeak[a]! + fanCorner.displacementPeak[a]!, 15);
    expect(allCorner.inPhase.displacementPeak[0]).toBeCloseTo(pairCorner.inPhase.displacementPeak[0]! + fanCorner.displacementPeak[0]!, 15);
  });

  it("one rotor: no combination and no combined checks", () => {
    const result = run(withRotors([motor]));
    expect(result.combined).toBeUndefined();
    expect(result.checks.some((c) => c.id.includes("combined"))).toBe(false);
  });
});

describe("combined checks", () => {
  it("fail when only the combination exceeds the limit, while every single-rotor check passes", () => {
    const probe = run(withRotors([motor, { ...motor, name: "twin", bearings: [[1.2, -0.1, 2.2], [2.4, -0.1, 2.2]] }]));
    const single = Math.max(...probe.checks.filter((c) => c.id === "displacement").map((c) => c.value));
    const combined = Math.max(...probe.checks.filter((c) => c.id === "displacement-combined").map((c) => c.value));
    expect(combined).toBeGreaterThan(single * 1.05);
    const limit = (single + combined) / 2;
    const result = run(withRotors([motor, { ...motor, name: "twin", bearings: [[1.2, -0.1, 2.2], [2.4, -0.1, 2.2]] }], { maxDisplacementPeak: limit, maxVelocityPeak: 1 }));
    const nominalSingle = result.checks.filter((c) => c.id === "displacement");
    expect(nominalSingle.length).toBeGreaterThan(0);
    expect(nominalSingle.every((c) => c.pass)).toBe(true);
    const failing = result.checks.filter((c) => c.id === "displacement-combined" && !c.pass);
    expect(failing.length).toBeGreaterThan(0);
    const worst = failing.reduce((a, b) => (b.value > a.value ? b : a));
    expect(worst.value).toBeCloseTo(combined, 15);
    expect(worst.limit).toBe(limit);
    expect(worst.combination).toBe("rpm-1480-1400-1480");
    expect(worst.key).toMatch(/^displacement-combined\/rpm-1480-1400-1480\/[a-z-]+\/static\/.+/);
    expect(worst.unit).toBe("m");
  });

  it("one check per combination, case and point for displacement and velocity, each the enveloped combined value", () => {
    const result = run(withRotors([motor, pump, fan]));
    const combos = result.combined!;
    const expected = combos.reduce((n, g) => n + g.cases.reduce((m, c) => m + c.points.length, 0), 0);
    const d = result.checks.filter((c) => c.id === "displacement-combined");
    const v = result.checks.filter((c) => c.id === "velocity-combined");
    expect(d).toHaveLength(expected);
    expect(v).toHaveLength(expected);
    const all = combos[1]!;
    const p = caseOf(all, "vertical").points[0]!;
    const c = d.find((x) => x.key === `displacement-combined/all-speeds/vertical/static/${p.name}`)!;
    expect(c.value).toBe(p.overSpeedRange.displacementPeak);
    expect(new Set(result.checks.map((x) => x.key)).size).toBe(result.checks.length);
  });

  it("the band checks include the combined checks at both bounds, with band factors 1 equal to the nominal ones", () => {
    const doc = withRotors([motor, pump]);
    const result = run(doc);
    const nominal = result.checks.filter((c) => c.id === "displacement-combined");
    for (const bound of ["lower", "upper"] as const) {
      for (const id of ["displacement-combined", "velocity-combined"]) {
        const at = result.checks.filter((c) => c.id === `${id}@soil-${bound}`);
        expect(at).toHaveLength(nominal.length);
        expect(at.every((c) => c.soilCase === bound && c.key!.startsWith(`${id}@soil-${bound}/rpm-1480`))).toBe(true);
      }
    }
    // a stiffer soil moves the combined values
    const upper = result.checks.find((c) => c.key === `displacement-combined@soil-upper/${nominal[0]!.key!.slice("displacement-combined/".length)}`)!;
    expect(upper.value).not.toBeCloseTo(nominal[0]!.value, 12);
    const flat = run({ ...doc, soilBand: { lowerFactor: 1, upperFactor: 1 } });
    const flatNominal = new Map(flat.checks.filter((c) => c.id === "displacement-combined").map((c) => [c.key!.slice("displacement-combined/".length), c]));
    for (const c of flat.checks.filter((x) => x.id === "displacement-combined@soil-upper")) {
      const n = flatNominal.get(c.key!.slice("displacement-combined@soil-upper/".length))!;
      expect(c.value).toBeCloseTo(n.value, 15);
      expect(c.pass).toBe(n.pass);
    }
  });

  it("a failing combined band check can be accepted with a justification", () => {
    const doc = withRotors([motor, pump], { maxDisplacementPeak: 1e-9, maxVelocityPeak: 1 });
    const probe = run(doc);
    const key = probe.checks.find((c) => c.id === "displacement-combined@soil-lower" && !c.pass)!.key!;
    const result = run({ ...doc, acceptances: [{ checkKey: key, justification: "The two rotors are phased by the coupling key; vendor statement (demo text)." }] });
    expect(result.checks.find((c) => c.key === key)!.acceptance).toBeDefined();
  });
});
