// Four eyes means a different person from everyone who wrote the revision: the draft's
// editors since the previous revision are carried into the revision it becomes, and none of
// them may return or approve it (nor may the issuer). Issue 19, item 5.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getPool } from "@/db/client";
import { createFoundation } from "@/db/queries/projects";
import { decideRevisionAction } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/actions";
import { callAction, callRoute, getFixture, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const LIST = "v1/projects/[projectId]/foundations/[foundationId]/revisions";
const ONE = `${LIST}/[revisionId]`;
const DECISION = `${ONE}/decision`;
const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely; the assertions pin them down
type Loose = Record<string, any>;
type Role = "manager" | "designer" | "checker";

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  await closeDb();
});

async function call(route: string, method: string, params: Record<string, string>, role: Role, body?: unknown): Promise<{ status: number; body: Loose }> {
  const res = await callRoute(route, method, params, { cookie: fx.cookies[role], body });
  return { status: res.status, body: (await res.json()) as Loose };
}

async function newFoundation(): Promise<{ projectId: string; foundationId: string }> {
  const f = await createFoundation({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId, { tag: `4EYES-${Date.now()}`, machineTrain: "Four eyes", location: "" });
  return { projectId: fx.projectId, foundationId: f.id };
}

async function save(p: { projectId: string; foundationId: string }, role: Role, edit: (input: Loose) => void): Promise<void> {
  const current = await call(DRAFT, "GET", p, role);
  const input = (current.body.draft.input as Loose | null) ?? (sampleAnalysisInput() as unknown as Loose);
  edit(input);
  const saved = await call(DRAFT, "PUT", p, role, { version: current.body.draft.version, input });
  expect(saved.status).toBe(200);
}

const editorIds = (rev: Loose) => (rev.editors as { id: string; name: string }[]).map((e) => e.id).sort();

describe("four eyes: nobody who wrote a revision decides on it", () => {
  it("manager edits the draft, designer issues: the manager's approval is refused (API, action and SQL); a checker approves", async () => {
    const p = await newFoundation();
    await save(p, "manager", () => {});
    const issued = await call(LIST, "POST", p, "designer", { note: "Issued for check." });
    expect(issued.status).toBe(201);
    const revisionId = issued.body.revision.id as string;
    expect(issued.body.revision.issuedById).toBe(fx.userIds.designer);
    expect(editorIds(issued.body.revision)).toEqual([fx.userIds.manager]);

    // The editors are in the revision's JSON, by id and name.
    const read = await call(ONE, "GET", { ...p, revisionId }, "checker");
    expect(read.status).toBe(200);
    expect(read.body.revision.editors).toEqual([{ id: fx.userIds.manager, name: expect.any(String) }]);
    expect((read.body.revision.editors as Loose[])[0]?.name.length).toBeGreaterThan(0);

    const byRoute = await call(DECISION, "POST", { ...p, revisionId }, "manager", { outcome: "approved", note: "" });
    expect(byRoute.status).toBe(403);
    expect(byRoute.body.error.code).toBe("forbidden");
    expect(byRoute.body.error.message).toMatch(/edited the draft of this revision/);
    expect(byRoute.body.error.message).toMatch(/four eyes/i);
    const byAction = await callAction(decideRevisionAction, { ...p, revisionId, outcome: "returned", note: "Returning my own work" }, fx.cookies.manager);
    expect(byAction.state).toMatchObject({ ok: false, code: "forbidden" });
    // The database refuses it as well, for a query that forgot to check.
    await expect(getPool().query("INSERT INTO revision_decisions (revision_id, outcome, decided_by_id) VALUES ($1, 'approved', $2)", [revisionId, fx.userIds.manager])).rejects.toThrow(
      /edited its draft/,
    );
    const decided = await getPool().query("SELECT count(*)::int AS n FROM revision_decisions WHERE revision_id = $1", [revisionId]);
    expect(decided.rows[0].n).toBe(0);

    const byChecker = await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "approved", note: "Checked" });
    expect(byChecker.status).toBe(201);
    expect(byChecker.body.revision.decision.decidedById).toBe(fx.userIds.checker);
  });

  it("records every editor since the previous revision, and only those", async () => {
    const p = await newFoundation();
    await save(p, "designer", () => {});
    await save(p, "manager", (input) => {
      input.soil.poissonRatio = 0.3;
    });
    await save(p, "designer", (input) => {
      input.soil.poissonRatio = 0.32;
    });
    const first = await call(LIST, "POST", p, "designer", { note: "Issued for check." });
    expect(first.status).toBe(201);
    expect(editorIds(first.body.revision)).toEqual([fx.userIds.designer, fx.userIds.manager].sort());
    expect((await call(DECISION, "POST", { ...p, revisionId: first.body.revision.id }, "checker", { outcome: "returned", note: "Justify the Poisson's ratio" })).status).toBe(201);

    // The next revision is written by the designer alone: the manager may decide on it.
    await save(p, "designer", (input) => {
      input.soil.poissonRatio = 0.33;
    });
    const second = await call(LIST, "POST", p, "designer", { note: "Issued for check." });
    expect(second.status).toBe(201);
    expect(editorIds(second.body.revision)).toEqual([fx.userIds.designer]);
    const byManager = await call(DECISION, "POST", { ...p, revisionId: second.body.revision.id }, "manager", { outcome: "approved", note: "" });
    expect(byManager.status).toBe(201);
  });
});
