// The client's view (issue 18 item 5, issue 12 item 4): the viewer reads issued revisions
// but no draft, no review comments, no return note; downloads the packages of approved
// revisions, and of an earlier one only while a manager shares it (an audit event each
// way); an approved revision stays the latest approved one, of record, while a later one
// is in check or returned.
import ExcelJS from "exceljs";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { auditEvents } from "@/db/schema";
import { getDraft, saveDraft } from "@/db/queries/drafts";
import { createFoundation } from "@/db/queries/projects";
import {
  createRevisionComment,
  decideRevision,
  issueRevision,
  listFoundationRevisionStates,
  listRevisionComments,
  listRevisionHistory,
  listRevisions,
} from "@/db/queries/revisions";
import { parseAnalysisInput, type AnalysisInput } from "@/modules/calc";
import { REGISTER_SHEETS } from "@/modules/calc-package";
import { callRoute, getFixture, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";
import { readTables, tableByTitle } from "../unit/calc-package/read-tables";

let fx: Fixture;
const actor = (role: "manager" | "designer" | "checker" | "viewer") => ({ userId: fx.userIds[role], isAdmin: false });

beforeAll(async () => {
  fx = await getFixture();
});

afterAll(async () => {
  await closeDb();
});

function input(edit: (i: ReturnType<typeof sampleAnalysisInput>) => void = () => {}): AnalysisInput {
  const raw = sampleAnalysisInput();
  edit(raw);
  const parsed = parseAnalysisInput(raw);
  if (!parsed.ok) throw new Error(`sample input invalid: ${JSON.stringify(parsed.issues)}`);
  return parsed.input;
}

/** A foundation of its own, its draft saved by the designer from `first`. */
async function newFoundation(tag: string, first: AnalysisInput): Promise<{ projectId: string; foundationId: string }> {
  const f = await createFoundation(actor("manager"), fx.projectId, { tag: `${tag}-${Date.now().toString(36)}`, machineTrain: "Client view", location: "" });
  const saved = await saveDraft(actor("designer"), fx.projectId, f.id, { input: first, expectedVersion: 0 });
  if (!saved?.ok) throw new Error("draft not saved");
  return { projectId: fx.projectId, foundationId: f.id };
}

async function saveAndIssue(p: { projectId: string; foundationId: string }, next: AnalysisInput): Promise<string> {
  const draft = await getDraft(actor("designer"), p.projectId, p.foundationId);
  const saved = await saveDraft(actor("designer"), p.projectId, p.foundationId, { input: next, expectedVersion: draft?.version ?? 0 });
  if (!saved?.ok) throw new Error("draft not saved");
  return issue(p);
}

async function issue(p: { projectId: string; foundationId: string }): Promise<string> {
  const out = await issueRevision(actor("designer"), p.projectId, p.foundationId);
  if (!out.ok) throw new Error(`not issued: ${out.reason}`);
  return out.revision.id;
}

const pkg = (p: { projectId: string; foundationId: string }, revisionId: string, role: "viewer" | "manager" | "designer") =>
  callRoute("v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/package", "GET", { ...p, revisionId }, { cookie: fx.cookies[role] });

describe("the viewer reads issued revisions only, without the team's review", () => {
  it("is refused the draft and the comments, and sees neither the comment count nor the return note", async () => {
    const p = await newFoundation("ZZ-CLIENT-READ", input());
    const a = await issue(p);
    const made = await createRevisionComment(actor("checker"), p.projectId, p.foundationId, a, { body: "internal: check the soil modulus", fieldPath: null, parentId: null });
    expect(made.ok).toBe(true);
    const returned = await decideRevision(actor("checker"), p.projectId, p.foundationId, a, { outcome: "returned", note: "internal return note" });
    expect(returned.ok).toBe(true);

    // The data layer itself: no draft, no comments for the viewer; the team keeps both.
    expect(await getDraft(actor("viewer"), p.projectId, p.foundationId)).toBeUndefined();
    expect((await getDraft(actor("checker"), p.projectId, p.foundationId))?.input).not.toBeNull();
    expect(await listRevisionComments(actor("viewer"), p.projectId, p.foundationId, a)).toBeUndefined();
    expect(await listRevisionComments(actor("designer"), p.projectId, p.foundationId, a)).toHaveLength(1);
    const [mine] = await listRevisions(actor("viewer"), p.projectId, p.foundationId);
    expect(mine).toMatchObject({ id: a, status: "returned", openComments: null, decision: { outcome: "returned", note: "" } });
    const [theirs] = await listRevisions(actor("designer"), p.projectId, p.foundationId);
    expect(theirs).toMatchObject({ openComments: 1, decision: { note: "internal return note" } });
    const trail = await listRevisionHistory(actor("viewer"), p.projectId, p.foundationId);
    expect(trail.map((t) => t.action).sort()).toEqual(["revision.issued", "revision.returned"]);
    expect((await listRevisionHistory(actor("designer"), p.projectId, p.foundationId)).map((t) => t.action)).toContain("revision.commented");

    // Over HTTP: draft and comments 403; the revision itself 200 with no comment or note in it.
    const draftRes = await callRoute("v1/projects/[projectId]/foundations/[foundationId]/draft", "GET", p, { cookie: fx.cookies.viewer });
    expect(draftRes.status).toBe(403);
    const commentsRes = await callRoute("v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/comments", "GET", { ...p, revisionId: a }, { cookie: fx.cookies.viewer });
    expect(commentsRes.status).toBe(403);
    const revRes = await callRoute("v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]", "GET", { ...p, revisionId: a }, { cookie: fx.cookies.viewer });
    expect(revRes.status).toBe(200);
    const text = await revRes.text();
    expect(text).not.toContain("internal: check the soil modulus");
    expect(text).not.toContain("internal return note");
    expect((JSON.parse(text) as { comments: unknown[] }).comments).toEqual([]);
    // The project states: no comment count and no draft submission for the viewer.
    const state = (await listFoundationRevisionStates(actor("viewer"), p.projectId)).find((s) => s.foundationId === p.foundationId);
    expect(state).toMatchObject({ openComments: null, draftVendorSubmissionId: null });
  });
});

describe("a manager shares an unapproved revision with the client", () => {
  it("opens its package to the viewer while shared, records who shared and withdrew it, and only a manager may", async () => {
    const p = await newFoundation("ZZ-CLIENT-SHARE", input());
    const a = await issue(p);
    expect((await pkg(p, a, "viewer")).status).toBe(403);
    expect((await pkg(p, a, "designer")).status).toBe(200);

    const share = (role: "manager" | "designer" | "viewer", method: "POST" | "DELETE") =>
      callRoute("v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/share", method, { ...p, revisionId: a }, { cookie: fx.cookies[role] });
    expect((await share("designer", "POST")).status).toBe(403);
    expect((await share("viewer", "POST")).status).toBe(403);
    expect((await pkg(p, a, "viewer")).status).toBe(403);

    const shared = await share("manager", "POST");
    expect(shared.status).toBe(200);
    expect(((await shared.json()) as { revision: { sharedWithClient: { sharedByName: string } | null } }).revision.sharedWithClient?.sharedByName).toBeTruthy();
    const viewerPkg = await pkg(p, a, "viewer");
    expect(viewerPkg.status).toBe(200);
    expect(viewerPkg.headers.get("content-type")).toMatch(/spreadsheetml/);
    const [listed] = await listRevisions(actor("viewer"), p.projectId, p.foundationId);
    expect(listed?.sharedWithClient).not.toBeNull();

    const withdrawn = await share("manager", "DELETE");
    expect(withdrawn.status).toBe(200);
    expect((await pkg(p, a, "viewer")).status).toBe(403);

    const events = await getDb()
      .select({ action: auditEvents.action, actorId: auditEvents.actorId })
      .from(auditEvents)
      .where(and(eq(auditEvents.projectId, p.projectId), sql`${auditEvents.detail}->>'revisionId' = ${a}`, sql`${auditEvents.action} like 'revision.share%'`))
      .orderBy(auditEvents.id);
    expect(events).toEqual([
      { action: "revision.shared-with-client", actorId: fx.userIds.manager },
      { action: "revision.share-withdrawn", actorId: fx.userIds.manager },
    ]);
    // Withdrawing again changes nothing and records nothing.
    expect((await share("manager", "DELETE")).status).toBe(200);
    const after = await getDb()
      .select({ n: sql<number>`count(*)::int` })
      .from(auditEvents)
      .where(and(sql`${auditEvents.detail}->>'revisionId' = ${a}`, sql`${auditEvents.action} like 'revision.share%'`));
    expect(after[0]?.n).toBe(2);
  });
});

describe("the latest approved revision stays visible", () => {
  it("A approved stays approved and latest approved while B is in check and after B is returned; C approved supersedes it", async () => {
    const p = await newFoundation("ZZ-CLIENT-LATEST", input());
    const a = await issue(p);
    expect((await decideRevision(actor("checker"), p.projectId, p.foundationId, a, { outcome: "approved", note: "For construction." })).ok).toBe(true);
    const b = await saveAndIssue(p, input((i) => (i.soil.poissonRatio = 0.31)));

    for (const role of ["designer", "viewer"] as const) {
      const revs = await listRevisions(actor(role), p.projectId, p.foundationId);
      expect(revs.map((r) => [r.id, r.status, r.latestApproved])).toEqual([
        [a, "approved", true],
        [b, "in-check", false],
      ]);
      const state = (await listFoundationRevisionStates(actor(role), p.projectId)).find((s) => s.foundationId === p.foundationId);
      expect(state?.latest).toMatchObject({ id: b, status: "in-check" });
      expect(state?.latestApproved).toMatchObject({ id: a });
    }
    // The client has A's package (approved), not B's (in check); the approval note is theirs.
    expect((await pkg(p, a, "viewer")).status).toBe(200);
    expect((await pkg(p, b, "viewer")).status).toBe(403);
    expect((await listRevisions(actor("viewer"), p.projectId, p.foundationId))[0]?.decision?.note).toBe("For construction.");

    expect((await decideRevision(actor("checker"), p.projectId, p.foundationId, b, { outcome: "returned", note: "Poisson ratio unsupported." })).ok).toBe(true);
    const afterReturn = await listRevisions(actor("manager"), p.projectId, p.foundationId);
    expect(afterReturn.map((r) => [r.status, r.latestApproved])).toEqual([
      ["approved", true],
      ["returned", false],
    ]);

    // The register names A as latest approved beside B as latest issued.
    const reg = await callRoute("v1/projects/[projectId]/register", "GET", { projectId: p.projectId }, { cookie: fx.cookies.manager });
    expect(reg.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(Buffer.from(await reg.arrayBuffer()) as unknown as ArrayBuffer);
    const table = tableByTitle(readTables(wb.getWorksheet(REGISTER_SHEETS.register) as ExcelJS.Worksheet), "Foundations");
    const col = (h: string) => table.headers.indexOf(h);
    const row = table.rows.find((r) => r[col("Latest revision")] === "B" && r[col("Latest approved")] === "A" && String(r[col("Foundation")]).startsWith("ZZ-CLIENT-LATEST"));
    expect(row, "register row with latest revision B and latest approved A").toBeDefined();

    const c = await saveAndIssue(p, input((i) => (i.soil.poissonRatio = 0.32)));
    expect((await decideRevision(actor("checker"), p.projectId, p.foundationId, c, { outcome: "approved", note: "" })).ok).toBe(true);
    const final = await listRevisions(actor("viewer"), p.projectId, p.foundationId);
    expect(final.map((r) => [r.status, r.latestApproved])).toEqual([
      ["superseded", false],
      ["superseded", false],
      ["approved", true],
    ]);
  });
});
