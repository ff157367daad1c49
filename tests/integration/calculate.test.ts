// POST /api/v1/calculate: the contract's analysis for any signed-in user, 400 with JSON
// paths for bad input (never a 500), 413 above 1 MB.
import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { ENGINE_VERSION } from "@/modules/calc";
import { callRoute, getFixture, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const ROUTE = "v1/calculate";

interface ErrorBody {
  error: { code: string; message: string; issues?: { path: string; message: string }[] };
}

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});

const calculate = (body: unknown, cookie: string | null = fx.cookies.designer) => callRoute(ROUTE, "POST", {}, { cookie, body });

describe("POST /api/v1/calculate", () => {
  it("answers the analysis result with six ascending modes and the rotor's ratios", async () => {
    const res = await calculate(sampleAnalysisInput());
    expect(res.status).toBe(200);
    const result = (await res.json()) as {
      schemaVersion: number;
      engineVersion: string;
      modes: { frequencyHz: number; dominant: string }[];
      rotors: { frequencyRatios: number[]; speedRpm: number }[];
      checks: { id: string; pass: boolean }[];
    };
    expect(result.schemaVersion).toBe(1);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
    expect(result.modes).toHaveLength(6);
    const hz = result.modes.map((m) => m.frequencyHz);
    expect(hz.every((f) => Number.isFinite(f) && f > 0)).toBe(true);
    expect([...hz].sort((a, b) => a - b)).toEqual(hz);
    // frequencyRatios = rated speed over each mode's frequency (calc-contract.md).
    const rotor = result.rotors[0]!;
    rotor.frequencyRatios.forEach((r, i) => expect(r).toBeCloseTo(rotor.speedRpm / 60 / hz[i]!, 9));
    expect(result.checks.length).toBeGreaterThan(0);
  });

  it("accepts a block on steel springs (method \"springs\", issue 16) and answers its springs results; an asymmetric layout is a 400 naming impedance.springs", async () => {
    const doc = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "fan-on-springs.json"), "utf8")) as { impedance: { springs: { x: number }[] } };
    const res = await calculate(doc);
    expect(res.status).toBe(200);
    const result = (await res.json()) as { impedance: { method: string; stiffness: { z: number } }; springs?: { staticDeflection: number; sumKz: number } };
    expect(result.impedance.method).toBe("springs");
    expect(result.impedance.stiffness.z).toBe(1.6e6);
    expect(result.springs?.sumKz).toBe(1.6e6);
    doc.impedance.springs[0]!.x = -1.0;
    const bad = await calculate(doc);
    expect(bad.status).toBe(400);
    const body = (await bad.json()) as ErrorBody;
    expect(body.error.issues?.some((i) => i.path === "impedance.springs")).toBe(true);
  });

  it("accepts springs on a base block (impedance.base, engine 1.8.0): twelve modes, the base's results and the bearing check on the base; a base above the block's underside is a 400 naming impedance.base.z", async () => {
    const doc = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "fan-on-springs-base-block.json"), "utf8")) as {
      impedance: { base: { z: [number, number]; x: [number, number]; y: [number, number] } };
    };
    const res = await calculate(doc);
    expect(res.status).toBe(200);
    const result = (await res.json()) as {
      modes: { frequencyHz: number; block?: string }[];
      checks: { id: string; value: number; notApplicable?: unknown }[];
      springs?: { base?: { mass: number; staticBearingPressure: number; rotors: { cases: { groundForce: number[] }[] }[] } };
    };
    expect(result.modes).toHaveLength(12);
    expect(result.modes.filter((m) => m.block === "upper")).toHaveLength(6);
    const b = doc.impedance.base;
    const baseMass = 2400 * (b.x[1] - b.x[0]) * (b.y[1] - b.y[0]) * (b.z[1] - b.z[0]);
    expect(result.springs?.base?.mass).toBeCloseTo(baseMass, 6);
    const bearing = result.checks.find((c) => c.id === "bearing-pressure");
    expect(bearing?.notApplicable).toBeUndefined();
    expect(bearing?.value).toBeCloseTo((result.springs?.base?.staticBearingPressure ?? 0) / 200000, 9);
    expect(result.springs?.base?.rotors[0]?.cases[0]?.groundForce[2]).toBeGreaterThan(0);
    doc.impedance.base.z = [-1, 0.2];
    const bad = await calculate(doc);
    expect(bad.status).toBe(400);
    const body = (await bad.json()) as ErrorBody;
    expect(body.error.issues?.some((i) => i.path === "impedance.base.z")).toBe(true);
  });

  it("takes impedance.gazetasDynamic \"pais-kausel\" (engine 1.5.0): the closed forms' rocking dashpot, not the charts'; an unknown option is a 400 naming the field", async () => {
    const doc = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "gazetas-embedded.json"), "utf8")) as { impedance: Record<string, unknown> };
    type Imp = { impedance: { dashpot: { rx: number; ry: number }; details: Record<string, number> } };
    const charts = (await (await calculate(doc)).json()) as Imp;
    const res = await calculate({ ...doc, impedance: { method: "gazetas", gazetasDynamic: "pais-kausel" } });
    expect(res.status).toBe(200);
    const pk = (await res.json()) as Imp;
    expect(charts.impedance.details.chartDynamicCoefficients).toBe(1);
    expect(pk.impedance.details.chartDynamicCoefficients).toBe(0);
    expect(Math.abs(pk.impedance.dashpot.rx / charts.impedance.dashpot.rx - 1)).toBeGreaterThan(0.01);
    const bad = await calculate({ ...doc, impedance: { method: "gazetas", gazetasDynamic: "charts" } });
    expect(bad.status).toBe(400);
    const body = (await bad.json()) as ErrorBody;
    const issue = body.error.issues?.find((i) => i.path === "impedance.gazetasDynamic");
    expect(issue?.message).toContain('"pais-kausel"');
  });

  it("accepts a pile cap on a 2 x 2 group (method \"piles\", engine 1.6.0) with the sway-rocking coupling in the result; piles closer than 2 d and a short rigid pile are 400s naming the field", async () => {
    const doc = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "pile-cap.json"), "utf8")) as { impedance: { piles: { x: number; y: number }[]; length: number } };
    const res = await calculate(doc);
    expect(res.status).toBe(200);
    const result = (await res.json()) as {
      engineVersion: string;
      modes: { frequencyHz: number }[];
      impedance: { method: string; details: Record<string, number>; coupling?: { dofs: string[]; stiffness: number }[] };
    };
    expect(result.engineVersion).toBe("1.9.0");
    expect(result.impedance.method).toBe("piles");
    expect(result.modes).toHaveLength(6);
    expect(result.impedance.details.pileCount).toBe(4);
    expect(result.impedance.coupling?.some((c) => c.dofs.join() === "x,ry" && c.stiffness < 0)).toBe(true);
    const close = structuredClone(doc);
    close.impedance.piles[1] = { x: -1.0, y: -0.8 };
    const bad = await calculate(close);
    expect(bad.status).toBe(400);
    const body = (await bad.json()) as ErrorBody;
    const issue = body.error.issues?.find((i) => i.path === "impedance.piles[1]");
    expect(issue?.message).toContain("2 diameters");
    const short = structuredClone(doc);
    short.impedance.length = 2;
    const shortRes = await calculate(short);
    expect(shortRes.status).toBe(400);
    expect(((await shortRes.json()) as ErrorBody).error.issues?.some((i) => i.path === "impedance.length")).toBe(true);
  });

  it("serves any signed-in account, project member or not", async () => {
    for (const role of ["outsider", "vendor", "viewer", "admin"] as const) {
      expect((await calculate(sampleAnalysisInput(), fx.cookies[role])).status).toBe(200);
    }
  });

  it("asks an anonymous caller to sign in", async () => {
    const res = await calculate(sampleAnalysisInput(), null);
    expect(res.status).toBe(401);
  });

  it("answers 400 listing the JSON path of every problem", async () => {
    const input = sampleAnalysisInput();
    input.soil.poissonRatio = 0.5;
    const machines = input.machines as { rotors: { speedRpm: number }[] }[];
    machines[0]!.rotors[0]!.speedRpm = 0;
    input.unknownThing = 1;
    const res = await calculate(input);
    expect(res.status).toBe(400);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.code).toBe("invalid_input");
    const paths = (body.error.issues ?? []).map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["soil.poissonRatio", "machines[0].rotors[0].speedRpm", "unknownThing"]));
    expect(body.error.issues!.every((i) => i.message.length > 0)).toBe(true);
  });

  it("answers 400, never 500, to bodies of the wrong shape", async () => {
    for (const body of [null, [], 42, "text", { schemaVersion: 2 }, { ...sampleAnalysisInput(), block: { solids: "many" } }]) {
      const res = await calculate(JSON.stringify(body));
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(((await res.json()) as ErrorBody).error.issues?.length).toBeGreaterThan(0);
    }
  });

  it("answers 400 to a body that is not JSON", async () => {
    const res = await calculate("{ schemaVersion: 1,");
    expect(res.status).toBe(400);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.issues?.[0]?.path).toBe("(root)");
  });

  it("answers 413 to a body above 1 MB", async () => {
    const big = { ...sampleAnalysisInput(), padding: "x".repeat(1_100_000) };
    const res = await calculate(JSON.stringify(big));
    expect(res.status).toBe(413);
    expect(((await res.json()) as ErrorBody).error.code).toBe("payload_too_large");
  });
});
