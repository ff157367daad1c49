// The revision comparison route against the real PostgreSQL: a verdict flipped by a relaxed
// criterion says the limit moved and lists the criterion first among the inputs; the same
// comparison downloads as CSV and as JSON; bad query values answer 400 naming the field.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { createFoundation } from "@/db/queries/projects";
import { GET as compareRevisions } from "@/app/api/v1/projects/[projectId]/foundations/[foundationId]/revisions/compare/route";
import { callRoute, getFixture, makeRequest, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const LIST = "v1/projects/[projectId]/foundations/[foundationId]/revisions";
const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";

let fx: Fixture;

beforeAll(async () => {
  fx = await getFixture();
});

afterAll(async () => {
  await closeDb();
});

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely; the assertions pin them down
type Loose = Record<string, any>;

async function json(res: Response): Promise<Loose> {
  return (await res.json()) as Loose;
}

async function issueWith(p: { projectId: string; foundationId: string }, minMassRatio: number): Promise<string> {
  const current = await json(await callRoute(DRAFT, "GET", p, { cookie: fx.cookies.designer }));
  const input = { ...(current.draft?.input ?? sampleAnalysisInput()), criteria: { minMassRatio } };
  const saved = await callRoute(DRAFT, "PUT", p, { cookie: fx.cookies.designer, body: { version: current.draft?.version ?? 0, input } });
  expect(saved.status).toBe(200);
  const res = await callRoute(LIST, "POST", p, { cookie: fx.cookies.designer, body: { note: "Mass ratio criterion changed for the comparison test." } });
  expect(res.status).toBe(201);
  return (await json(res)).revision.id as string;
}

describe("GET .../revisions/compare", () => {
  it("names the moved limit of a flipped verdict, lists criteria first, and downloads the same rows as CSV and JSON", async () => {
    const f = await createFoundation({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId, { tag: `CMP-IT-${Date.now()}`, machineTrain: "Compare test", location: "" });
    const p = { projectId: fx.projectId, foundationId: f.id };
    // A: an unreachable least mass ratio (fails); B: relaxed far below any block (passes).
    const a = await issueWith(p, 1000);
    const b = await issueWith(p, 0.01);
    const call = (query: string, role: keyof Fixture["cookies"] = "checker") => compareRevisions(makeRequest("GET", `/api/x?from=${a}&to=${b}${query}`, { cookie: fx.cookies[role] }), { params: Promise.resolve(p) });

    const res = await call("");
    expect(res.status).toBe(200);
    const body = await json(res);
    const flip = body.view.verdicts[0];
    expect(flip).toMatchObject({ key: "mass-ratio", flipped: true, oldVerdict: "fail", newVerdict: "pass", moved: "limit", oldLimit: 1000, newLimit: 0.01, oldLimitText: "1,000", newLimitText: "0.01000" });
    expect(flip.oldValueText).toBe(flip.newValueText);
    expect(body.view.inputs[0]).toMatchObject({ path: "criteria.minMassRatio", label: "criteria · least block-to-machine mass ratio", oldText: "1,000", newText: "0.01000" });
    // nothing else of the input changed, and the results did not move: no amplitude or frequency rows
    expect(body.view.amplitudes).toEqual([]);
    expect(body.view.frequencies).toEqual([]);
    expect(body.view.noise).toMatch(/1 nm/);
    // the raw diff stays for existing clients
    expect(body.diff.input.entries.map((e: Loose) => e.path)).toEqual(["criteria.minMassRatio"]);

    const csv = await call("&format=csv");
    expect(csv.status).toBe(200);
    expect(csv.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(csv.headers.get("content-disposition")).toBe('attachment; filename="compare-A-B.csv"');
    expect(csv.headers.get("cache-control")).toContain("no-store");
    const lines = (await csv.text()).trim().split("\r\n");
    expect(lines[0]).toMatch(/^group,label,path,change,old_si,new_si,old_shown,new_shown,unit,old_limit_shown,new_limit_shown,old_verdict,new_verdict,moved/);
    const massRow = lines.find((l) => l.includes('"checks[""mass-ratio""]"'));
    expect(massRow).toMatch(/^verdicts,Block mass over machine mass,"checks\[""mass-ratio""\]",verdict changed,/);
    expect(massRow).toContain(',"1,000",0.01000,fail,pass,limit,');
    expect(lines.some((l) => l.startsWith("inputs,criteria · least block-to-machine mass ratio,criteria.minMassRatio,changed,1000,0.01,"))).toBe(true);

    const download = await call("&format=json&units=us");
    expect(download.status).toBe(200);
    expect(download.headers.get("content-disposition")).toBe('attachment; filename="compare-A-B.json"');
    const file = JSON.parse(await download.text()) as Loose;
    expect(file.view.units).toBe("us");
    expect(file.view.verdicts[0]).toMatchObject({ key: "mass-ratio", moved: "limit" });
  });

  it("answers 400 naming the field for an unknown format or unit system, and 403 to a vendor", async () => {
    const id = "00000000-0000-4000-8000-000000000000";
    const p = { projectId: fx.projectId, foundationId: id };
    const bad = await compareRevisions(makeRequest("GET", `/api/x?from=${id}&to=${id}&format=xlsx`, { cookie: fx.cookies.checker }), { params: Promise.resolve(p) });
    expect(bad.status).toBe(400);
    expect((await json(bad)).error.issues[0].path).toBe("format");
    const units = await compareRevisions(makeRequest("GET", `/api/x?from=${id}&to=${id}&units=furlong`, { cookie: fx.cookies.checker }), { params: Promise.resolve(p) });
    expect(units.status).toBe(400);
    expect((await json(units)).error.issues[0].path).toBe("units");
    const vendor = await compareRevisions(makeRequest("GET", `/api/x?from=${id}&to=${id}&format=csv`, { cookie: fx.cookies.vendor }), { params: Promise.resolve(p) });
    expect(vendor.status).toBe(403);
  });
});
