// Role matrix: every route handler method and every server action, called with
// every role (anonymous, signed-in outsider, administrator and the five project
// roles). Allowed roles must get through the guard; every other role must be
// refused (401 signed out, 403 otherwise) and see no data.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { actionRegistry } from "@/app/_lib/action";
import { closeDb } from "@/db/client";
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
  });
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
