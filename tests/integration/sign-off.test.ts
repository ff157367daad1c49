// Two signatures and a purpose (issue 12, item 3): a project signs revisions off in one step
// (a checker or manager approves) or in two (checked by a checker, then approved by a
// different person); neither signature by one of the revision's authors; the purpose chosen
// when issuing is stored and returned in the revision's JSON.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { closeDb, getPool } from "@/db/client";
import { createFoundation, createProject, upsertMember } from "@/db/queries/projects";
import { createUser } from "@/db/queries/accounts";
import { decideRevisionAction } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/actions";
import { callAction, callRoute, cookieFor, getFixture, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const PROJECT = "v1/projects/[projectId]";
const LIST = "v1/projects/[projectId]/foundations/[foundationId]/revisions";
const ONE = `${LIST}/[revisionId]`;
const DECISION = `${ONE}/decision`;
const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";
const PACKAGE = `${ONE}/package`;
const COMMENTS = `${ONE}/comments`;

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely; the assertions pin them down
type Loose = Record<string, any>;
type Who = "manager" | "designer" | "checker" | "checker2";

let fx: Fixture;
let projectId: string;
const cookies = {} as Record<Who, string>;
const ids = {} as Record<Who, string>;

beforeAll(async () => {
  fx = await getFixture();
  // A project of its own, so switching it to two steps touches no other test.
  const project = await createProject({ userId: fx.userIds.manager, isAdmin: false }, { code: `SIGN-${Date.now()}`, name: "Sign-off", client: "", site: "", units: "si" });
  projectId = project.id;
  const second = await createUser({ email: `checker2-${Date.now()}@example.test`, name: "Second Checker" });
  for (const [who, userId, role] of [
    ["manager", fx.userIds.manager, "manager"],
    ["designer", fx.userIds.designer, "designer"],
    ["checker", fx.userIds.checker, "checker"],
    ["checker2", second.id, "checker"],
  ] as const) {
    if (who !== "manager") await upsertMember({ projectId, userId, role });
    ids[who] = userId;
    cookies[who] = who === "checker2" ? await cookieFor(userId) : (fx.cookies[who] as string);
  }
});
afterAll(async () => {
  await closeDb();
});

async function call(route: string, method: string, params: Record<string, string>, who: Who, body?: unknown): Promise<{ status: number; body: Loose }> {
  const res = await callRoute(route, method, params, { cookie: cookies[who], body });
  return { status: res.status, body: (await res.json()) as Loose };
}

let n = 0;
/** A foundation whose draft the designer saved and issued; returns its revision. */
async function issued(issueBody: Loose = {}): Promise<{ p: { projectId: string; foundationId: string }; revisionId: string; revision: Loose }> {
  n += 1;
  const f = await createFoundation({ userId: ids.manager, isAdmin: false }, projectId, { tag: `SIGN-${n}`, machineTrain: "Sign-off", location: "" });
  const p = { projectId, foundationId: f.id };
  const current = await call(DRAFT, "GET", p, "designer");
  const saved = await call(DRAFT, "PUT", p, "designer", { version: current.body.draft.version, input: sampleAnalysisInput() });
  expect(saved.status).toBe(200);
  const rev = await call(LIST, "POST", p, "designer", { note: "Issued for the sign-off test.", ...issueBody });
  expect(rev.status).toBe(201);
  return { p, revisionId: rev.body.revision.id as string, revision: rev.body.revision };
}

async function setSteps(steps: "one" | "two"): Promise<void> {
  const res = await call(PROJECT, "PATCH", { projectId }, "manager", { signOffSteps: steps });
  expect(res.status).toBe(200);
  expect(res.body.project.signOffSteps).toBe(steps);
}

describe("revision purpose", () => {
  it("stores the purpose chosen when issuing and returns it in the revision's JSON; issued for check by default", async () => {
    const a = await issued({ purpose: "issued-for-construction" });
    expect(a.revision.purpose).toBe("issued-for-construction");
    const read = await call(ONE, "GET", { ...a.p, revisionId: a.revisionId }, "checker");
    expect(read.body.revision.purpose).toBe("issued-for-construction");
    const list = await call(LIST, "GET", a.p, "checker");
    expect(list.body.revisions[0].purpose).toBe("issued-for-construction");
    const b = await issued();
    expect(b.revision.purpose).toBe("issued-for-check");
  });

  it("refuses a purpose outside the list with a 400 naming the field, and issues nothing", async () => {
    n += 1;
    const f = await createFoundation({ userId: ids.manager, isAdmin: false }, projectId, { tag: `SIGN-${n}`, machineTrain: "", location: "" });
    const p = { projectId, foundationId: f.id };
    const current = await call(DRAFT, "GET", p, "designer");
    await call(DRAFT, "PUT", p, "designer", { version: current.body.draft.version, input: sampleAnalysisInput() });
    const bad = await call(LIST, "POST", p, "designer", { note: "Purpose refused.", purpose: "for fun" });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.error.issues)).toContain("purpose");
    expect((await call(LIST, "GET", p, "designer")).body.revisions).toHaveLength(0);
  });
});

describe("one-step sign-off (the default) is unchanged", () => {
  it("a checker approves directly; \"checked\" is refused with a 400 naming outcome", async () => {
    await setSteps("one");
    const { p, revisionId } = await issued();
    const checked = await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "checked", note: "" });
    expect(checked.status).toBe(400);
    expect(JSON.stringify(checked.body.error.issues)).toContain("outcome");
    const approved = await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "approved", note: "" });
    expect(approved.status).toBe(201);
    expect(approved.body.revision.status).toBe("approved");
    expect(approved.body.revision.check).toBeNull();
    expect(approved.body.revision.decision).toMatchObject({ decidedById: ids.checker, decidedByRole: "checker" });
  });
});

describe("two-step sign-off", () => {
  it("a checker checks, then a different person approves; both steps with name, date and role", async () => {
    await setSteps("two");
    const { p, revisionId } = await issued();
    // Not approvable before it is checked.
    const early = await call(DECISION, "POST", { ...p, revisionId }, "manager", { outcome: "approved", note: "" });
    expect(early.status).toBe(409);
    const checked = await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "checked", note: "Springs and modes checked" });
    expect(checked.status).toBe(201);
    expect(checked.body.revision.status).toBe("checked");
    expect(checked.body.revision.check).toMatchObject({ checkedById: ids.checker, checkedByRole: "checker", note: "Springs and modes checked" });
    expect(checked.body.revision.decision).toBeNull();
    const again = await call(DECISION, "POST", { ...p, revisionId }, "checker2", { outcome: "checked", note: "" });
    expect(again.status).toBe(409);

    const approved = await call(DECISION, "POST", { ...p, revisionId }, "manager", { outcome: "approved", note: "Approved for construction" });
    expect(approved.status).toBe(201);
    const rev = (await call(ONE, "GET", { ...p, revisionId }, "designer")).body.revision as Loose;
    expect(rev.status).toBe("approved");
    expect(rev.check.checkedById).toBe(ids.checker);
    expect(rev.check.checkedByName.length).toBeGreaterThan(0);
    expect(Number.isNaN(Date.parse(rev.check.checkedAt))).toBe(false);
    expect(rev.decision).toMatchObject({ outcome: "approved", decidedById: ids.manager, decidedByRole: "manager" });
    const events = await getPool().query("SELECT action FROM audit_events WHERE detail->>'revisionId' = $1 ORDER BY id", [revisionId]);
    expect(events.rows.map((r) => r.action)).toEqual(["revision.issued", "revision.checked", "revision.approved"]);
  });

  it("another checker may give the approval", async () => {
    await setSteps("two");
    const { p, revisionId } = await issued();
    expect((await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "checked", note: "" })).status).toBe(201);
    const approved = await call(DECISION, "POST", { ...p, revisionId }, "checker2", { outcome: "approved", note: "" });
    expect(approved.status).toBe(201);
    expect(approved.body.revision.decision).toMatchObject({ decidedById: ids.checker2, decidedByRole: "checker" });
  });

  it("the same person cannot both check and approve (route, action and the database)", async () => {
    await setSteps("two");
    const { p, revisionId } = await issued();
    expect((await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "checked", note: "" })).status).toBe(201);
    const self = await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "approved", note: "" });
    expect(self.status).toBe(403);
    expect(self.body.error.message).toMatch(/different person/);
    const byAction = await callAction(decideRevisionAction, { ...p, revisionId, outcome: "approved", note: "" }, cookies.checker);
    expect(byAction.state).toMatchObject({ ok: false, code: "forbidden" });
    await expect(getPool().query("INSERT INTO revision_decisions (revision_id, outcome, decided_by_id) VALUES ($1, 'approved', $2)", [revisionId, ids.checker])).rejects.toThrow(/checked it/);
    expect((await getPool().query("SELECT count(*)::int AS n FROM revision_decisions WHERE revision_id = $1", [revisionId])).rows[0].n).toBe(0);
    // The checker may still return it (a return is no second signature).
    const ret = await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "returned", note: "Found a slip after all" });
    expect(ret.status).toBe(201);
    expect(ret.body.revision.status).toBe("returned");
  });

  it("an author cannot check: the issuer is refused, in the database too; a check is immutable", async () => {
    await setSteps("two");
    const { p, revisionId } = await issued();
    const byIssuer = await call(DECISION, "POST", { ...p, revisionId }, "designer", { outcome: "checked", note: "" });
    expect(byIssuer.status).toBe(403);
    await expect(getPool().query("INSERT INTO revision_checks (revision_id, checked_by_id, checked_by_role) VALUES ($1, $2, 'manager')", [revisionId, ids.designer])).rejects.toThrow(/one of its authors/);
    expect((await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "checked", note: "" })).status).toBe(201);
    await expect(getPool().query("UPDATE revision_checks SET note = 'changed' WHERE revision_id = $1", [revisionId])).rejects.toThrow(/immutable/);
  });
});

describe("the package of a two-step revision", () => {
  it("carries both signatures with roles on the cover, the review comment in the trail and the state in every header", async () => {
    await setSteps("two");
    const { p, revisionId } = await issued({ purpose: "issued-for-approval" });
    const params = { ...p, revisionId };
    expect((await call(COMMENTS, "POST", params, "checker", { body: "Check the grout thickness" })).status).toBe(201);
    expect((await call(DECISION, "POST", params, "checker", { outcome: "checked", note: "" })).status).toBe(201);
    const read = async () => {
      const res = await callRoute(PACKAGE, "GET", params, { cookie: cookies.manager });
      expect(res.status).toBe(200);
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.load((await res.arrayBuffer()) as ArrayBuffer);
      return wb;
    };
    const texts = (ws: ExcelJS.Worksheet) => {
      const out: string[] = [];
      ws.eachRow((row) => row.eachCell((c) => out.push(String(c.value))));
      return out;
    };
    const checkedWb = await read();
    for (const ws of checkedWb.worksheets) expect(ws.headerFooter.oddHeader, ws.name).toContain("checked, awaiting approval: not for construction");
    const trail = texts(checkedWb.getWorksheet("Revision trail")!);
    expect(trail).toContain("Check the grout thickness");
    expect(trail).toContain("open");
    expect(texts(checkedWb.getWorksheet("Cover")!)).toContain("issued for approval");

    expect((await call(DECISION, "POST", params, "manager", { outcome: "approved", note: "" })).status).toBe(201);
    const approvedWb = await read();
    const cover = texts(approvedWb.getWorksheet("Cover")!);
    const names = await getPool().query("SELECT id, name FROM users WHERE id = ANY($1::uuid[])", [[ids.checker, ids.manager]]);
    const nameOf = new Map(names.rows.map((r) => [r.id as string, r.name as string]));
    expect(cover).toContain(`${nameOf.get(ids.checker)} (checker)`);
    expect(cover).toContain(`${nameOf.get(ids.manager)} (manager)`);
    for (const ws of approvedWb.worksheets) expect(ws.headerFooter.oddHeader, ws.name).not.toContain("not for construction");
  });
});

describe("switching back to one step", () => {
  it("a revision checked under two steps is still approved by someone other than its checker (403, not a database error)", async () => {
    await setSteps("two");
    const { p, revisionId } = await issued();
    expect((await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "checked", note: "" })).status).toBe(201);
    await setSteps("one");
    const self = await call(DECISION, "POST", { ...p, revisionId }, "checker", { outcome: "approved", note: "" });
    expect(self.status).toBe(403);
    const other = await call(DECISION, "POST", { ...p, revisionId }, "manager", { outcome: "approved", note: "" });
    expect(other.status).toBe(201);
    expect(other.body.revision.status).toBe("approved");
  });
});
