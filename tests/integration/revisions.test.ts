// Revisions against the real PostgreSQL and the fake SMTP server: immutability in the
// database itself, one decision per revision under a race, no self-approval, and the
// whole cycle (issue, comment, answer, return, re-issue, approve) with its audit trail
// and e-mails. Each test works on a foundation of its own.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getPool } from "@/db/client";
import { createFoundation, getProjectByCode, listFoundations } from "@/db/queries/projects";
import { listFoundationRevisionStates, listOpenFoundationComments, listRevisionHistory, listRevisions } from "@/db/queries/revisions";
import { DEMO_PROJECT_CODE } from "@/modules/platform/demo";
import { fieldLabel } from "@/modules/revisions";
import { GET as compareRevisions } from "@/app/api/v1/projects/[projectId]/foundations/[foundationId]/revisions/compare/route";
import { decideRevisionAction, issueRevisionAction } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/actions";
import { callAction, callRoute, demoEmail, getFixture, makeRequest, waitForEmail, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const LIST = "v1/projects/[projectId]/foundations/[foundationId]/revisions";
const ONE = `${LIST}/[revisionId]`;
const DECISION = `${ONE}/decision`;
const COMMENTS = `${ONE}/comments`;
const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";

let fx: Fixture;
let n = 0;

beforeAll(async () => {
  fx = await getFixture();
});

afterAll(async () => {
  await closeDb();
});

type Role = "manager" | "designer" | "checker" | "vendor" | "viewer";

// Response bodies are read loosely here; the assertions pin down their shape.
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- see above
type Loose = Record<string, any>;

async function json(res: Response): Promise<Loose> {
  return (await res.json()) as Loose;
}

/** A new foundation of the demo project with a saved draft (the sample input, changed by `edit`). */
async function foundationWithDraft(edit: (input: ReturnType<typeof sampleAnalysisInput>) => void = () => {}): Promise<{ projectId: string; foundationId: string }> {
  n += 1;
  const f = await createFoundation({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId, { tag: `REV-IT-${Date.now()}-${n}`, machineTrain: "Revision test", location: "" });
  const input = sampleAnalysisInput();
  edit(input);
  const res = await callRoute(DRAFT, "PUT", { projectId: fx.projectId, foundationId: f.id }, { cookie: fx.cookies.designer, body: { version: 0, input } });
  expect(res.status).toBe(200);
  return { projectId: fx.projectId, foundationId: f.id };
}

async function draftVersionOf(p: { projectId: string; foundationId: string }): Promise<number> {
  return (await json(await callRoute(DRAFT, "GET", p, { cookie: fx.cookies.designer }))).draft.version as number;
}

async function saveDraft(p: { projectId: string; foundationId: string }, edit: (input: Loose) => void): Promise<number> {
  const current = await json(await callRoute(DRAFT, "GET", p, { cookie: fx.cookies.designer }));
  const input = current.draft.input as Loose;
  edit(input);
  const res = await callRoute(DRAFT, "PUT", p, { cookie: fx.cookies.designer, body: { version: current.draft.version, input } });
  expect(res.status).toBe(200);
  return (await json(res)).draft.version as number;
}

async function issue(p: { projectId: string; foundationId: string }, role: Role = "designer", body: Record<string, unknown> = {}) {
  // A revision note is required at issue; tests that do not care about it send a stock one.
  const res = await callRoute(LIST, "POST", p, { cookie: fx.cookies[role], body: { note: "Issued by the test for check.", ...body } });
  return { status: res.status, body: await json(res) };
}

async function decide(p: { projectId: string; foundationId: string }, revisionId: string, role: Role, outcome: "returned" | "approved", note = "") {
  const res = await callRoute(DECISION, "POST", { ...p, revisionId }, { cookie: fx.cookies[role], body: { outcome, note } });
  return { status: res.status, body: await json(res) };
}

describe("the demo's revisions", () => {
  it("PH1-P101 has revision A returned with comments (now superseded) and B in check, which vendors cannot see", async () => {
    const project = await getProjectByCode(DEMO_PROJECT_CODE);
    if (!project) throw new Error("demo missing");
    const pumpId = (await listFoundations({ userId: fx.userIds.manager, isAdmin: false }, project.id)).find((f) => f.tag === "PH1-P101")?.id;
    if (!pumpId) throw new Error("PH1-P101 missing");
    const res = await callRoute(LIST, "GET", { projectId: project.id, foundationId: pumpId }, { cookie: fx.cookies.viewer });
    expect(res.status).toBe(200);
    const revs = (await json(res)).revisions as { label: string; status: string; decision: { outcome: string } | null; issuedById: string }[];
    expect(revs.slice(0, 2).map((r) => r.label)).toEqual(["A", "B"]);
    expect(revs[0]).toMatchObject({ status: "superseded", decision: { outcome: "returned" }, issuedById: fx.userIds.designer });
    const vendor = await callRoute(LIST, "GET", { projectId: project.id, foundationId: pumpId }, { cookie: fx.cookies.vendor });
    expect(vendor.status).toBe(403);
    expect(await vendor.text()).not.toContain('"revisions"');
  });
});

describe("issue for check", () => {
  it("issues the saved draft as revision A with its result, engine version and fingerprint, tells the checker, and refuses the same draft twice", async () => {
    const p = await foundationWithDraft();
    const first = await issue(p, "designer", { draftVersion: await draftVersionOf(p) });
    expect(first.status).toBe(201);
    expect(first.body.revision).toMatchObject({ label: "A", sequence: 1, status: "in-check", issuedById: fx.userIds.designer, vendorSubmissionId: null });
    expect(first.body.revision.inputHash).toMatch(/^[0-9a-f]{64}$/);
    const one = await json(await callRoute(ONE, "GET", { ...p, revisionId: first.body.revision.id }, { cookie: fx.cookies.checker }));
    expect(one.revision.result.modes).toHaveLength(6);
    expect(one.revision.engineVersion).toBe(one.revision.result.engineVersion);
    const mail = await waitForEmail(demoEmail("checker"), "revision A issued for check");
    expect(mail.text).toContain(`/revisions/${first.body.revision.id}`);

    const again = await issue(p);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/identical to revision A/);
    expect(await listRevisions({ userId: fx.userIds.manager, isAdmin: false }, p.projectId, p.foundationId)).toHaveLength(1);
  });

  it("refuses a draft saved since the designer looked at it, and a checker may not issue", async () => {
    const p = await foundationWithDraft();
    const seen = await draftVersionOf(p);
    await saveDraft(p, (input) => (input.soil.poissonRatio = 0.31));
    const stale = await issue(p, "designer", { draftVersion: seen });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/saved again/);
    expect((await issue(p, "checker")).status).toBe(403);
    const bad = await issue(p, "designer", { draftVersion: "two" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe("draftVersion");
  });

  it("requires a revision note (400 naming `note`, nothing issued), stores it and returns it in the list, the revision and the checker's e-mail", async () => {
    const p = await foundationWithDraft();
    const noNote = await callRoute(LIST, "POST", p, { cookie: fx.cookies.designer, body: { draftVersion: await draftVersionOf(p) } });
    expect(noNote.status).toBe(400);
    expect((await json(noNote)).error.issues.map((i: { path: string }) => i.path)).toEqual(["note"]);
    const blank = await callRoute(LIST, "POST", p, { cookie: fx.cookies.designer, body: { note: "   " } });
    expect(blank.status).toBe(400);
    expect((await json(blank)).error.issues[0].path).toBe("note");
    const { state: byForm } = await callAction(issueRevisionAction, { ...p }, fx.cookies.designer);
    expect(byForm).toMatchObject({ ok: false, code: "invalid_input" });
    expect(await listRevisions({ userId: fx.userIds.manager, isAdmin: false }, p.projectId, p.foundationId)).toHaveLength(0);

    const note = "Mat widened to 6.2 m after the checker's bearing-pressure comment; soil Poisson's ratio from borehole BH-2.";
    const issued = await issue(p, "designer", { note: `  ${note}  ` });
    expect(issued.status).toBe(201);
    expect(issued.body.revision.note).toBe(note);
    const list = await json(await callRoute(LIST, "GET", p, { cookie: fx.cookies.checker }));
    expect(list.revisions[0].note).toBe(note);
    const one = await json(await callRoute(ONE, "GET", { ...p, revisionId: issued.body.revision.id }, { cookie: fx.cookies.checker }));
    expect(one.revision.note).toBe(note);
    const mail = await waitForEmail(demoEmail("checker"), "revision A issued for check");
    expect(mail.text).toContain(note);
  });

  it("refuses cleanly to issue a draft the contract accepts but the engine cannot analyse, and stores nothing", async () => {
    // A concrete density of 1e-300 kg/m3 passes the contract (positive, finite) but leaves
    // the block without rotational inertia: the mass matrix is not positive definite.
    const p = await foundationWithDraft((input) => {
      (input as Loose).block.concreteDensity = 1e-300;
    });
    const refused = await issue(p, "designer", { draftVersion: await draftVersionOf(p) });
    expect(refused.status).toBe(400);
    expect(refused.body.error.code).toBe("invalid_input");
    expect(refused.body.error.issues[0].message).toMatch(/too large or too small to analyse/);
    expect(await listRevisions({ userId: fx.userIds.manager, isAdmin: false }, p.projectId, p.foundationId)).toHaveLength(0);
  });

  it("labels by the project's scheme at the time of issue", async () => {
    const p = await foundationWithDraft();
    const first = await issue(p);
    expect(first.body.revision.label).toBe("A");
    // The scheme of a foundation's project is read inside the issuing transaction.
    await getPool().query("UPDATE projects SET revision_scheme = 'numbers' WHERE id = $1", [p.projectId]);
    try {
      await saveDraft(p, (input) => (input.soil.density = 1950));
      const second = await issue(p);
      expect(second.body.revision.label).toBe("0");
    } finally {
      await getPool().query("UPDATE projects SET revision_scheme = 'letters' WHERE id = $1", [p.projectId]);
    }
  });
});

describe("an issued revision in the database", () => {
  it("refuses UPDATE and DELETE of a revision and of a decision, whatever the caller", async () => {
    const p = await foundationWithDraft();
    const rev = (await issue(p)).body.revision as { id: string; label: string };
    await expect(getPool().query("UPDATE revisions SET label = 'Z' WHERE id = $1", [rev.id])).rejects.toThrow(/immutable/);
    await expect(getPool().query("UPDATE revisions SET result = '{}'::jsonb WHERE id = $1", [rev.id])).rejects.toThrow(/immutable/);
    await expect(getPool().query("DELETE FROM revisions WHERE id = $1", [rev.id])).rejects.toThrow(/immutable/);
    expect((await decide(p, rev.id, "checker", "approved")).status).toBe(201);
    await expect(getPool().query("UPDATE revision_decisions SET outcome = 'returned' WHERE revision_id = $1", [rev.id])).rejects.toThrow(/immutable/);
    const still = await getPool().query<{ label: string; outcome: string }>(
      "SELECT r.label, d.outcome FROM revisions r JOIN revision_decisions d ON d.revision_id = r.id WHERE r.id = $1",
      [rev.id],
    );
    expect(still.rows).toEqual([{ label: rev.label, outcome: "approved" }]);
  });
});

describe("deciding", () => {
  it("lets exactly one of several racing approvals through", async () => {
    const p = await foundationWithDraft();
    const rev = (await issue(p)).body.revision as { id: string };
    const results = await Promise.all([
      decide(p, rev.id, "checker", "approved"),
      decide(p, rev.id, "manager", "approved"),
      decide(p, rev.id, "checker", "approved"),
      decide(p, rev.id, "manager", "returned", "race"),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
    const rows = await getPool().query("SELECT count(*)::int AS n FROM revision_decisions WHERE revision_id = $1", [rev.id]);
    expect(rows.rows[0].n).toBe(1);
    const audits = await getPool().query("SELECT count(*)::int AS n FROM audit_events WHERE detail->>'revisionId' = $1 AND action IN ('revision.approved','revision.returned')", [rev.id]);
    expect(audits.rows[0].n).toBe(1);
  });

  it("refuses a self-approval in the action, in the handler and in SQL", async () => {
    const p = await foundationWithDraft();
    // The manager may issue and decide, so only the self rule stands in the way.
    const rev = (await issue(p, "manager")).body.revision as { id: string };
    const viaRoute = await decide(p, rev.id, "manager", "approved");
    expect(viaRoute.status).toBe(403);
    expect(viaRoute.body.error.message).toMatch(/You issued this revision/);
    const { state } = await callAction(decideRevisionAction, { ...p, revisionId: rev.id, outcome: "approved", note: "" }, fx.cookies.manager);
    expect(state).toMatchObject({ ok: false, code: "forbidden" });
    await expect(
      getPool().query("INSERT INTO revision_decisions (revision_id, outcome, decided_by_id) VALUES ($1, 'approved', $2)", [rev.id, fx.userIds.manager]),
    ).rejects.toThrow(/person who issued it/);
    const rows = await getPool().query("SELECT count(*)::int AS n FROM revision_decisions WHERE revision_id = $1", [rev.id]);
    expect(rows.rows[0].n).toBe(0);
  });

  it("names the field of a bad decision, needs a note to return, and refuses designers and vendors", async () => {
    const p = await foundationWithDraft();
    const rev = (await issue(p)).body.revision as { id: string };
    const bad = await callRoute(DECISION, "POST", { ...p, revisionId: rev.id }, { cookie: fx.cookies.checker, body: { outcome: "maybe" } });
    expect(bad.status).toBe(400);
    expect((await json(bad)).error.issues.map((i: { path: string }) => i.path)).toEqual(["outcome"]);
    const noNote = await decide(p, rev.id, "checker", "returned");
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.issues[0].path).toBe("note");
    expect((await decide(p, rev.id, "designer", "approved")).status).toBe(403);
    expect((await decide(p, rev.id, "vendor", "approved")).status).toBe(403);
  });

  it("refuses a decision on a superseded revision", async () => {
    const p = await foundationWithDraft();
    const a = (await issue(p)).body.revision as { id: string };
    await saveDraft(p, (input) => (input.soil.materialDamping = 0.04));
    expect((await issue(p)).status).toBe(201);
    const late = await decide(p, a.id, "checker", "approved");
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/later revision/);
  });
});

describe("the review cycle", () => {
  it("stores a comment on a field chosen from the revision page, an input value or a check row, by its path, which reads as words", async () => {
    const p = await foundationWithDraft();
    const aId = (await issue(p)).body.revision.id as string;
    const detail = await json(await callRoute(ONE, "GET", { ...p, revisionId: aId }, { cookie: fx.cookies.checker }));
    // what the page's check rows send: checks[<key>].value, a result leaf of this revision
    const check = detail.revision.result.checks[0] as { key: string };
    const checkPath = `checks[${JSON.stringify(check.key)}].value`;
    const onCheck = await callRoute(COMMENTS, "POST", { ...p, revisionId: aId }, { cookie: fx.cookies.checker, body: { body: "Show the mode shape behind this margin.", fieldPath: checkPath } });
    expect(onCheck.status).toBe(201);
    expect((await json(onCheck)).comment.fieldPath).toBe(checkPath);
    // what the page's input values send: a keyed machine field
    const machine = detail.revision.input.machines[0] as { name: string };
    const massPath = `machines[${JSON.stringify(machine.name)}].mass`;
    const onMass = await callRoute(COMMENTS, "POST", { ...p, revisionId: aId }, { cookie: fx.cookies.checker, body: { body: "Which vendor sheet gives this mass?", fieldPath: massPath } });
    expect(onMass.status).toBe(201);
    const listed = (await json(await callRoute(COMMENTS, "GET", { ...p, revisionId: aId }, { cookie: fx.cookies.designer }))).comments as { id: string; fieldPath: string }[];
    expect(listed.map((c) => c.fieldPath).sort()).toEqual([checkPath, massPath].sort());
    expect(fieldLabel(checkPath)).toMatch(/^Check · /);
    expect(fieldLabel(massPath)).toBe(`Machine ${machine.name} · mass`);

    // The designer's workspace gets the open ones (not answers, not resolved ones); a viewer none.
    const answer = await callRoute(COMMENTS, "POST", { ...p, revisionId: aId }, { cookie: fx.cookies.designer, body: { body: "From the vendor's sheet 3.", parentId: (await json(onMass)).comment.id } });
    expect(answer.status).toBe(201);
    const checkCommentId = listed.find((c) => c.fieldPath === checkPath)?.id ?? "";
    expect((await callRoute(`${COMMENTS}/[commentId]`, "PATCH", { ...p, revisionId: aId, commentId: checkCommentId }, { cookie: fx.cookies.checker, body: { resolved: true } })).status).toBe(200);
    const open = await listOpenFoundationComments({ userId: fx.userIds.designer, isAdmin: false }, p.projectId, p.foundationId);
    expect(open.map((c) => [c.fieldPath, c.revisionLabel, c.body])).toEqual([[massPath, "A", "Which vendor sheet gives this mass?"]]);
    expect(await listOpenFoundationComments({ userId: fx.userIds.viewer, isAdmin: false }, p.projectId, p.foundationId)).toEqual([]);
  });

  it("issue, comment, answer, return, re-issue, approve: statuses, audit trail and e-mails", async () => {
    const p = await foundationWithDraft();
    const designer = demoEmail("designer");

    const { state: issued } = await callAction(issueRevisionAction, { ...p, note: "First issue for check." }, fx.cookies.designer);
    expect(issued).toMatchObject({ ok: true, data: { label: "A" } });
    if (!issued.ok) throw new Error(issued.message);
    const aId = String(issued.data.revisionId);
    await waitForEmail(demoEmail("manager"), "revision A issued for check");

    const field = await callRoute(COMMENTS, "POST", { ...p, revisionId: aId }, { cookie: fx.cookies.checker, body: { body: "Poisson's ratio 0.33 is high for this sand; use the report's 0.30.", fieldPath: "soil.poissonRatio" } });
    expect(field.status).toBe(201);
    const commentId = (await json(field)).comment.id as string;
    const unknown = await callRoute(COMMENTS, "POST", { ...p, revisionId: aId }, { cookie: fx.cookies.checker, body: { body: "?", fieldPath: "soil.colour" } });
    expect(unknown.status).toBe(400);
    expect((await json(unknown)).error.issues[0].path).toBe("fieldPath");
    const answer = await callRoute(COMMENTS, "POST", { ...p, revisionId: aId }, { cookie: fx.cookies.designer, body: { body: "Changed to 0.30 in the draft.", parentId: commentId } });
    expect((await json(answer)).comment).toMatchObject({ parentId: commentId, fieldPath: "soil.poissonRatio" });
    expect((await callRoute(COMMENTS, "POST", { ...p, revisionId: aId }, { cookie: fx.cookies.viewer, body: { body: "viewer" } })).status).toBe(403);

    const returned = await decide(p, aId, "checker", "returned", "See the comment on Poisson's ratio.");
    expect(returned.status).toBe(201);
    expect(returned.body.revision).toMatchObject({ status: "returned", openComments: 1 });
    const returnMail = await waitForEmail(designer, "revision A returned with comments");
    expect(returnMail.text).toContain("See the comment on Poisson's ratio.");

    await saveDraft(p, (input) => (input.soil.poissonRatio = 0.3));
    const b = await issue(p);
    expect(b.body.revision).toMatchObject({ label: "B", sequence: 2, status: "in-check" });
    await waitForEmail(demoEmail("checker"), "revision B issued for check");
    const resolve = await callRoute(`${COMMENTS}/[commentId]`, "PATCH", { ...p, revisionId: aId, commentId }, { cookie: fx.cookies.checker, body: { resolved: true } });
    expect(resolve.status).toBe(200);

    const compare = await compareRevisions(makeRequest("GET", `/api/x?from=${aId}&to=${b.body.revision.id}`, { cookie: fx.cookies.checker }), { params: Promise.resolve(p) });
    expect(compare.status).toBe(200);
    const diff = (await json(compare)).diff;
    expect(diff.input.entries).toEqual([{ path: "soil.poissonRatio", group: "soil", kind: "changed", old: 0.33, new: 0.3, absoluteChange: expect.closeTo(-0.03, 12), percentChange: expect.closeTo(-9.0909, 3) }]);
    expect(diff.result.entries.length).toBeGreaterThan(0);

    const approved = await decide(p, b.body.revision.id, "checker", "approved");
    expect(approved.status).toBe(201);
    await waitForEmail(designer, "revision B approved");

    const manager = { userId: fx.userIds.manager, isAdmin: false };
    const revs = await listRevisions(manager, p.projectId, p.foundationId);
    expect(revs.map((r) => [r.label, r.status, r.openComments])).toEqual([
      ["A", "superseded", 0],
      ["B", "approved", 0],
    ]);
    const history = await listRevisionHistory(manager, p.projectId, p.foundationId);
    expect(history.map((h) => `${h.action} ${h.label} ${h.actorName}`).reverse()).toEqual([
      "revision.issued A Priya Valcourt",
      "revision.commented A Henrik Osei-Barros",
      "revision.comment-answered A Priya Valcourt",
      "revision.returned A Henrik Osei-Barros",
      "revision.issued B Priya Valcourt",
      "revision.comment-resolved A Henrik Osei-Barros",
      "revision.approved B Henrik Osei-Barros",
    ]);
    const state = (await listFoundationRevisionStates(manager, p.projectId)).find((s) => s.foundationId === p.foundationId);
    expect(state).toMatchObject({ latest: { label: "B", status: "approved" }, revisionCount: 2, openComments: 0 });
  });
});
