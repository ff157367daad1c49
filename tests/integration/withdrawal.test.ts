// Withdrawing a foundation created by mistake: it leaves the foundation list and the
// register, nothing on it can change, its issued revisions and audit trail stay readable
// by managers (and by nobody else), and a manager can restore it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { closeDb, getPool } from "@/db/client";
import { createFoundation } from "@/db/queries/projects";
import { callRoute, getFixture, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const F = "v1/projects/[projectId]/foundations/[foundationId]";
const LIST = "v1/projects/[projectId]/foundations";

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  await closeDb();
});

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely; the assertions pin them down
type Loose = Record<string, any>;
const json = async (r: Response): Promise<Loose> => (await r.json()) as Loose;

describe("withdrawing a foundation", () => {
  it("takes it off the list and the register, freezes it, keeps its revisions for managers, and restores it", async () => {
    const tag = `WD-IT-${Date.now()}`;
    const f = await createFoundation({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId, { tag, machineTrain: "Mistake", location: "" });
    const p = { projectId: fx.projectId, foundationId: f.id };
    expect((await callRoute(`${F}/draft`, "PUT", p, { cookie: fx.cookies.designer, body: { version: 0, input: sampleAnalysisInput() } })).status).toBe(200);
    const issued = await callRoute(`${F}/revisions`, "POST", p, { cookie: fx.cookies.designer, body: { note: "Issued for check." } });
    expect(issued.status).toBe(201);
    const revisionId = (await json(issued)).revision.id as string;

    // A reason is required.
    const noReason = await callRoute(`${F}/withdrawal`, "POST", p, { cookie: fx.cookies.manager, body: { reason: "" } });
    expect(noReason.status).toBe(400);
    expect((await json(noReason)).error.issues[0].path).toBe("reason");
    // A designer may not withdraw.
    expect((await callRoute(`${F}/withdrawal`, "POST", p, { cookie: fx.cookies.designer, body: { reason: "created twice" } })).status).toBe(403);

    const w = await callRoute(`${F}/withdrawal`, "POST", p, { cookie: fx.cookies.manager, body: { reason: "created twice" } });
    expect(w.status).toBe(200);
    expect((await json(w)).foundation.withdrawalReason).toBe("created twice");
    // Twice is a conflict, not a silent success.
    expect((await callRoute(`${F}/withdrawal`, "POST", p, { cookie: fx.cookies.manager, body: { reason: "again" } })).status).toBe(409);

    for (const role of ["manager", "designer", "checker", "viewer"] as const) {
      const list = await json(await callRoute(LIST, "GET", { projectId: fx.projectId }, { cookie: fx.cookies[role] }));
      expect(list.foundations.map((x: Loose) => x.tag), role).not.toContain(tag);
    }
    const register = await callRoute("v1/projects/[projectId]/register", "GET", { projectId: fx.projectId }, { cookie: fx.cookies.manager });
    expect(register.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(Buffer.from(await register.arrayBuffer()) as unknown as ArrayBuffer);
    expect(JSON.stringify(wb.worksheets.map((s) => s.getSheetValues()))).not.toContain(tag);

    // Managers still read it and its issued revision; nobody else does.
    expect((await callRoute(F, "GET", p, { cookie: fx.cookies.manager })).status).toBe(200);
    expect((await callRoute(`${F}/revisions/[revisionId]`, "GET", { ...p, revisionId }, { cookie: fx.cookies.manager })).status).toBe(200);
    for (const role of ["designer", "checker", "viewer"] as const) expect((await callRoute(F, "GET", p, { cookie: fx.cookies[role] })).status, role).toBe(404);

    // Frozen: no draft save and no issue, even by a manager.
    const draft = await json(await callRoute(`${F}/draft`, "GET", p, { cookie: fx.cookies.manager }));
    const save = await callRoute(`${F}/draft`, "PUT", p, { cookie: fx.cookies.manager, body: { version: draft.draft.version, input: sampleAnalysisInput() } });
    expect(save.status).toBe(409);
    expect((await json(save)).error.message).toMatch(/withdrawn/);
    expect((await callRoute(`${F}/revisions`, "POST", p, { cookie: fx.cookies.manager, body: { note: "Issued for check." } })).status).toBe(409);

    const restored = await callRoute(`${F}/withdrawal`, "DELETE", p, { cookie: fx.cookies.manager });
    expect(restored.status).toBe(200);
    expect((await json(restored)).foundation.withdrawnAt).toBeNull();
    expect((await callRoute(F, "GET", p, { cookie: fx.cookies.designer })).status).toBe(200);
    const list = await json(await callRoute(LIST, "GET", { projectId: fx.projectId }, { cookie: fx.cookies.designer }));
    expect(list.foundations.map((x: Loose) => x.tag)).toContain(tag);

    const audit = await getPool().query("SELECT action, detail FROM audit_events WHERE detail->>'foundationId' = $1 AND action LIKE 'foundation.%' ORDER BY created_at", [f.id]);
    expect(audit.rows.map((r) => r.action)).toEqual(["foundation.withdrawn", "foundation.restored"]);
    expect(audit.rows[0].detail.reason).toBe("created twice");
  });
});
