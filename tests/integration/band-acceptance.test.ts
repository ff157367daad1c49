// Accepting a soil-band exceedance with a written justification, against the real database:
// validated on save (field path), saved with the draft, frozen in the revision's input and
// result, and listed by the comparison as a change of verdict. The check never passes.
import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { createFoundation } from "@/db/queries/projects";
import { GET as compareRevisions } from "@/app/api/v1/projects/[projectId]/foundations/[foundationId]/revisions/compare/route";
import type { AnalysisResult } from "@/modules/calc";
import { callRoute, getFixture, makeRequest, type Fixture } from "./support/fixture";

const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";
const LIST = "v1/projects/[projectId]/foundations/[foundationId]/revisions";
const ONE = `${LIST}/[revisionId]`;
const KEY = "frequency-separation@soil-upper/Motor RWM-101/rotor/mode-6";
const TEXT = "Cross-hole tests on this fill bound G at 1.2 x nominal; see geotechnical addendum 2 (demo text).";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies read loosely; the assertions pin them down
type Loose = Record<string, any>;
const json = async (res: Response) => (await res.json()) as Loose;
const demo = () => JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")) as Loose;

let fx: Fixture;
let p: { projectId: string; foundationId: string };

beforeAll(async () => {
  fx = await getFixture();
  const f = await createFoundation({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId, { tag: `BAND-IT-${Date.now()}`, machineTrain: "Band test", location: "" });
  p = { projectId: fx.projectId, foundationId: f.id };
});

afterAll(async () => {
  await closeDb();
});

async function save(input: Loose) {
  const current = await json(await callRoute(DRAFT, "GET", p, { cookie: fx.cookies.designer }));
  return callRoute(DRAFT, "PUT", p, { cookie: fx.cookies.designer, body: { version: current.draft.version, input } });
}

async function issue(): Promise<string> {
  const version = (await json(await callRoute(DRAFT, "GET", p, { cookie: fx.cookies.designer }))).draft.version as number;
  const res = await callRoute(LIST, "POST", p, { cookie: fx.cookies.designer, body: { draftVersion: version, note: "Band checks reviewed." } });
  expect(res.status).toBe(201);
  return (await json(res)).revision.id as string;
}

async function revision(id: string): Promise<{ input: Loose; result: AnalysisResult }> {
  return (await json(await callRoute(ONE, "GET", { ...p, revisionId: id }, { cookie: fx.cookies.checker }))).revision;
}

describe("acceptance of a band exceedance", () => {
  it("is validated on save, recorded in the revision, shown as accepted with the justification, and compared as a change of verdict", async () => {
    expect((await save(demo())).status).toBe(200);
    const a = await issue();
    const ra = await revision(a);
    const before = ra.result.checks.find((c) => c.key === KEY)!;
    expect(before).toMatchObject({ pass: false, soilCase: "upper" });
    expect(before.acceptance).toBeUndefined();
    const returned = await callRoute(`${ONE}/decision`, "POST", { ...p, revisionId: a }, { cookie: fx.cookies.checker, body: { outcome: "returned", note: "band" } });
    expect(returned.status).toBe(201);

    // a word or two is no justification, and a nominal check cannot be accepted: 400 naming the field, nothing stored
    const short = await save({ ...demo(), acceptances: [{ checkKey: KEY, justification: "fine" }] });
    expect(short.status).toBe(400);
    expect(((await json(short)).error.issues as { path: string }[]).map((i) => i.path)).toContain("acceptances[0].justification");
    const nominal = await save({ ...demo(), acceptances: [{ checkKey: "mass-ratio", justification: TEXT }] });
    expect(nominal.status).toBe(400);
    expect(((await json(nominal)).error.issues as { path: string }[]).map((i) => i.path)).toContain("acceptances[0].checkKey");
    const stored = await json(await callRoute(DRAFT, "GET", p, { cookie: fx.cookies.designer }));
    expect(stored.draft.input.acceptances).toBeUndefined();

    expect((await save({ ...demo(), acceptances: [{ checkKey: KEY, justification: TEXT }] })).status).toBe(200);
    const b = await issue();
    const rb = await revision(b);
    expect(rb.input.acceptances).toEqual([{ checkKey: KEY, justification: TEXT }]);
    const after = rb.result.checks.find((c) => c.key === KEY)!;
    expect(after.pass).toBe(false);
    expect(after.acceptance).toEqual({ justification: TEXT });

    const compare = await compareRevisions(makeRequest("GET", `/api/x?from=${a}&to=${b}`, { cookie: fx.cookies.checker }), { params: Promise.resolve(p) });
    expect(compare.status).toBe(200);
    const diff = (await json(compare)).diff as Loose;
    expect(diff.flippedChecks.map((f: Loose) => [f.key, f.oldVerdict, f.newVerdict, f.newPass, f.justification])).toEqual([[KEY, "fail", "accepted", false, TEXT]]);
  });
});
