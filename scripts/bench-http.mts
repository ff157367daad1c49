// HTTP part of `npm run bench`: latency and throughput of the production build on
// loopback only, bounded in time. It starts its own `next start` (on the build in
// .next, building it first when missing) against the local database that
// `npm start` set up, signs a session for a demo account directly in the
// database, and drives the endpoints with autocannon.
import autocannon from "autocannon";
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

export interface HttpStats {
  name: string;
  connections: number;
  durationS: number;
  requests: number;
  errors: number;
  non2xx: number;
  /** Answers by status code, e.g. {"200": 430, "503": 1171}. */
  statuses: Record<string, number>;
  throughputRps: number;
  /** Throughput and latency of the 2xx answers only (a quick refusal must not flatter p95). */
  okRps: number;
  okP95Ms: number;
  p50Ms: number;
  p95Ms: number;
  p99Ms: number;
}

export interface HttpTarget {
  name: string;
  method: "GET" | "POST";
  path: string;
  body?: string;
  headers?: Record<string, string>;
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return Number.NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i] as number;
}

/** One bounded autocannon run; latencies are collected per response, so p95 is exact. */
export async function runLoad(baseUrl: string, target: HttpTarget, connections: number, durationS: number): Promise<HttpStats> {
  const latencies: number[] = [];
  const okLatencies: number[] = [];
  const statuses: Record<string, number> = {};
  let non2xx = 0;
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(
      {
        url: `${baseUrl}${target.path}`,
        method: target.method,
        body: target.body,
        headers: { "content-type": "application/json", ...(target.headers ?? {}) },
        connections,
        duration: durationS,
        timeout: 10,
      },
      (err: unknown, res: autocannon.Result) => (err ? reject(err instanceof Error ? err : new Error(String(err))) : resolve(res)),
    );
    instance.on("response", (_client: unknown, statusCode: number, _bytes: number, responseTimeMs: number) => {
      latencies.push(responseTimeMs);
      statuses[String(statusCode)] = (statuses[String(statusCode)] ?? 0) + 1;
      if (statusCode < 200 || statusCode >= 300) non2xx += 1;
      else okLatencies.push(responseTimeMs);
    });
  });
  latencies.sort((a, b) => a - b);
  okLatencies.sort((a, b) => a - b);
  return {
    name: target.name,
    connections,
    durationS,
    requests: latencies.length,
    errors: result.errors + result.timeouts,
    non2xx,
    statuses,
    throughputRps: latencies.length / durationS,
    okRps: okLatencies.length / durationS,
    okP95Ms: percentile(okLatencies, 95),
    p50Ms: percentile(latencies, 50),
    p95Ms: percentile(latencies, 95),
    p99Ms: percentile(latencies, 99),
  };
}

async function waitForHealth(baseUrl: string, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const r = await fetch(`${baseUrl}/api/health`);
      if (r.ok) return true;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

function readLocalSecret(root: string): string | undefined {
  if (process.env.SESSION_SECRET) return process.env.SESSION_SECRET;
  const file = path.join(root, ".env.local");
  if (!existsSync(file)) return undefined;
  return /^SESSION_SECRET=(.+)$/m.exec(readFileSync(file, "utf8"))?.[1];
}

export interface BenchServer {
  baseUrl: string;
  /** How many `next start` processes answer (more than one: through nginx at baseUrl). */
  servers: number;
  cookieFor: (email: string) => Promise<string>;
  stop: () => Promise<void>;
}

function spawnNextStart(root: string, port: number, env: NodeJS.ProcessEnv): ChildProcess {
  return spawn(path.join(root, "node_modules/.bin/next"), ["start", "-H", "localhost", "-p", String(port)], { env, stdio: "ignore", detached: true });
}

export interface BenchServerOptions {
  /** One port per `next start` process; two or more go behind nginx on `balancerPort`. */
  ports?: number[];
  balancerPort?: number;
}

/**
 * Starts the production server(s) for the benchmark, or explains why it cannot. With more
 * than one port, every server runs with TRUST_PROXY=1 and APP_URL at the balancer, and the
 * figures are taken through nginx (scripts/lib/nginx.mts).
 */
export async function startBenchServer(opts: BenchServerOptions = {}): Promise<BenchServer | string> {
  const ports = opts.ports?.length ? opts.ports : [3400];
  const balanced = ports.length > 1;
  const root = process.cwd();
  const secret = readLocalSecret(root);
  if (!secret) return "no SESSION_SECRET (run `npm start` once first)";
  process.env.SESSION_SECRET = secret;
  process.env.DATABASE_URL ??= "postgres://plinthwise@127.0.0.1:54329/plinthwise";
  const { getPublicUser, getUserByEmail } = await import("../db/queries/accounts");
  try {
    await getPublicUser("00000000-0000-0000-0000-000000000000");
  } catch {
    return `the database at ${process.env.DATABASE_URL} is not reachable (run \`npm start\` once first)`;
  }
  if (!existsSync(path.join(root, ".next", "BUILD_ID"))) {
    process.stdout.write("building the production bundle for the HTTP benchmark...\n");
    const b = spawnSync(path.join(root, "node_modules/.bin/next"), ["build"], { stdio: "ignore" });
    if (b.status !== 0) return "next build failed";
  }
  const balancerPort = opts.balancerPort ?? (ports[ports.length - 1] ?? 3400) + 1;
  const baseUrl = `http://127.0.0.1:${balanced ? balancerPort : ports[0]}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    APP_URL: baseUrl,
    SMTP_URL: process.env.SMTP_URL ?? "smtp://127.0.0.1:2525",
    ...(balanced ? { TRUST_PROXY: "1" } : {}),
  };
  const children = ports.map((port) => spawnNextStart(root, port, env));
  const stopChildren = () => {
    for (const c of children) if (c.pid) process.kill(-c.pid, "SIGTERM");
  };
  for (const port of ports) {
    if (!(await waitForHealth(`http://127.0.0.1:${port}`, 60_000))) {
      stopChildren();
      return `the benchmark server on port ${port} did not start`;
    }
  }
  let stopBalancer = () => {};
  if (balanced) {
    const { startBalancer } = await import("./lib/nginx.mts");
    const b = await startBalancer(root, balancerPort, ports.map((p) => `127.0.0.1:${p}`));
    if (typeof b === "string") {
      stopChildren();
      return b;
    }
    stopBalancer = b.stop;
    if (!(await waitForHealth(baseUrl, 10_000))) {
      stopBalancer();
      stopChildren();
      return `nginx on ${baseUrl} does not answer (see ${path.dirname(b.configFile)}/error.log)`;
    }
  }
  const { createSession } = await import("../db/queries/accounts");
  const { sealSessionCookie, SESSION_COOKIE } = await import("../app/_lib/session");
  return {
    baseUrl,
    servers: ports.length,
    cookieFor: async (email: string) => {
      const user = await getUserByEmail(email);
      if (!user) throw new Error(`no account ${email}: seed the demo first`);
      const { id } = await createSession(user.id);
      return `${SESSION_COOKIE}=${encodeURIComponent(await sealSessionCookie(id))}`;
    },
    stop: async () => {
      stopBalancer();
      stopChildren();
      const { closeDb } = await import("../db/client");
      await closeDb();
    },
  };
}

export function formatHttpTable(rows: HttpStats[]): string {
  const head = ["endpoint", "clients", "s", "requests", "req/s", "p50 ms", "p95 ms", "p99 ms", "errors", "non-2xx", "2xx req/s", "2xx p95 ms"];
  const body = rows.map((r) => [
    r.name,
    String(r.connections),
    String(r.durationS),
    String(r.requests),
    r.throughputRps.toFixed(1),
    r.p50Ms.toFixed(1),
    r.p95Ms.toFixed(1),
    r.p99Ms.toFixed(1),
    String(r.errors),
    r.non2xx
      ? `${r.non2xx} (${Object.entries(r.statuses)
          .filter(([code]) => !code.startsWith("2"))
          .map(([code, n]) => `${code}×${n}`)
          .join(" ")})`
      : "0",
    r.okRps.toFixed(1),
    r.okP95Ms.toFixed(1),
  ]);
  const widths = head.map((h, c) => Math.max(h.length, ...body.map((b) => (b[c] ?? "").length)));
  const line = (cells: string[]) => cells.map((cell, c) => (c === 0 ? cell.padEnd(widths[c] ?? 0) : cell.padStart(widths[c] ?? 0))).join("  ");
  return [line(head), ...body.map(line)].join("\n");
}

/** The design-desk figure: POST /api/v1/calculate under 20 concurrent clients for 10 s. */
export async function benchCalculateApi(server: BenchServer, inputFile: string, durationS = 10): Promise<HttpStats> {
  const cookie = await server.cookieFor("designer@plinthwise.test");
  const body = readFileSync(inputFile, "utf8");
  return runLoad(server.baseUrl, { name: "POST /api/v1/calculate", method: "POST", path: "/api/v1/calculate", body, headers: { cookie } }, 20, durationS);
}

async function demoProjectId(): Promise<string> {
  const { DEMO_PROJECT_CODE } = await import("../modules/platform/demo");
  const { getProjectByCode } = await import("../db/queries/projects");
  const project = await getProjectByCode(DEMO_PROJECT_CODE);
  if (!project) throw new Error("the demo project is missing: run `npm start` once first");
  return project.id;
}

/**
 * Sequential server time of the pages: one client, each request sent when the previous one
 * is answered, `durationS` per page: the prerendered sign-in and forgot-password pages and
 * the demo project's page for its manager (rendered per request).
 */
export async function benchSequentialPages(server: BenchServer, durationS = 5): Promise<HttpStats[]> {
  const projectId = await demoProjectId();
  const manager = await server.cookieFor("manager@plinthwise.test");
  const targets: HttpTarget[] = [
    { name: "GET sign-in page (prerendered)", method: "GET", path: "/sign-in" },
    { name: "GET forgot-password page (prerendered)", method: "GET", path: "/forgot-password" },
    { name: "GET project page (HTML, signed in)", method: "GET", path: `/projects/${projectId}`, headers: { cookie: manager } },
  ];
  const rows: HttpStats[] = [];
  for (const t of targets) rows.push(await runLoad(server.baseUrl, t, 1, durationS));
  return rows;
}

/**
 * The reliability figures: sign-in, the project page, the calculation API and a
 * revision's workbook download, each under `connections` clients for `durationS`.
 */
export async function benchLoadSuite(server: BenchServer, inputFile: string, connections = 50, durationS = 30): Promise<HttpStats[]> {
  const { DEMO_PASSWORD, DEMO_PROJECT_CODE } = await import("../modules/platform/demo");
  const { getProjectByCode } = await import("../db/queries/projects");
  const { getDb } = await import("../db/client");
  const { revisions } = await import("../db/schema");
  const { eq } = await import("drizzle-orm");
  const project = await getProjectByCode(DEMO_PROJECT_CODE);
  if (!project) throw new Error("the demo project is missing: run `npm start` once first");
  const revision = (await getDb().select({ id: revisions.id, foundationId: revisions.foundationId }).from(revisions).where(eq(revisions.projectId, project.id)).limit(1))[0];
  const manager = await server.cookieFor("manager@plinthwise.test");
  const designer = await server.cookieFor("designer@plinthwise.test");
  const targets: HttpTarget[] = [
    { name: "GET sign-in page (prerendered)", method: "GET", path: "/sign-in" },
    {
      name: "POST /api/v1/session (sign-in, bcrypt)",
      method: "POST",
      path: "/api/v1/session",
      body: JSON.stringify({ email: "viewer@plinthwise.test", password: DEMO_PASSWORD }),
    },
    { name: "GET project page (HTML)", method: "GET", path: `/projects/${project.id}`, headers: { cookie: manager } },
    { name: "POST /api/v1/calculate", method: "POST", path: "/api/v1/calculate", body: readFileSync(inputFile, "utf8"), headers: { cookie: designer } },
  ];
  if (revision) {
    targets.push({
      name: "GET revision workbook (.xlsx)",
      method: "GET",
      path: `/api/v1/projects/${project.id}/foundations/${revision.foundationId}/revisions/${revision.id}/package`,
      headers: { cookie: manager },
    });
  }
  const rows: HttpStats[] = [];
  for (const t of targets) rows.push(await runLoad(server.baseUrl, t, connections, durationS));
  return rows;
}

/**
 * The heaviest input the contract accepts (INPUT_LIMITS) posted to the calculation API, while
 * /api/health is asked every 25 ms: the time of each analysis and the health latency meanwhile.
 */
export async function benchWorstAcceptedHttp(server: BenchServer, runs = 3): Promise<{ analysisMs: number[]; healthMs: number[]; statuses: number[] }> {
  const { worstAcceptedInput } = await import("../tests/support/limit-inputs");
  const cookie = await server.cookieFor("designer@plinthwise.test");
  const body = JSON.stringify(worstAcceptedInput());
  const analysisMs: number[] = [];
  const healthMs: number[] = [];
  const statuses: number[] = [];
  for (let i = 0; i < runs; i++) {
    let done = false;
    const t0 = performance.now();
    // ?series=full: the heaviest answer as well as the heaviest analysis
    const post = fetch(`${server.baseUrl}/api/v1/calculate?series=full`, { method: "POST", body, headers: { cookie, "content-type": "application/json" } })
      .then(async (r) => {
        await r.arrayBuffer();
        statuses.push(r.status);
        analysisMs.push(performance.now() - t0);
      })
      .finally(() => (done = true));
    while (!done) {
      const h0 = performance.now();
      await (await fetch(`${server.baseUrl}/api/health`)).arrayBuffer();
      healthMs.push(performance.now() - h0);
      await new Promise((r) => setTimeout(r, 25));
    }
    await post;
  }
  return { analysisMs, healthMs, statuses };
}
