// Role matrix: every route handler method and every server action, called with
// every role (anonymous, signed-in outsider, administrator and the five project
// roles). Allowed roles must get through the guard; every other role must be
// refused (401 signed out, 403 otherwise) and see no data.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { actionRegistry } from "@/app/_lib/action";
import { inviteMember } from "@/app/_lib/accounts-service";
import { hashPassword } from "@/app/_lib/passwords";
import { inviteMemberAction } from "@/app/(desk)/actions";
import { sendDataRequestAction, submitMachineFormAction } from "@/app/(desk)/projects/[projectId]/requests/actions";
import { closeDb } from "@/db/client";
import { createUser, getUserByEmail } from "@/db/queries/accounts";
import { getMembership } from "@/db/queries/projects";
import { demoRequest } from "./matrix/vendor";
import { callAction, callRoute, cookieFor, getFixture, matrixRoles, type Fixture } from "./support/fixture";
import type { ActionCase, RouteCase } from "./support/matrix-types";

const root = process.cwd();

function walk(dir: string, match: (f: string) => boolean, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) walk(full, match, out);
    else if (match(name)) out.push(full);
  }
  return out;
}

const methods = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

async function loadCases(): Promise<{ routes: RouteCase[]; actions: ActionCase[] }> {
  const routes: RouteCase[] = [];
  const actions: ActionCase[] = [];
  for (const file of walk(path.join(root, "tests/integration/matrix"), (f) => f.endsWith(".ts"))) {
    const mod = (await import(/* @vite-ignore */ file)) as { routeCases?: RouteCase[]; actionCases?: ActionCase[] };
    routes.push(...(mod.routeCases ?? []));
    actions.push(...(mod.actionCases ?? []));
  }
  return { routes, actions };
}

let fx: Fixture;
let cases: { routes: RouteCase[]; actions: ActionCase[] };

beforeAll(async () => {
  fx = await getFixture();
  cases = await loadCases();
  // Load every actions module so the registry lists every action that exists.
  for (const file of walk(path.join(root, "app"), (f) => f === "actions.ts")) await import(/* @vite-ignore */ file);
});

afterAll(async () => {
  await closeDb();
});

describe("the matrix covers everything that exists", () => {
  it("has a row for every exported method of every route handler", async () => {
    const missing: string[] = [];
    for (const file of walk(path.join(root, "app/api"), (f) => f === "route.ts")) {
      const route = path.relative(path.join(root, "app/api"), path.dirname(file)).split(path.sep).join("/");
      const source = readFileSync(file, "utf8");
      for (const m of methods) {
        if (new RegExp(`export const ${m}\\b|export async function ${m}\\b`).test(source) && !cases.routes.some((c) => c.route === route && c.method === m)) {
          missing.push(`${m} ${route}`);
        }
      }
    }
    expect(missing, `routes without a role-matrix row: ${missing.join(", ")}`).toEqual([]);
    expect(cases.routes.length).toBeGreaterThanOrEqual(11);
  });

  it("has a row for every server action registered with defineAction", () => {
    const names = [...actionRegistry.keys()];
    expect(names.length).toBeGreaterThanOrEqual(9);
    const missing = names.filter((n) => !cases.actions.some((c) => c.name === n));
    expect(missing, `actions without a role-matrix row: ${missing.join(", ")}`).toEqual([]);
  });
});

describe("route handlers", () => {
  it.each(methods.flatMap((m) => [m]))("%s rows all behave as the permission map says", async (method) => {
    const problems: string[] = [];
    for (const c of cases.routes.filter((r) => r.method === method)) {
      for (const role of matrixRoles) {
        const { params, body } = await c.request(fx, role);
        const userId = role === "anonymous" ? null : fx.userIds[role];
        const cookie = c.freshSession && userId ? await cookieFor(userId) : fx.cookies[role];
        const res = await callRoute(c.route, c.method, params, { cookie, body });
        const allowed = c.allowed.includes(role);
        const text = await res.text();
        if (allowed && (res.status === 401 || res.status === 403 || res.status >= 500)) problems.push(`${role} ${method} ${c.route}: expected allowed, got ${res.status} ${text.slice(0, 120)}`);
        if (!allowed) {
          const expected = role === "anonymous" ? 401 : 403;
          if (res.status !== expected) problems.push(`${role} ${method} ${c.route}: expected ${expected}, got ${res.status}`);
          // A refusal carries an error and never the data.
          if (!/"error"/.test(text) || /"(members|foundations|project|outgoing)"/.test(text)) problems.push(`${role} ${method} ${c.route}: refusal body leaks: ${text.slice(0, 120)}`);
        }
      }
    }
    expect(problems).toEqual([]);
    // Each row runs for eight roles, and the package rows build real workbooks and PDFs
    // (a second or two each on a shared machine): more time than one ordinary test.
  }, 240_000);
});

describe("server actions", () => {
  it("every action allows exactly the roles in its row", async () => {
    const problems: string[] = [];
    for (const c of cases.actions) {
      for (const role of matrixRoles) {
        const userId = role === "anonymous" ? null : fx.userIds[role];
        const cookie = c.freshSession && userId ? await cookieFor(userId) : fx.cookies[role];
        const { state } = await callAction(c.action, await c.fields(fx, role), cookie);
        const allowed = c.allowed.includes(role);
        const refused = !state.ok && (state.code === "unauthenticated" || state.code === "forbidden");
        if (allowed && (refused || (!state.ok && state.code === "internal"))) problems.push(`${role} ${c.name}: expected allowed, got ${JSON.stringify(state)}`);
        if (!allowed && !refused) problems.push(`${role} ${c.name}: expected refusal, got ${JSON.stringify(state).slice(0, 160)}`);
      }
    }
    expect(problems).toEqual([]);
  });
});

// Issue 19, item 2: a data request's "new contact" once added any existing account as a
// vendor of any typed company, so a designer could hand an outsider Corvane Pumps' data.
// Only managers add members, through inviteMember and its one members.manage check.
describe("members are added by managers only, through the invitation", () => {
  const outsiderEmail = "outsider@elsewhere.test";
  const outsiderMembership = () => getMembership({ userId: fx.userIds.outsider, isAdmin: false }, fx.projectId);

  it("a designer cannot add a member by any path: the invite action, the members API, a data request or the service itself", async () => {
    const asVendorOfCorvane = { projectId: fx.projectId, email: outsiderEmail, name: "Olu Outsider", role: "vendor", company: "Corvane Pumps" };
    const invited = await callAction(inviteMemberAction, asVendorOfCorvane, fx.cookies.designer);
    expect(invited.state.ok ? "allowed" : invited.state.code).toBe("forbidden");

    const posted = await callRoute("v1/projects/[projectId]/members", "POST", { projectId: fx.projectId }, { cookie: fx.cookies.designer, body: asVendorOfCorvane });
    expect(posted.status).toBe(403);

    const foundationId = fx.foundationIds[0] ?? "";
    const request = { projectId: fx.projectId, foundationId, contact: "new", newEmail: outsiderEmail, newName: "Olu Outsider", newCompany: "Corvane Pumps", machineNames: "Raw-water pump" };
    const sent = await callAction(sendDataRequestAction, request, fx.cookies.designer);
    expect(sent.state.ok ? "allowed" : sent.state.code).toBe("forbidden");
    if (!sent.state.ok) expect(sent.state.message).toMatch(/manager/);

    // A brand-new address is no different: no account is made a member.
    const freshEmail = `designer-adds-${Date.now()}@elsewhere.test`;
    const fresh = await callAction(sendDataRequestAction, { ...request, newEmail: freshEmail, newName: "Nobody Yet" }, fx.cookies.designer);
    expect(fresh.state.ok ? "allowed" : fresh.state.code).toBe("forbidden");
    const freshUser = await getUserByEmail(freshEmail);
    if (freshUser) expect(await getMembership({ userId: freshUser.id, isAdmin: false }, fx.projectId)).toBeUndefined();

    // Picking a non-member as if they were a vendor contact is refused as well.
    const picked = await callAction(sendDataRequestAction, { ...request, contact: `member:${fx.userIds.outsider}` }, fx.cookies.designer);
    expect(picked.state.ok).toBe(false);

    await expect(inviteMember({ userId: fx.userIds.designer, isAdmin: false }, { projectId: fx.projectId, email: outsiderEmail, name: "Olu Outsider", role: "vendor", company: "Corvane Pumps" })).rejects.toMatchObject({ code: "forbidden" });
    expect(await outsiderMembership()).toBeUndefined();
  });

  it("an outsider is never given vendor access by a data request: Corvane's request, submissions and files stay closed to them", async () => {
    const d = await demoRequest(fx);
    await callAction(
      sendDataRequestAction,
      { projectId: fx.projectId, foundationId: fx.foundationIds[0] ?? "", contact: "new", newEmail: outsiderEmail, newName: "Olu Outsider", newCompany: "Corvane Pumps", machineNames: "Raw-water pump" },
      fx.cookies.designer,
    );
    expect(await outsiderMembership()).toBeUndefined();
    const params = { projectId: d.projectId, requestId: d.requestId };
    const reads = [
      await callRoute("v1/projects/[projectId]/requests", "GET", { projectId: d.projectId }, { cookie: fx.cookies.outsider }),
      await callRoute("v1/projects/[projectId]/requests/[requestId]", "GET", params, { cookie: fx.cookies.outsider }),
      await callRoute("v1/projects/[projectId]/files/[fileId]", "GET", { projectId: d.projectId, fileId: d.latestFileId }, { cookie: fx.cookies.outsider }),
    ];
    expect(reads.map((r) => r.status)).toEqual([403, 403, 403]);
    const submitted = await callAction(submitMachineFormAction, { projectId: d.projectId, requestId: d.requestId, machines: "[]" }, fx.cookies.outsider);
    expect(submitted.state.ok ? "allowed" : submitted.state.code).toBe("forbidden");
  });

  it("a vendor of company B cannot read company A's requests, submissions or files, nor submit as A", async () => {
    const d = await demoRequest(fx);
    const email = `vendor-b-${Date.now()}@other-machines.test`;
    const user = await createUser({ email, name: "Bea Other", passwordHash: await hashPassword("a-long-password-1") });
    const added = await callAction(inviteMemberAction, { projectId: fx.projectId, email, name: "Bea Other", role: "vendor", company: `Other Machines ${Date.now()}` }, fx.cookies.manager);
    expect(added.state.ok).toBe(true);
    const cookie = await cookieFor(user.id);
    const list = await callRoute("v1/projects/[projectId]/requests", "GET", { projectId: d.projectId }, { cookie });
    expect(list.status).toBe(200);
    const listed = await list.text();
    expect(listed).not.toContain(d.requestId);
    expect(listed).not.toContain("Corvane");
    const params = { projectId: d.projectId, requestId: d.requestId };
    const closed = [
      await callRoute("v1/projects/[projectId]/requests/[requestId]", "GET", params, { cookie }),
      await callRoute("v1/projects/[projectId]/requests/[requestId]/workbook", "GET", params, { cookie }),
      await callRoute("v1/projects/[projectId]/files/[fileId]", "GET", { projectId: d.projectId, fileId: d.latestFileId }, { cookie }),
    ];
    for (const res of closed) {
      expect([403, 404]).toContain(res.status);
      expect(await res.text()).not.toContain("Corvane");
    }
    const submitted = await callAction(submitMachineFormAction, { projectId: d.projectId, requestId: d.requestId, machines: "[]" }, cookie);
    expect(submitted.state.ok).toBe(false);
    if (!submitted.state.ok) expect(["not_found", "forbidden"]).toContain(submitted.state.code);
  });
});
