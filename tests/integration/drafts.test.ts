// The foundation and draft API against the real PostgreSQL: round trip, field paths of bad
// bodies, optimistic concurrency, role refusals and project scoping.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { foundationDrafts, foundations, projects } from "@/db/schema";
import { createFoundation, createProject } from "@/db/queries/projects";
import { callRoute, getFixture, type Fixture } from "./support/fixture";
import { parseAnalysisInput } from "@/modules/calc";
import { sampleAnalysisInput } from "./analysis-input-sample";

const FOUNDATION = "v1/projects/[projectId]/foundations/[foundationId]";
const DRAFT = `${FOUNDATION}/draft`;

interface IssueBody {
  error: { code: string; message: string; issues?: { path: string; message: string }[]; currentVersion?: number };
}

let fx: Fixture;
let params: { projectId: string; foundationId: string };
let otherProjectId: string;
let otherFoundationId: string;

const stamp = Date.now();

beforeAll(async () => {
  fx = await getFixture();
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  // A foundation of our own, so these saves never touch the demo foundations' drafts.
  const own = await createFoundation(manager, fx.projectId, { tag: `IT-DRAFT-${stamp}`, machineTrain: "Test fan", location: "Test bay" });
  params = { projectId: fx.projectId, foundationId: own.id };
  // A second project the same manager belongs to, for the cross-project 404.
  const other = await createProject(manager, { code: `IT-OTHER-${stamp}`, name: "Other project", client: "", site: "", units: "si" });
  otherProjectId = other.id;
  otherFoundationId = (await createFoundation(manager, other.id, { tag: "OTHER-1", machineTrain: "", location: "" })).id;
});

afterAll(async () => {
  const db = getDb();
  await db.delete(foundations).where(eq(foundations.id, params.foundationId));
  await db.delete(projects).where(eq(projects.id, otherProjectId));
});

async function getDraftAs(role: keyof Fixture["cookies"]) {
  return callRoute(DRAFT, "GET", params, { cookie: fx.cookies[role] });
}

async function putDraft(body: unknown, role: keyof Fixture["cookies"] = "designer") {
  return callRoute(DRAFT, "PUT", params, { cookie: fx.cookies[role], body });
}

function issuePaths(body: IssueBody): string[] {
  return (body.error.issues ?? []).map((i) => i.path);
}

describe("GET foundation", () => {
  it("answers the foundation to a reader of the project", async () => {
    const res = await callRoute(FOUNDATION, "GET", params, { cookie: fx.cookies.viewer });
    expect(res.status).toBe(200);
    const body = (await res.json()) as { foundation: { id: string; projectId: string; tag: string } };
    expect(body.foundation).toMatchObject({ id: params.foundationId, projectId: fx.projectId, tag: `IT-DRAFT-${stamp}` });
  });

  it("answers 404 for a foundation of another project and for a malformed id", async () => {
    const cross = await callRoute(FOUNDATION, "GET", { projectId: fx.projectId, foundationId: otherFoundationId }, { cookie: fx.cookies.manager });
    expect(cross.status).toBe(404);
    const malformed = await callRoute(FOUNDATION, "GET", { projectId: fx.projectId, foundationId: "not-a-uuid" }, { cookie: fx.cookies.manager });
    expect(malformed.status).toBe(404);
  });
});

describe("draft round trip and optimistic concurrency", () => {
  it("starts empty at version 0", async () => {
    const res = await getDraftAs("designer");
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ draft: { foundationId: params.foundationId, version: 0, input: null } });
  });

  it("creates at version 0, then saves version by version, and GET returns what was saved", async () => {
    const first = await putDraft({ version: 0, input: sampleAnalysisInput() });
    expect(first.status).toBe(200);
    const created = (await first.json()) as { draft: { version: number; updatedById: string } };
    expect(created.draft.version).toBe(1);
    expect(created.draft.updatedById).toBe(fx.userIds.designer);

    const changed = sampleAnalysisInput();
    changed.soil.shearModulus = 8.0e7;
    const second = await putDraft({ version: 1, input: changed }, "manager");
    expect(second.status).toBe(200);
    expect(((await second.json()) as { draft: { version: number } }).draft.version).toBe(2);

    const read = (await (await getDraftAs("checker")).json()) as { draft: { version: number; input: { soil: { shearModulus: number }; block: unknown } } };
    expect(read.draft.version).toBe(2);
    expect(read.draft.input.soil.shearModulus).toBe(8.0e7);
    // The draft keeps the input as the contract's parser normalised it (defaults filled in).
    const normalised = parseAnalysisInput(changed);
    if (!normalised.ok) throw new Error("the sample input should be valid");
    expect(read.draft.input.block).toEqual(normalised.input.block);
  });

  it("answers 409 with the current version to a stale save and leaves the stored draft unchanged", async () => {
    const before = (await (await getDraftAs("designer")).json()) as { draft: { version: number; input: unknown } };
    const stale = sampleAnalysisInput();
    stale.soil.shearModulus = 1.0e7;
    const res = await putDraft({ version: before.draft.version - 1, input: stale });
    expect(res.status).toBe(409);
    const body = (await res.json()) as IssueBody & { current: { version: number; input: unknown } };
    expect(body.error.code).toBe("conflict");
    expect(body.error.currentVersion).toBe(before.draft.version);
    expect(body.current).toMatchObject({ version: before.draft.version, input: before.draft.input });

    const after = (await (await getDraftAs("designer")).json()) as { draft: { version: number; input: unknown } };
    expect(after.draft).toEqual(before.draft);
  });

  it("answers 409 to a create (version 0) once the draft exists", async () => {
    const res = await putDraft({ version: 0, input: sampleAnalysisInput() });
    expect(res.status).toBe(409);
    expect(((await res.json()) as IssueBody).error.currentVersion).toBeGreaterThan(0);
  });

  it("lets exactly one of two concurrent saves from the same version win", async () => {
    const { draft } = (await (await getDraftAs("designer")).json()) as { draft: { version: number } };
    const a = sampleAnalysisInput();
    a.soil.shearModulus = 5.0e7;
    const b = sampleAnalysisInput();
    b.soil.shearModulus = 7.0e7;
    const results = await Promise.all([putDraft({ version: draft.version, input: a }), putDraft({ version: draft.version, input: b }, "manager")]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const winner = results.find((r) => r.status === 200)!;
    const saved = (await winner.json()) as { draft: { version: number; input: { soil: { shearModulus: number } } } };
    const stored = (await (await getDraftAs("designer")).json()) as typeof saved;
    expect(stored.draft).toEqual(saved.draft);
    expect(stored.draft.version).toBe(draft.version + 1);
  });
});

describe("bad draft bodies give 400 with field paths", () => {
  it("names the contract field that is out of range", async () => {
    const input = sampleAnalysisInput();
    input.soil.poissonRatio = 0.7;
    const res = await putDraft({ version: 1, input });
    expect(res.status).toBe(400);
    const body = (await res.json()) as IssueBody;
    expect(body.error.code).toBe("invalid_input");
    expect(issuePaths(body)).toContain("soil.poissonRatio");
  });

  it("names every bad field, unknown ones included", async () => {
    const input = sampleAnalysisInput();
    delete input.soil.density;
    input.soil.colour = "brown";
    const machines = input.machines as { mass: number }[];
    machines[0]!.mass = -1;
    const res = await putDraft({ version: 1, input });
    expect(res.status).toBe(400);
    const paths = issuePaths((await res.json()) as IssueBody);
    expect(paths).toEqual(expect.arrayContaining(["soil.density", "soil.colour", "machines[0].mass"]));
  });

  it("names the envelope fields: a missing input, a bad version, an unknown key", async () => {
    const res = await putDraft({ version: -1, extra: true });
    expect(res.status).toBe(400);
    const body = (await res.json()) as IssueBody;
    expect(issuePaths(body)).toEqual(expect.arrayContaining(["version", "input"]));
    // The shared route wrapper reports an unknown envelope key on its parent, by name.
    expect(body.error.issues?.some((i) => i.message.includes('"extra"'))).toBe(true);
  });

  it("refuses a body that is not JSON with 400", async () => {
    const res = await putDraft("{ not json");
    expect(res.status).toBe(400);
    expect(((await res.json()) as IssueBody).error.code).toBe("invalid_input");
  });

  it("left the stored draft as it was", async () => {
    const { draft } = (await (await getDraftAs("designer")).json()) as { draft: { input: { soil: { poissonRatio: number } } } };
    expect(draft.input.soil.poissonRatio).toBe(0.33);
  });
});

describe("who may read and save drafts", () => {
  it("refuses the vendor and an outsider with 403, reading or saving", async () => {
    for (const role of ["vendor", "outsider"] as const) {
      expect((await getDraftAs(role)).status).toBe(403);
      expect((await putDraft({ version: 1, input: sampleAnalysisInput() }, role)).status).toBe(403);
    }
  });

  it("lets the checker read but not save, and refuses the viewer (the client) both", async () => {
    expect((await getDraftAs("checker")).status).toBe(200);
    expect((await putDraft({ version: 1, input: sampleAnalysisInput() }, "checker")).status).toBe(403);
    // The live draft is the design team's; the client reads issued revisions only.
    expect((await getDraftAs("viewer")).status).toBe(403);
    expect((await putDraft({ version: 1, input: sampleAnalysisInput() }, "viewer")).status).toBe(403);
  });

  it("refuses a vendor before looking at the body", async () => {
    const res = await putDraft({ version: "x" }, "vendor");
    expect(res.status).toBe(403);
    expect(((await res.json()) as IssueBody).error.issues).toBeUndefined();
  });

  it("asks an anonymous caller to sign in", async () => {
    expect((await getDraftAs("anonymous")).status).toBe(401);
  });

  it("answers 404 for another project's foundation, reading or saving", async () => {
    const cross = { projectId: fx.projectId, foundationId: otherFoundationId };
    expect((await callRoute(DRAFT, "GET", cross, { cookie: fx.cookies.manager })).status).toBe(404);
    const put = await callRoute(DRAFT, "PUT", cross, { cookie: fx.cookies.manager, body: { version: 0, input: sampleAnalysisInput() } });
    expect(put.status).toBe(404);
    const rows = await getDb().select().from(foundationDrafts).where(eq(foundationDrafts.foundationId, otherFoundationId));
    expect(rows).toHaveLength(0);
  });
});
