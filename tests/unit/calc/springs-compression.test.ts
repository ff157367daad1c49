// Springs and piles carry the block's weight themselves (engine 1.7.0): the static load in each
// spring by hand (rigid block on linear springs, statics: m g / 4 for four equal springs under a
// symmetric block), the no-lift-off check against the vertical SDOF transmitted force (Chopra,
// Dynamics of Structures, §3.6), and the soil bearing-pressure check kept for information only
// (not applicable) under springs and piles while a soil method keeps it as it was.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyse, checkVerdict, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { transmissibility, type SpringInput } from "@/modules/calc/impedance-springs";
import { speedGridRpm } from "@/modules/calc/sweep-grid";
import { governingCheck } from "@/modules/desk/foundation-summary";
import { summariseResults } from "@/modules/desk/results-summary";
import { clearsWithMargin } from "@/modules/sizing/evaluate";
import { relClose } from "./helpers";

const G = 9.80665;

const corners = (a: number, b: number, kz: number, kh: number): SpringInput[] => [
  { x: -a, y: -b, kz, kh },
  { x: a, y: -b, kz, kh },
  { x: -a, y: b, kz, kh },
  { x: a, y: b, kz, kh },
];

function doc(o: { springs?: SpringInput[]; cg?: [number, number, number]; speedRpm?: number; range?: [number, number]; unbalanceForce?: number; allowable?: number; dampingRatio?: number } = {}): AnalysisInputDocument {
  const speedRpm = o.speedRpm ?? 1480;
  const cg = o.cg ?? [0, 0, 1.0];
  return {
    schemaVersion: 1,
    block: { concreteDensity: 2400, solids: [{ name: "inertia block", x: [-1.5, 1.5], y: [-1, 1], z: [0, 0.6] }] },
    soil: { shearModulus: 6e7, poissonRatio: 0.33, density: 1900, allowableBearingPressure: o.allowable ?? 150000 },
    impedance: { method: "springs", springs: o.springs ?? corners(1.3, 0.8, 4e5, 3e5), ...(o.dampingRatio === undefined ? {} : { dampingRatio: o.dampingRatio }) },
    machines: [
      {
        name: "Fan",
        mass: 1500,
        cg,
        rotors: [
          {
            name: "Impeller",
            mass: 300,
            speedRpm,
            speedRangeRpm: o.range ?? [1200, speedRpm],
            ...(o.unbalanceForce === undefined ? { balanceGrade: 6.3 } : { unbalanceForce: o.unbalanceForce }),
            axis: "x",
            bearings: [
              [cg[0] - 0.5, cg[1], cg[2]],
              [cg[0] + 0.5, cg[1], cg[2]],
            ],
          },
        ],
      },
    ],
  };
}

function run(d: AnalysisInputDocument) {
  const p = parseAnalysisInput(d);
  if (!p.ok) throw new Error(JSON.stringify(p.issues));
  return analyse(p.input);
}

describe("static load per spring (statics of a rigid block on linear springs)", () => {
  it("four equal springs under a symmetric block: m g / 4 each (hand calculation)", () => {
    const result = run(doc());
    const m = result.massProperties.totalMass;
    // hand: block 3 x 2 x 0.6 m of 2400 kg/m3 = 8640 kg, plus the 1500 kg fan
    expect(m).toBeCloseTo(8640 + 1500, 6);
    for (const load of result.springs!.staticLoads!) expect(relClose(load, (m * G) / 4, 1e-12)).toBe(true);
    // and each spring's load is kz times the static deflection W / sum kz
    for (const load of result.springs!.staticLoads!) expect(relClose(load, 4e5 * result.springs!.staticDeflection, 1e-12)).toBe(true);
  });

  it("cg off O: the loads carry W and its moments about both axes (equilibrium)", () => {
    const springs = corners(1.3, 0.8, 4e5, 3e5);
    const result = run(doc({ springs, cg: [0.4, -0.2, 1.0] }));
    const loads = result.springs!.staticLoads!;
    const w = result.massProperties.totalMass * G;
    const [xc, yc] = result.massProperties.cg;
    const sum = loads.reduce((s, f) => s + f, 0);
    const mx = loads.reduce((s, f, i) => s + f * springs[i]!.x, 0);
    const my = loads.reduce((s, f, i) => s + f * springs[i]!.y, 0);
    expect(relClose(sum, w, 1e-12)).toBe(true);
    expect(relClose(mx, w * xc!, 1e-9)).toBe(true);
    expect(relClose(my, w * yc!, 1e-9)).toBe(true);
    // the springs nearer the cg carry more: +x, -y corner the most
    expect(loads[1]).toBeGreaterThan(loads[2]!);
  });
});

describe("spring-compression: every spring stays in compression (no lift-off, common practice)", () => {
  it("one check per spring; its dynamic force is at least the vertical SDOF transmitted force TR F / 4 at every speed of the range (Chopra §3.6)", () => {
    const result = run(doc());
    const checks = result.checks.filter((c) => c.id === "spring-compression");
    expect(checks).toHaveLength(4);
    const rotor = result.rotors[0]!;
    const fz = result.springs!.verticalFrequencyHz;
    const zeta = result.springs!.verticalDampingRatio;
    const modesHz = result.modes.map((m) => m.frequencyHz);
    // vertical case through the cg above O: pure heave, the force per spring is TR F(w) / 4
    let sdof = 0;
    for (const rpm of speedGridRpm([1200, 1480], 1480, modesHz)) {
      const f = rotor.forceAmplitude * (rpm / 1480) ** 2;
      sdof = Math.max(sdof, (transmissibility(rpm / 60 / fz, zeta) * f) / 4);
    }
    const staticLoad = result.springs!.staticLoads![0]!;
    for (const c of checks) {
      expect(c.limit).toBe(1);
      expect(c.comparison).toBe("min");
      expect(c.source).toMatch(/no lift-off/);
      expect(c.value).toBeLessThanOrEqual((staticLoad / sdof) * (1 + 1e-9));
      expect(c.value).toBeGreaterThan(1);
      expect(c.pass).toBe(true);
    }
    // the rated-speed forces of the result are inside the envelope the check uses
    const rated = Math.max(...result.springs!.rotors[0]!.springForces.map((lc) => lc.forces[0]![2]));
    expect(checks[0]!.value).toBeLessThanOrEqual((staticLoad / rated) * (1 + 1e-9));
  });

  it("fails when the speed range crosses the isolator resonance with a large unbalance: the vertical SDOF alone lifts the springs", () => {
    // fz = sqrt(1.6e6 / 10140) / 2 pi = 2.0 Hz = 120 rpm, inside 110-130 rpm; damping 0.5 %
    const result = run(doc({ speedRpm: 130, range: [110, 130], unbalanceForce: 5000, dampingRatio: 0.005 }));
    const fz = result.springs!.verticalFrequencyHz;
    expect(fz * 60).toBeGreaterThan(110);
    expect(fz * 60).toBeLessThan(130);
    // at resonance TR = sqrt(1 + 4 zeta^2) / (2 zeta) ~ 100: F(fz) TR / 4 against m g / 4
    const atResonance = (5000 * ((fz * 60) / 130) ** 2 * transmissibility(1, 0.005)) / 4;
    const staticLoad = result.springs!.staticLoads![0]!;
    expect(atResonance).toBeGreaterThan(staticLoad);
    const checks = result.checks.filter((c) => c.id === "spring-compression");
    expect(checks).toHaveLength(4);
    for (const c of checks) {
      expect(c.pass).toBe(false);
      expect(c.value).toBeLessThanOrEqual((staticLoad / atResonance) * (1 + 1e-6));
    }
    expect(summariseResults(result).failing).toBeGreaterThanOrEqual(4);
  });
});

describe("bearing pressure under springs and piles: not applicable, kept for information", () => {
  it("springs: a pressure far over the allowable does not fail, govern or hold a size back; the reason is given", () => {
    // allowable 1 kPa: the block's 16.6 kPa would fail the soil check by far
    const result = run(doc({ allowable: 1000 }));
    const bearing = result.checks.find((c) => c.id === "bearing-pressure")!;
    expect(bearing.value).toBeCloseTo(result.massProperties.staticBearingPressure / 1000, 12);
    expect(bearing.value).toBeGreaterThan(bearing.limit);
    expect(bearing.pass).toBe(true);
    expect(bearing.notApplicable?.reason).toMatch(/springs/);
    expect(checkVerdict(bearing)).toBe("not-applicable");
    expect(governingCheck(result)!.label).not.toBe(bearing.label);
    expect(governingCheck(result)!.total).toBe(result.checks.length - 1);
    expect(clearsWithMargin(bearing, 0.2)).toBe(true);
  });

  it("piles (examples/pile-cap.json): the cap's bearing check is not applicable with the piles as reason", () => {
    const p = parseAnalysisInput(JSON.parse(readFileSync("examples/pile-cap.json", "utf8")));
    if (!p.ok) throw new Error("pile-cap.json");
    const bearing = analyse(p.input).checks.find((c) => c.id === "bearing-pressure")!;
    expect(bearing.notApplicable?.reason).toMatch(/piles/);
    expect(checkVerdict(bearing)).toBe("not-applicable");
  });

  it("a soil method keeps the check deciding: the same block on soil fails it", () => {
    const d = doc({ allowable: 1000 });
    d.impedance = { method: "equivalent-radius" };
    const bearing = run(d).checks.find((c) => c.id === "bearing-pressure")!;
    expect(bearing.notApplicable).toBeUndefined();
    expect(bearing.pass).toBe(false);
    expect(checkVerdict(bearing)).toBe("fail");
    expect(clearsWithMargin(bearing, 0)).toBe(false);
  });
});
