// POST /api/v1/sizing: the block-sizing assistant for any signed-in user. The demo's failing
// pump train gets a size that, applied and re-analysed by the core on its own, passes every
// check; bad options and inputs answer 400 with paths prefixed by the document they are in;
// the API caps the analyses; signed out is 401.
import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { applySizingProposal, type SizingResult } from "@/modules/sizing";
import { SIZING_API_DEFAULT_ANALYSES, SIZING_API_MAX_ANALYSES } from "@/modules/desk/mat-sizing";
import { callRoute, getFixture, type Fixture } from "./support/fixture";

const ROUTE = "v1/sizing";

interface ErrorBody {
  error: { code: string; message: string; issues?: { path: string; message: string }[] };
}

const pumpTrain = (): AnalysisInputDocument => JSON.parse(readFileSync(path.join(process.cwd(), "examples/raw-water-pump-train.json"), "utf8")) as AnalysisInputDocument;

// Bounds around the demo mat (7.6 m x 3.2 m x 1.1 m), on the default 0.1 m step.
const OPTIONS = {
  dimensions: { length: { min: 7.0, max: 9.0 }, width: { min: 3.0, max: 4.0 }, thickness: { min: 1.0, max: 1.5 } },
  centre: "current",
  requireSoilBand: false,
};
// With the soil band the block must grow more (its lower-modulus frequencies near the speed):
// wider bounds on a coarser step keep the search short.
const SOIL_BAND_OPTIONS = {
  dimensions: { length: { min: 7.0, max: 12.0, step: 0.5 }, width: { min: 3.0, max: 6.0, step: 0.5 }, thickness: { min: 1.0, max: 2.5, step: 0.5 } },
  centre: "load",
  requireSoilBand: true,
};

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});

const size = (body: unknown, cookie: string | null = fx.cookies.designer) => callRoute(ROUTE, "POST", {}, { cookie, body });

function analyseDocument(doc: unknown) {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(`not a valid input: ${JSON.stringify(parsed.issues)}`);
  return analyse(parsed.input, { soilBand: true });
}

async function issuePaths(res: Response): Promise<string[]> {
  expect(res.status).toBe(400);
  const body = (await res.json()) as ErrorBody;
  expect(body.error.code).toBe("invalid_input");
  expect(body.error.issues?.every((i) => i.message.length > 0)).toBe(true);
  return (body.error.issues ?? []).map((i) => i.path);
}

describe("POST /api/v1/sizing", () => {
  it.each([
    ["the core's checks", OPTIONS],
    ["the core's checks and the soil band", SOIL_BAND_OPTIONS],
  ] as const)("proposes for the failing demo pump train a mat that passes %s once applied and re-analysed", async (_what, options) => {
    const start = pumpTrain();
    // The starting point really fails (the mass ratio at nominal soil, the separation at the upper
    // soil bound), so a pass below is the proposal's doing.
    const before = analyseDocument(start);
    expect(before.checks.filter((c) => !c.pass && !c.soilCase).map((c) => c.id)).toEqual(["mass-ratio"]);
    expect(before.checks.filter((c) => !c.pass && c.soilCase).map((c) => c.id)).toContain("frequency-separation@soil-upper");

    const res = await size({ input: start, options });
    expect(res.status).toBe(200);
    const result = (await res.json()) as SizingResult;
    expect(result.found).toBe(true);
    expect(result.maxAnalyses).toBe(SIZING_API_DEFAULT_ANALYSES);
    expect(result.analysesRun).toBeLessThanOrEqual(SIZING_API_DEFAULT_ANALYSES);
    expect(result.proposals.length).toBeGreaterThan(0);
    const volumes = result.proposals.map((p) => p.concreteVolume);
    expect([...volumes].sort((a, b) => a - b)).toEqual(volumes);

    const first = result.proposals[0]!;
    for (const [d, r] of Object.entries(options.dimensions)) {
      const v = first.dimensions[d as keyof typeof first.dimensions];
      const step = (r as { step?: number }).step ?? 0.1;
      expect(v).toBeGreaterThanOrEqual(r.min - 1e-9);
      expect(v).toBeLessThanOrEqual(r.max + 1e-9);
      expect(Math.abs(v / step - Math.round(v / step))).toBeLessThan(1e-9);
    }
    // The proposal as the answer carries it, applied to the input and analysed by the core
    // with the full sweep and the soil band: every nominal check passes, and every band check
    // too when the band was required.
    const applied = applySizingProposal(start, first);
    if (!applied.ok) throw new Error(JSON.stringify(applied.issues));
    const mat = applied.document.block.solids[0]!;
    expect([mat.x[1] - mat.x[0], mat.y[1] - mat.y[0], mat.z[1] - mat.z[0]].map((v) => Number(v.toFixed(9)))).toEqual([first.dimensions.length, first.dimensions.width, first.dimensions.thickness]);
    const after = analyseDocument(applied.document);
    expect(after.checks.filter((c) => !c.pass && (options.requireSoilBand || !c.soilCase)).map((c) => c.key)).toEqual([]);
    expect(after.massProperties.massRatio).toBeCloseTo(first.massRatio, 9);
    // The soil band's frequencies against the rated speed (no speed ranges in this train),
    // computed here: they clear the default separation of 0.2 only when it was required.
    const separation = (hz: number[]) => Math.min(...after.rotors.flatMap((r) => hz.map((f) => Math.abs(r.speedRpm / 60 / f - 1))));
    const band = Math.min(separation(after.bounds!.lower.frequenciesHz), separation(after.bounds!.upper.frequenciesHz));
    if (options.requireSoilBand) expect(band).toBeGreaterThanOrEqual(0.2);
    // The core's checks: the band's (separation, displacement, velocity at both bounds) only when required.
    expect(first.checksPassed).toBe(after.checks.filter((c) => options.requireSoilBand || !c.soilCase).length);
  });

  it("answers, when nothing in the bounds passes, the checks that fail most often with a hint", async () => {
    const res = await size({ input: pumpTrain(), options: { dimensions: { length: { min: 7.0, max: 7.6 }, width: { min: 3.0, max: 3.2 }, thickness: { min: 1.0, max: 1.1 } } } });
    expect(res.status).toBe(200);
    const result = (await res.json()) as SizingResult;
    expect(result.found).toBe(false);
    expect(result.proposals).toEqual([]);
    expect(result.failures[0]).toMatchObject({ id: "mass-ratio" });
    expect(result.failures[0]!.hint.length).toBeGreaterThan(0);
    expect(result.nearest?.failing.map((c) => c.id)).toContain("mass-ratio");
  });

  it("answers 400 naming each problem of the options under options.*", async () => {
    const paths = await issuePaths(
      await size({ input: pumpTrain(), options: { dimensions: { length: { min: 9, max: 7 }, width: { min: 3, max: 4, step: -0.1 } }, centre: "middle", proposals: 0, colour: "red" } }),
    );
    expect(paths).toEqual(expect.arrayContaining(["options.dimensions.length.max", "options.dimensions.width.step", "options.centre", "options.proposals", "options.colour"]));
    expect(paths.every((p) => p.startsWith("options."))).toBe(true);
  });

  it(`caps the analyses at ${SIZING_API_MAX_ANALYSES} and names the other problems in the same answer`, async () => {
    const paths = await issuePaths(await size({ input: { ...pumpTrain(), soil: { ...pumpTrain().soil, poissonRatio: 0.7 } }, options: { ...OPTIONS, maxAnalyses: SIZING_API_MAX_ANALYSES + 1, centre: "middle" } }));
    expect(paths).toEqual(expect.arrayContaining(["options.maxAnalyses", "options.centre", "input.soil.poissonRatio"]));
    expect(paths.filter((p) => p === "options.maxAnalyses")).toHaveLength(1);
    // Well past the module's own limit too: still the API's one message.
    const far = (await (await size({ input: pumpTrain(), options: { ...OPTIONS, maxAnalyses: 1e6 } })).json()) as ErrorBody;
    expect(far.error.issues).toEqual([{ path: "options.maxAnalyses", message: expect.stringContaining(`at most ${SIZING_API_MAX_ANALYSES}`) }]);
    // The cap itself is accepted.
    const ok = await size({ input: pumpTrain(), options: { ...OPTIONS, requireSoilBand: false, maxAnalyses: SIZING_API_MAX_ANALYSES } });
    expect(ok.status).toBe(200);
    expect(((await ok.json()) as SizingResult).maxAnalyses).toBe(SIZING_API_MAX_ANALYSES);
  });

  it("takes a required margin: 400 naming options.margin when out of range, and proposals that keep it inside every limit", async () => {
    expect(await issuePaths(await size({ input: pumpTrain(), options: { ...OPTIONS, margin: 0.9 } }))).toEqual(["options.margin"]);
    expect(await issuePaths(await size({ input: pumpTrain(), options: { ...OPTIONS, margin: null } }))).toEqual(["options.margin"]);
    const res = await size({ input: pumpTrain(), options: { ...OPTIONS, margin: 0.1 } });
    expect(res.status).toBe(200);
    const body = (await res.json()) as SizingResult;
    expect(body.found).toBe(true);
    const out = applySizingProposal(pumpTrain(), body.proposals[0]!);
    if (!out.ok) throw new Error(JSON.stringify(out.issues));
    // every nominal check of the applied size, re-analysed here, clears its limit by 10 %
    for (const c of analyseDocument(out.document).checks.filter((ch) => !ch.soilCase)) {
      const spare = c.comparison === "min" ? c.value / c.limit - 1 : 1 - Math.abs(c.value) / c.limit;
      expect(spare, c.key).toBeGreaterThanOrEqual(0.1 - 1e-9);
    }
  });

  it("refuses at once a step too fine for its bounds to count the values (it would enumerate a billion Infinity lengths)", async () => {
    const fine = { min: 6, max: 6.4, step: 5e-324 };
    const huge = { min: 1e308, max: 1e308, step: 0.1 };
    const paths = await issuePaths(await size({ input: pumpTrain(), options: { dimensions: { length: fine, width: { ...fine, min: 3, max: 4 }, thickness: huge } } }));
    expect(paths).toEqual(["options.dimensions.length.step", "options.dimensions.width.step", "options.dimensions.thickness.step"]);
  });

  it("answers 400 naming input problems under input.*, and a block it cannot resize by the solid", async () => {
    const bad = pumpTrain() as unknown as { machines: { mass: number }[] };
    bad.machines[0]!.mass = -1;
    const paths = await issuePaths(await size({ input: bad, options: OPTIONS }));
    expect(paths).toContain("input.machines[0].mass");
    expect(paths.every((p) => p.startsWith("input.machines[0]"))).toBe(true);
    expect(await issuePaths(await size({ input: 42, options: OPTIONS }))).toEqual(["input"]);
    const twoOnSoil = pumpTrain();
    twoOnSoil.block.solids.push({ name: "second footing", x: [4.5, 5.5], y: [-1, 1], z: [0, 1] });
    expect(await issuePaths(await size({ input: twoOnSoil, options: OPTIONS }))).toEqual(["input.block.solids[4]"]);
  });

  it("answers 400 to an envelope of the wrong shape and to a body that is not JSON", async () => {
    expect(await issuePaths(await size({ input: pumpTrain() }))).toEqual(["options"]);
    expect(await issuePaths(await size({ options: OPTIONS, extra: 1 }))).toEqual(expect.arrayContaining(["input", "(root)"]));
    expect(await issuePaths(await size(JSON.stringify([1, 2])))).toEqual(["(root)"]);
    expect(await issuePaths(await size("{ input: "))).toEqual(["(root)"]);
  });

  it("answers 413 to a body above 1 MB", async () => {
    const res = await size({ input: { ...pumpTrain(), padding: "x".repeat(1_100_000) }, options: OPTIONS });
    expect(res.status).toBe(413);
    expect(((await res.json()) as ErrorBody).error.code).toBe("payload_too_large");
  });

  it("asks an anonymous caller to sign in, and serves any signed-in account", async () => {
    const anonymous = await size({ input: pumpTrain(), options: OPTIONS }, null);
    expect(anonymous.status).toBe(401);
    expect(((await anonymous.json()) as ErrorBody).error.code).toBe("unauthenticated");
    const viewer = await size({ input: pumpTrain(), options: { ...OPTIONS, maxAnalyses: 3 } }, fx.cookies.viewer);
    expect(viewer.status).toBe(200);
  });
});
