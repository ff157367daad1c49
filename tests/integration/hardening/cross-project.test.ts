// IDs from another project or company: a second project (the administrator's, with a
// foundation, draft, revision, comment, vendor request, version and drawing of its own).
// (a) Every project-scoped route called under the demo project's path with the second
// project's ids, by demo members who hold every right on the demo project; (b) every
// demo member calling the second project's routes with its own ids; (c) the actions with
// the second project's ids. Each answers 403 or 404 and carries none of the data.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getPool } from "@/db/client";
import { acceptSubmissionAction, returnSubmissionAction, sendDataRequestAction, submitMachineFormAction } from "@/app/(desk)/projects/[projectId]/requests/actions";
import { commentOnRevisionAction, decideRevisionAction, issueRevisionAction, resolveRevisionCommentAction } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/actions";
import { createFoundationAction, inviteMemberAction, removeMemberAction, updateProjectSettingsAction } from "@/app/(desk)/actions";
import { POST as postSubmission } from "@/app/api/v1/projects/[projectId]/requests/[requestId]/submissions/route";
import { POST as postDrawing } from "@/app/api/v1/projects/[projectId]/requests/[requestId]/drawings/route";
import { callAction, getFixture, type ActionFn, type Fixture, type MatrixRole } from "../support/fixture";
import { callRouteAt, Tally, uploadRequest } from "../support/hardening-helpers";
import { createHardeningProject, type HardeningProject } from "../support/hardening-project";
import { sampleAnalysisInput } from "../analysis-input-sample";
import { onePagePdf } from "../../support/pdf-fixture";

let fx: Fixture;
let other: HardeningProject;
const figures: string[] = [];

beforeAll(async () => {
  fx = await getFixture();
  other = await createHardeningProject({ userId: fx.userIds.admin, isAdmin: true }, "XP");
});

afterAll(async () => {
  console.log(`[hardening] cross-project figures:\n  ${figures.join("\n  ")}`);
  await closeDb();
});

const F = "v1/projects/[projectId]/foundations/[foundationId]";
const R = `${F}/revisions/[revisionId]`;
const Q = "v1/projects/[projectId]/requests/[requestId]";

interface Call {
  route: string;
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  body?: unknown;
  query?: string;
}

/** Every project-scoped route that takes an id below the project, with a body an allowed caller could send. */
function idRoutes(o: HardeningProject): Call[] {
  return [
    { route: F, method: "GET" },
    { route: `${F}/draft`, method: "GET" },
    { route: `${F}/draft`, method: "PUT", body: { version: 1, input: sampleAnalysisInput() } },
    { route: `${F}/revisions`, method: "GET" },
    { route: `${F}/revisions`, method: "POST", body: { note: "Cross-project probe." } },
    { route: `${F}/revisions/compare`, method: "GET", query: `from=${o.revisionId}&to=${o.revisionId}` },
    { route: R, method: "GET" },
    { route: `${R}/package`, method: "GET" },
    { route: `${R}/package/pdf`, method: "GET" },
    { route: `${R}/decision`, method: "POST", body: { outcome: "approved", note: "" } },
    { route: `${R}/comments`, method: "GET" },
    { route: `${R}/comments`, method: "POST", body: { body: "cross-project probe" } },
    { route: `${R}/comments/[commentId]`, method: "PATCH", body: { resolved: true } },
    { route: "v1/projects/[projectId]/members/[memberId]", method: "DELETE" },
    { route: Q, method: "GET" },
    { route: `${Q}/workbook`, method: "GET" },
    { route: `${Q}/csv-template`, method: "GET" },
    { route: "v1/projects/[projectId]/files/[fileId]", method: "GET" },
  ];
}

/** The routes that only take the project. */
function projectRoutes(): Call[] {
  return [
    { route: "v1/projects/[projectId]", method: "GET" },
    { route: "v1/projects/[projectId]", method: "PATCH", body: { units: "us" } },
    { route: "v1/projects/[projectId]/members", method: "GET" },
    { route: "v1/projects/[projectId]/members", method: "POST", body: { projectId: other.projectId, email: `xp-${Date.now()}@example.test`, name: "Probe", role: "viewer" } },
    { route: "v1/projects/[projectId]/foundations", method: "GET" },
    { route: "v1/projects/[projectId]/foundations", method: "POST", body: { tag: "XP-PROBE", machineTrain: "", location: "" } },
    { route: "v1/projects/[projectId]/requests", method: "GET" },
    { route: "v1/projects/[projectId]/register", method: "GET" },
  ];
}

function idsOf(o: HardeningProject): Record<string, string> {
  return { foundationId: o.foundationId, revisionId: o.revisionId, commentId: o.commentId, memberId: o.memberId, requestId: o.requestId, fileId: o.fileId };
}

/** Strings of the second project that must never appear in an answer to an outsider. */
function secrets(o: HardeningProject): string[] {
  return [o.code, o.foundationTag, "hardening XP", "Hardening fan", ...Object.values(idsOf(o)).filter((id) => id !== o.memberId)];
}

async function expectRefused(res: Response, what: string, tally: Tally): Promise<void> {
  tally.add(res.status);
  const text = await res.text();
  expect([403, 404], `${what}: ${res.status} ${text.slice(0, 200)}`).toContain(res.status);
  expect(text, what).toMatch(/"error"/);
  for (const s of secrets(other)) expect(text.includes(s), `${what} leaks ${s}`).toBe(false);
}

async function changesOfOther(): Promise<Record<string, unknown>> {
  const pool = getPool();
  const q = async (sql: string) => (await pool.query<{ n: number }>(sql, [other.projectId])).rows[0]?.n;
  return {
    foundations: await q("SELECT count(*)::int AS n FROM foundations WHERE project_id = $1"),
    draftVersion: await q("SELECT max(d.version)::int AS n FROM foundation_drafts d JOIN foundations f ON f.id = d.foundation_id WHERE f.project_id = $1"),
    revisions: await q("SELECT count(*)::int AS n FROM revisions r JOIN foundations f ON f.id = r.foundation_id WHERE f.project_id = $1"),
    decisions: await q("SELECT count(*)::int AS n FROM revision_decisions d JOIN revisions r ON r.id = d.revision_id JOIN foundations f ON f.id = r.foundation_id WHERE f.project_id = $1"),
    comments: await q("SELECT count(*)::int AS n FROM revision_comments c JOIN revisions r ON r.id = c.revision_id JOIN foundations f ON f.id = r.foundation_id WHERE f.project_id = $1"),
    resolved: await q("SELECT count(*)::int AS n FROM revision_comments c JOIN revisions r ON r.id = c.revision_id JOIN foundations f ON f.id = r.foundation_id WHERE f.project_id = $1 AND c.resolved"),
    members: await q("SELECT count(*)::int AS n FROM project_members WHERE project_id = $1"),
    submissions: await q("SELECT count(*)::int AS n FROM vendor_submissions WHERE project_id = $1"),
    reviews: await q("SELECT count(*)::int AS n FROM vendor_submission_reviews r JOIN vendor_submissions s ON s.id = r.submission_id WHERE s.project_id = $1"),
    files: await q("SELECT count(*)::int AS n FROM stored_files WHERE project_id = $1"),
    units: (await getPool().query<{ units: string }>("SELECT units FROM projects WHERE id = $1", [other.projectId])).rows[0]?.units,
  };
}

const demoRoles: MatrixRole[] = ["manager", "designer", "checker", "vendor", "viewer"];

describe("another project's ids under this project's path", () => {
  it("answer 403 or 404 to every demo member, change nothing and carry none of the data", async () => {
    const before = await changesOfOther();
    const tally = new Tally();
    for (const role of demoRoles) {
      for (const c of idRoutes(other)) {
        const res = await callRouteAt(c.route, c.method, { projectId: fx.projectId, ...idsOf(other) }, { cookie: fx.cookies[role], body: c.body, query: c.query });
        await expectRefused(res, `${role} ${c.method} ${c.route} (demo path, other ids)`, tally);
      }
      for (const handler of [postSubmission, postDrawing]) {
        const pdf = onePagePdf();
        const res = await handler(uploadRequest(fx.cookies[role], pdf, "probe.pdf"), { params: Promise.resolve({ projectId: fx.projectId, requestId: other.requestId }) });
        await expectRefused(res, `${role} upload (demo path, other request)`, tally);
      }
    }
    figures.push(`demo path with the other project's ids: ${tally.total} calls, statuses ${tally}`);
    expect(await changesOfOther()).toEqual(before);
  }, 60_000);
});

describe("the other project's own routes", () => {
  it("answer 403 or 404 to every demo member and to the outsider, whatever the route", async () => {
    const before = await changesOfOther();
    const tally = new Tally();
    for (const role of [...demoRoles, "outsider" as const]) {
      for (const c of [...idRoutes(other), ...projectRoutes()]) {
        const res = await callRouteAt(c.route, c.method, { projectId: other.projectId, ...idsOf(other) }, { cookie: fx.cookies[role], body: c.body, query: c.query });
        await expectRefused(res, `${role} ${c.method} ${c.route} (other project)`, tally);
      }
      for (const handler of [postSubmission, postDrawing]) {
        const pdf = onePagePdf();
        const res = await handler(uploadRequest(fx.cookies[role], pdf, "probe.pdf"), { params: Promise.resolve({ projectId: other.projectId, requestId: other.requestId }) });
        await expectRefused(res, `${role} upload (other project)`, tally);
      }
    }
    // The project list of a demo member does not name the other project.
    const list = await callRouteAt("v1/projects", "GET", {}, { cookie: fx.cookies.manager });
    expect(list.status).toBe(200);
    expect(await list.text()).not.toContain(other.code);
    figures.push(`other project's routes by demo members and the outsider: ${tally.total} calls, statuses ${tally}`);
    expect(await changesOfOther()).toEqual(before);
  }, 60_000);
});

describe("actions with another project's ids", () => {
  it("refuse the demo's manager, designer and vendor (forbidden, not found or a field error naming no data) and change nothing", async () => {
    const before = await changesOfOther();
    const tally = new Tally();
    const o = other;
    const rows: { name: string; action: ActionFn; fields: Record<string, string>; roles: MatrixRole[] }[] = [];
    for (const projectId of [fx.projectId, o.projectId]) {
      rows.push(
        { name: "revision.issue", action: issueRevisionAction, fields: { projectId, foundationId: o.foundationId, note: "cross-project probe" }, roles: ["manager", "designer"] },
        { name: "revision.decide", action: decideRevisionAction, fields: { projectId, foundationId: o.foundationId, revisionId: o.revisionId, outcome: "approved", note: "" }, roles: ["manager", "checker"] },
        { name: "revision.comment", action: commentOnRevisionAction, fields: { projectId, foundationId: o.foundationId, revisionId: o.revisionId, body: "probe" }, roles: ["manager", "checker"] },
        { name: "revision.resolveComment", action: resolveRevisionCommentAction, fields: { projectId, foundationId: o.foundationId, commentId: o.commentId, resolved: "true" }, roles: ["manager", "checker"] },
        { name: "members.remove", action: removeMemberAction, fields: { projectId, memberId: o.memberId }, roles: ["manager"] },
        { name: "vendor.sendRequest", action: sendDataRequestAction, fields: { projectId, foundationId: o.foundationId, contact: `member:${o.vendorId}`, machineNames: "Fan" }, roles: ["manager", "designer"] },
        { name: "vendor.submitForm", action: submitMachineFormAction, fields: { projectId, requestId: o.requestId, machines: JSON.stringify(sampleAnalysisInput().machines) }, roles: ["vendor"] },
        { name: "vendor.acceptSubmission", action: acceptSubmissionAction, fields: { projectId, submissionId: o.submissionId, draftVersion: "1" }, roles: ["manager", "designer"] },
        { name: "vendor.returnSubmission", action: returnSubmissionAction, fields: { projectId, submissionId: o.submissionId, comment: "cross-project probe" }, roles: ["manager", "designer"] },
      );
    }
    rows.push(
      { name: "members.invite", action: inviteMemberAction, fields: { projectId: o.projectId, email: `xp-a-${Date.now()}@example.test`, name: "Probe", role: "viewer" }, roles: ["manager"] },
      { name: "project.updateSettings", action: updateProjectSettingsAction, fields: { projectId: o.projectId, units: "us", revisionScheme: "numbers" }, roles: ["manager"] },
      { name: "foundation.create", action: createFoundationAction, fields: { projectId: o.projectId, tag: "XP-A-PROBE" }, roles: ["manager", "designer"] },
    );
    for (const row of rows) {
      for (const role of row.roles) {
        const { state } = await callAction(row.action, row.fields, fx.cookies[role]);
        const what = `${role} ${row.name} under ${row.fields.projectId === fx.projectId ? "the demo" : "the other"} project`;
        tally.add(state.ok ? "ok" : state.code);
        expect(state.ok, `${what}: ${JSON.stringify(state)}`).toBe(false);
        if (!state.ok) {
          expect(["forbidden", "not_found", "invalid_input"], `${what}: ${JSON.stringify(state)}`).toContain(state.code);
          const text = JSON.stringify(state);
          for (const s of secrets(o)) expect(text.includes(s), `${what} leaks ${s}`).toBe(false);
        }
      }
    }
    figures.push(`actions with the other project's ids: ${tally.total} calls, ${tally}`);
    expect(await changesOfOther()).toEqual(before);
  }, 60_000);
});
