// A project always keeps a manager: a role change by re-invitation goes through the same
// last-manager rule as removal (db/queries/projects.ts, assertAnotherManagerRemains).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inviteMemberAction, removeMemberAction } from "@/app/(desk)/actions";
import { hashPassword } from "@/app/_lib/passwords";
import { closeDb } from "@/db/client";
import { createUser } from "@/db/queries/accounts";
import { createProject, getMembership, listMembers, upsertMember } from "@/db/queries/projects";
import { callAction, callRoute, cookieFor } from "./support/fixture";

afterAll(async () => {
  await closeDb();
});

const stamp = `${Date.now().toString(36)}`;
let projectId: string;
const first = { id: "", email: `mgr-one-${stamp}@example.test`, cookie: "" };
const second = { id: "", email: `mgr-two-${stamp}@example.test`, cookie: "" };

beforeAll(async () => {
  const a = await createUser({ email: first.email, name: "Mara One", passwordHash: await hashPassword("a-long-password-1") });
  const b = await createUser({ email: second.email, name: "Milo Two", passwordHash: await hashPassword("a-long-password-1") });
  first.id = a.id;
  second.id = b.id;
  first.cookie = await cookieFor(a.id);
  second.cookie = await cookieFor(b.id);
  const project = await createProject({ userId: a.id, isAdmin: false }, { code: `LM-${stamp}`.slice(0, 24), name: "Last manager", client: "", site: "", units: "si" });
  projectId = project.id;
});

const roleOf = async (userId: string) => (await getMembership({ userId, isAdmin: false }, projectId))?.role;

describe("the last manager keeps the role", () => {
  it("refuses to re-invite the only manager as designer, by the action and by the API, and changes nothing", async () => {
    const { state } = await callAction(inviteMemberAction, { projectId, email: first.email, name: "Mara One", role: "designer" }, first.cookie);
    expect(state.ok).toBe(false);
    if (state.ok) return;
    expect(state.code).toBe("conflict");
    expect(state.message).toMatch(/keeps at least one manager/);

    const res = await callRoute("v1/projects/[projectId]/members", "POST", { projectId }, { cookie: first.cookie, body: { projectId, email: first.email, name: "Mara One", role: "viewer" } });
    expect(res.status).toBe(409);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("conflict");
    expect(await roleOf(first.id)).toBe("manager");
  });

  it("refuses to remove the only manager (the same rule)", async () => {
    const memberId = (await listMembers({ userId: first.id, isAdmin: false }, projectId)).find((m) => m.userId === first.id)?.memberId ?? "";
    const { state } = await callAction(removeMemberAction, { projectId, memberId }, first.cookie);
    expect(state.ok).toBe(false);
    if (!state.ok) expect(state.code).toBe("conflict");
    expect(await roleOf(first.id)).toBe("manager");
  });

  it("with two managers, re-inviting one as designer works; the other is then the last and keeps the role", async () => {
    const added = await callAction(inviteMemberAction, { projectId, email: second.email, name: "Milo Two", role: "manager" }, first.cookie);
    expect(added.state.ok).toBe(true);
    expect(await roleOf(second.id)).toBe("manager");

    const demoted = await callAction(inviteMemberAction, { projectId, email: first.email, name: "Mara One", role: "designer" }, second.cookie);
    expect(demoted.state.ok).toBe(true);
    expect(await roleOf(first.id)).toBe("designer");

    const res = await callRoute("v1/projects/[projectId]/members", "POST", { projectId }, { cookie: second.cookie, body: { projectId, email: second.email, name: "Milo Two", role: "checker" } });
    expect(res.status).toBe(409);
    expect(await roleOf(second.id)).toBe("manager");
  });

  it("of two racing demotions of the two managers, exactly one goes through", async () => {
    // Back to two managers, then each demotes the other at the same time.
    expect((await callAction(inviteMemberAction, { projectId, email: first.email, name: "Mara One", role: "manager" }, second.cookie)).state.ok).toBe(true);
    const [x, y] = await Promise.all([
      callAction(inviteMemberAction, { projectId, email: second.email, name: "Milo Two", role: "viewer" }, first.cookie),
      callAction(inviteMemberAction, { projectId, email: first.email, name: "Mara One", role: "viewer" }, second.cookie),
    ]);
    const oks = [x.state.ok, y.state.ok].filter(Boolean).length;
    expect(oks).toBe(1);
    const roles = [await roleOf(first.id), await roleOf(second.id)];
    expect(roles.filter((r) => r === "manager")).toHaveLength(1);
  });
});

describe("removal takes effect at once", () => {
  it("a removed member's next request with the same cookie is refused (membership is read on every request, only the cookie's unsealing is remembered)", async () => {
    const s2 = `${stamp}-rm`;
    const mgr = await createUser({ email: `rm-mgr-${s2}@example.test`, name: "Rhea Manager", passwordHash: await hashPassword("a-long-password-1") });
    const des = await createUser({ email: `rm-des-${s2}@example.test`, name: "Dov Designer", passwordHash: await hashPassword("a-long-password-1") });
    const project = await createProject({ userId: mgr.id, isAdmin: false }, { code: `RM-${s2}`.slice(0, 24), name: "Removal", client: "", site: "", units: "si" });
    const memberId = await upsertMember({ projectId: project.id, userId: des.id, role: "designer" });
    const mgrCookie = await cookieFor(mgr.id);
    const desCookie = await cookieFor(des.id);
    // twice, so this server has unsealed and remembered the designer's cookie
    expect((await callRoute("v1/projects/[projectId]", "GET", { projectId: project.id }, { cookie: desCookie })).status).toBe(200);
    expect((await callRoute("v1/projects/[projectId]", "GET", { projectId: project.id }, { cookie: desCookie })).status).toBe(200);
    const removed = await callAction(removeMemberAction, { projectId: project.id, memberId }, mgrCookie);
    expect(removed.state.ok).toBe(true);
    expect((await callRoute("v1/projects/[projectId]", "GET", { projectId: project.id }, { cookie: desCookie })).status).toBe(403);
    expect((await callRoute("v1/projects/[projectId]/foundations", "GET", { projectId: project.id }, { cookie: desCookie })).status).toBe(403);
    // still signed in: only the project is gone
    expect((await callRoute("v1/session", "GET", {}, { cookie: desCookie })).status).toBe(200);
  });
});
