// The README's HTTP API table is what integrators read first: every path it lists must be a
// route that exports the methods it names, and the query parameters it documents must be the
// ones the route reads (the comparison once said ?a=&b= while the route wanted from/to).
import { readFileSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { listFoundations } from "@/db/queries/projects";
import { listRevisions } from "@/db/queries/revisions";
import { callRoute, getFixture, makeRequest, type Fixture } from "./support/fixture";

const ROOT = path.resolve(__dirname, "../..");
const API = path.join(ROOT, "app/api");

function routeFiles(dir: string, prefix: string[] = []): string[][] {
  const out: string[][] = [];
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) out.push(...routeFiles(full, [...prefix, name]));
    else if (name === "route.ts") out.push(prefix);
  }
  return out;
}
const ROUTES = routeFiles(API);

/** The route folder a README path names (`:x` stands for any `[param]` folder), or null. */
function findRoute(segments: string[]): string[] | null {
  return (
    ROUTES.find((r) => r.length === segments.length && r.every((s, i) => (segments[i]!.startsWith(":") ? /^\[\w+\]$/.test(s) : s === segments[i]))) ?? null
  );
}

interface Entry {
  methods: string[];
  route: string[];
  query: string[];
  text: string;
}

/** Reads the table's `METHOD path` cells; `.../x` continues the path before it. */
function readmeEntries(): Entry[] {
  const readme = readFileSync(path.join(ROOT, "README.md"), "utf8");
  const table = readme.slice(readme.indexOf("| method and path | who |"));
  const rows = table.split("\n").filter((l) => l.startsWith("| `"));
  const entries: Entry[] = [];
  let last: string[] = [];
  for (const row of rows) {
    const cell = row.split(" | ")[0]!;
    for (const m of cell.matchAll(/`([A-Z/]+) ([^`]+)`/g)) {
      const methods = m[1]!.split("/");
      const [pathPart, queryPart = ""] = m[2]!.split("?");
      const rel = pathPart!.replace(/^\/api\//, "").replace(/^\.\.\.\//, "");
      const relSegs = rel.split("/").filter(Boolean);
      let route: string[] | null = null;
      if (pathPart!.startsWith("/api/")) route = findRoute(relSegs);
      else {
        // Continue the last path: try it, then ever shorter prefixes of it, each joined to the
        // fragment (from the fragment's first segment where the prefix already has it).
        for (let i = last.length; i >= 0 && !route; i--) {
          const prefix = last.slice(0, i);
          const at = prefix.indexOf(relSegs[0]!);
          const joined = at >= 0 ? [...prefix.slice(0, at), ...relSegs] : [...prefix, ...relSegs];
          route = findRoute(joined);
        }
      }
      if (route) last = route;
      const query = queryPart ? queryPart.split("&").map((kv) => kv.split("=")[0]!) : [];
      entries.push({ methods, route: route ?? [], query, text: m[0] });
    }
  }
  return entries;
}

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  await closeDb();
});

describe("the README's API table", () => {
  const entries = readmeEntries();

  it("lists paths that are routes exporting the methods it names", async () => {
    expect(entries.length).toBeGreaterThan(20);
    for (const e of entries) {
      expect(e.route, `${e.text}: no route file`).not.toHaveLength(0);
      const mod = (await import(/* @vite-ignore */ path.join(API, ...e.route, "route.ts"))) as Record<string, unknown>;
      for (const method of e.methods) expect(typeof mod[method], `${e.text}: ${method} not exported`).toBe("function");
    }
  });

  it("documents the comparison's query parameters as the route reads them", async () => {
    const compare = entries.find((e) => e.route.at(-1) === "compare");
    expect(compare?.query.length).toBe(2);
    const foundations = await listFoundations({ userId: fx.userIds.checker, isAdmin: false }, fx.projectId);
    let ids: string[] = [];
    let foundationId = "";
    for (const f of foundations) {
      const revs = await listRevisions({ userId: fx.userIds.checker, isAdmin: false }, fx.projectId, f.id);
      if (revs.length >= 2) {
        ids = revs.map((r) => r.id);
        foundationId = f.id;
        break;
      }
    }
    expect(ids.length).toBeGreaterThanOrEqual(2);
    const [k1, k2] = compare!.query as [string, string];
    const params = { projectId: fx.projectId, foundationId };
    const res = await callRoute(compare!.route.join("/"), "GET", params, { cookie: fx.cookies.checker });
    expect(res.status).toBe(400); // without the parameters
    const mod = (await import(/* @vite-ignore */ path.join(API, ...compare!.route, "route.ts"))) as Record<string, (r: Request, c: unknown) => Promise<Response>>;
    const url = `/api/${compare!.route.join("/")}?${k1}=${ids[1]}&${k2}=${ids[0]}`;
    const ok = await mod.GET!(makeRequest("GET", url, { cookie: fx.cookies.checker }), { params: Promise.resolve(params) });
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { diff: unknown };
    expect(body.diff).toBeTruthy();
  });
});
