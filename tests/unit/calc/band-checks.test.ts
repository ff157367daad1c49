// Checks at both ends of the soil band (band-checks.ts) and the designer's acceptance of a band
// exceedance with a written justification, on the demo pump train (examples/).
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, checkVerdict, nominalCheckId, parseAnalysisInput, type AnalysisInputDocument, type AnalysisResult, type CheckResult } from "@/modules/calc";

const demoPath = path.resolve(import.meta.dirname, "../../../examples/raw-water-pump-train.json");
const demo = (): AnalysisInputDocument => JSON.parse(readFileSync(demoPath, "utf8")) as AnalysisInputDocument;

function run(doc: AnalysisInputDocument, options?: { soilBand?: boolean }): AnalysisResult {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input, options);
}

const UPPER_SEP_MOTOR = "frequency-separation@soil-upper/Motor RWM-101/rotor/mode-6";
const UPPER_SEP_PUMP = "frequency-separation@soil-upper/Raw-water pump RWP-101/impeller/mode-6";
const JUSTIFICATION = "Dynamic plate-load tests on the compacted fill give G well under 1.5 x nominal; see geotechnical report GR-07 section 4 (demo text).";

/** The nominal counterpart of a band check: the same key without the `@soil-<bound>` part. */
const nominalKey = (c: CheckResult) => (c.key ?? "").replace(/@soil-(lower|upper)/, "");

describe("band checks on the demo pump train", () => {
  const result = run(demo());
  const byKey = new Map(result.checks.map((c) => [c.key, c]));

  it("at the upper bound (1.5 G) the rocking mode is 2.3 % from the running speed: separation fails (r = 1.023 against 20 %)", () => {
    const c = byKey.get(UPPER_SEP_MOTOR)!;
    expect(c).toBeDefined();
    expect(c.id).toBe("frequency-separation@soil-upper");
    expect(c.soilCase).toBe("upper");
    expect(c.soilFactor).toBeCloseTo(1.5, 12);
    expect(c.pass).toBe(false);
    expect(checkVerdict(c)).toBe("fail");
    // r = 1785 rpm / 60 / f6 at the upper bound
    const r = result.bounds!.upper.frequencyRatios[0]!.ratios[5]!;
    expect(r).toBeCloseTo(1.023, 3);
    expect(c.value).toBeCloseTo(r - 1, 12);
    expect(c.limit).toBe(0.2);
    expect(c.label).toMatch(/^At the upper soil bound \(G x 1\.5\): Mode 6/);
    // the same mode at nominal soil clears the running speed: the nominal check keeps its id and passes
    const nominal = byKey.get("frequency-separation/Motor RWM-101/rotor/mode-6")!;
    expect(nominal.id).toBe("frequency-separation");
    expect(nominal.soilCase).toBeUndefined();
    expect(nominal.pass).toBe(true);
    expect(byKey.get(UPPER_SEP_PUMP)?.pass).toBe(false);
  });

  // issue 18 item 7: the combined displacement and velocity of the motor and pump (one speed) are
  // soil-dependent checks too, so they are repeated at the bounds as well
  it("separation, displacement and velocity (single rotors and combined) are repeated at both bounds (and nothing else)", () => {
    const repeated = ["frequency-separation", "displacement", "velocity", "displacement-combined", "velocity-combined"];
    const nominalSoil = result.checks.filter((c) => !c.soilCase && repeated.includes(c.id));
    for (const bound of ["lower", "upper"] as const) {
      const at = result.checks.filter((c) => c.soilCase === bound);
      expect(at.map(nominalKey).sort()).toEqual(nominalSoil.map((c) => c.key).sort());
      expect(new Set(at.map((c) => nominalCheckId(c)))).toEqual(new Set(repeated));
    }
    const keys = result.checks.map((c) => c.key);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it("the band's amplitude checks carry the bound's own responses (largest equals the bound's governing amplitude)", () => {
    for (const bound of ["lower", "upper"] as const) {
      const g = result.bounds![bound].governing;
      const max = (id: string) => Math.max(...result.checks.filter((c) => c.id === `${id}@soil-${bound}`).map((c) => c.value));
      expect(max("displacement")).toBeCloseTo(g.displacementPeakOverSpeedRange, 15);
      expect(max("velocity")).toBeCloseTo(g.velocityPeakOverSpeedRange, 15);
    }
  });

  it("an amplitude limit that fails only at a bound is a failed band check", () => {
    const envelope = (id: string) => Math.max(...result.checks.filter((c) => c.id === id).map((c) => c.value));
    const nominalMax = envelope("displacement");
    const worstBound = Math.max(envelope("displacement@soil-lower"), envelope("displacement@soil-upper"));
    expect(worstBound).toBeGreaterThan(nominalMax * 1.01);
    // a limit between the nominal envelope and the worst bound's
    const doc = demo();
    const out = run({ ...doc, criteria: { ...doc.criteria, maxDisplacementPeak: (nominalMax + worstBound) / 2 } });
    expect(out.checks.filter((c) => c.id === "displacement" && !c.pass)).toEqual([]);
    expect(out.checks.filter((c) => /^displacement@soil-/.test(c.id) && !c.pass).length).toBeGreaterThan(0);
  });
});

describe("limit cases", () => {
  it("band off: no band checks and no bounds", () => {
    const result = run(demo(), { soilBand: false });
    expect(result.bounds).toBeUndefined();
    expect(result.checks.filter((c) => c.soilCase !== undefined || c.id.includes("@soil-"))).toEqual([]);
  });

  it("band factors 1 and 1: every band check has the nominal check's value and verdict", () => {
    const result = run({ ...demo(), soilBand: { lowerFactor: 1, upperFactor: 1 } });
    const nominal = new Map(result.checks.filter((c) => !c.soilCase).map((c) => [c.key, c]));
    const band = result.checks.filter((c) => c.soilCase);
    expect(band.length).toBeGreaterThan(0);
    for (const c of band) {
      const n = nominal.get(nominalKey(c))!;
      expect(n).toBeDefined();
      expect(c.pass).toBe(n.pass);
      expect(Math.abs(c.value - n.value)).toBeLessThanOrEqual(1e-12 * Math.max(Math.abs(n.value), 1e-30));
    }
  });
});

describe("acceptance of a band exceedance", () => {
  it("is recorded on the check, shown as accepted with justification, and does not flip pass to true", () => {
    const result = run({ ...demo(), acceptances: [{ checkKey: UPPER_SEP_MOTOR, justification: JUSTIFICATION }] });
    const c = result.checks.find((x) => x.key === UPPER_SEP_MOTOR)!;
    expect(c.pass).toBe(false);
    expect(c.value).toBeCloseTo(0.0231, 4);
    expect(c.acceptance).toEqual({ justification: JUSTIFICATION });
    expect(checkVerdict(c)).toBe("accepted");
    // only the named check: the pump's identical exceedance stays a plain failure
    const other = result.checks.find((x) => x.key === UPPER_SEP_PUMP)!;
    expect(other.acceptance).toBeUndefined();
    expect(checkVerdict(other)).toBe("fail");
  });

  it("of a passing check or of a key the result does not have: no effect, and a warning says so", () => {
    const passing = "frequency-separation@soil-lower/Motor RWM-101/rotor/mode-6";
    const missing = "velocity@soil-upper/No such machine/rotor/vertical/static/bearing 1";
    const result = run({
      ...demo(),
      acceptances: [
        { checkKey: passing, justification: JUSTIFICATION },
        { checkKey: missing, justification: JUSTIFICATION },
      ],
    });
    const c = result.checks.find((x) => x.key === passing)!;
    expect(c.pass).toBe(true);
    expect(c.acceptance).toBeUndefined();
    expect(result.warnings.some((w) => w.includes(passing) && w.includes("passes"))).toBe(true);
    expect(result.warnings.some((w) => w.includes(missing) && w.includes("no effect"))).toBe(true);
  });

  it("is validated: a band key, a written justification, each check once", () => {
    const bad = parseAnalysisInput({
      ...demo(),
      acceptances: [
        { checkKey: "mass-ratio", justification: JUSTIFICATION },
        { checkKey: UPPER_SEP_MOTOR, justification: "ok" },
        { checkKey: UPPER_SEP_PUMP, justification: JUSTIFICATION },
        { checkKey: UPPER_SEP_PUMP, justification: JUSTIFICATION },
        { checkKey: UPPER_SEP_MOTOR, justification: JUSTIFICATION, accepted: true },
      ],
    });
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    const paths = bad.issues.map((i) => i.path);
    expect(paths).toContain("acceptances[0].checkKey");
    expect(paths).toContain("acceptances[1].justification");
    expect(paths).toContain("acceptances[3].checkKey");
    expect(paths).toContain("acceptances[4].accepted");
    expect(bad.issues.find((i) => i.path === "acceptances[0].checkKey")?.message).toMatch(/only band checks/);
  });
});
