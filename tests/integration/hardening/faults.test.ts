// Faults. (a) The mail server down: the action that e-mails still succeeds, its message
// waits in outgoing_emails as "queued" with the error, and once the server is back the
// queue flush delivers it and the outbox shows it "sent". (b) PostgreSQL restarted while
// 40 clients keep requests in flight: every request settles (no hung promise) with an
// answer or a JSON error, the pool recovers by itself, and no draft save is half-written.
import { execFile } from "node:child_process";
import net from "node:net";
import { promisify } from "node:util";
import nodemailer, { type Transporter } from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getPool } from "@/db/client";
import { createUser } from "@/db/queries/accounts";
import { getServerEnv } from "@/modules/platform/env";
import { parseAnalysisInput } from "@/modules/calc";
import { forgotPasswordAction } from "@/app/(auth)/actions";
import { flushEmailQueue } from "@/app/_lib/mailer";
import { callAction, freshPeer, getFixture, waitForEmail, type Fixture } from "../support/fixture";
import { resetMailIdle } from "@/app/_lib/reset-mail";
import { callRouteAt, errorOf, Tally, TimedOut, within } from "../support/hardening-helpers";
import { createHardeningProject, type HardeningProject } from "../support/hardening-project";
import { sampleAnalysisInput } from "../analysis-input-sample";

const run = promisify(execFile);
const mailHolder = globalThis as unknown as { __plinthMailer?: Transporter };

let fx: Fixture;
let hx: HardeningProject;
const figures: string[] = [];

beforeAll(async () => {
  fx = await getFixture();
  hx = await createHardeningProject({ userId: fx.userIds.manager, isAdmin: false }, "FT");
});

afterAll(async () => {
  console.log(`[hardening] fault figures:\n  ${figures.join("\n  ")}`);
  await closeDb();
});

/** A loopback port nothing listens on. */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const port = (server.address() as net.AddressInfo).port;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe("the mail server down", () => {
  it("the reset request succeeds, the mail waits as queued with the error, and is sent and shown as sent once the server is back", async () => {
    const email = `hx-mail-${Date.now()}@example.test`;
    await createUser({ email, name: "Mae Mail" });
    const port = await closedPort();
    const saved = mailHolder.__plinthMailer;
    mailHolder.__plinthMailer = nodemailer.createTransport(`smtp://127.0.0.1:${port}?connectionTimeout=2000&greetingTimeout=2000&socketTimeout=2000`);
    let state;
    let actionMs = 0;
    const t0 = performance.now();
    try {
      ({ state } = await callAction(forgotPasswordAction, { email }, null, freshPeer()));
      actionMs = Math.round(performance.now() - t0);
      // The mail goes out after the answer (app/_lib/reset-mail.ts): let that try fail too.
      await resetMailIdle();
    } finally {
      // Back to the real (fake) server: the cached transport is rebuilt from SMTP_URL.
      mailHolder.__plinthMailer = saved;
    }
    expect(state).toMatchObject({ ok: true });
    const queued = await getPool().query<{ id: string; status: string; attempts: number; last_error: string | null }>(
      "SELECT id, status, attempts, last_error FROM outgoing_emails WHERE \"to\" = $1",
      [email],
    );
    expect(queued.rows).toHaveLength(1);
    const row = queued.rows[0]!;
    expect(row).toMatchObject({ status: "queued", attempts: 1 });
    expect(row.last_error).toMatch(/ECONNREFUSED|connect/i);

    const sent = await flushEmailQueue();
    expect(sent).toBeGreaterThanOrEqual(1);
    const mail = await waitForEmail(email, "reset your password");
    expect(mail.text).toMatch(/\/reset\/[A-Za-z0-9_-]{20,}/);
    const outbox = await callRouteAt("v1/admin/outbox", "GET", {}, { cookie: fx.cookies.admin });
    expect(outbox.status).toBe(200);
    const body = (await outbox.json()) as { outgoing: { id: string; to: string; status: string; attempts: number; lastError: string | null }[] };
    expect(body.outgoing.find((o) => o.id === row.id)).toMatchObject({ to: email, status: "sent", attempts: 1, lastError: null });
    figures.push(`mail outage: action answered ok in ${actionMs} ms with the server down; queued after 1 failed attempt; sent by flushEmailQueue (${sent} sent); outbox shows "sent"`);
  });
});

/** The local cluster on PLINTH_PG_PORT (scripts/lib/pg.sh), not a server given by TEST_DATABASE_URL. */
function localCluster(): { local: boolean; why: string } {
  const url = new URL(getServerEnv().DATABASE_URL);
  // The port of the local cluster is scripts/lib/pg.sh's setting, not the app's, so it is read here.
  const port = process.env.PLINTH_PG_PORT ?? "54329";
  const local = ["127.0.0.1", "localhost", "[::1]"].includes(url.hostname) && (url.port || "5432") === port;
  return { local, why: `DATABASE_URL is ${url.hostname}:${url.port || "5432"}, not the local cluster on 127.0.0.1:${port}` };
}

const cluster = localCluster();
if (!cluster.local) console.warn(`[hardening] skipping the PostgreSQL restart test: ${cluster.why} (a remote server is never restarted)`);

describe("PostgreSQL restarted while requests are in flight", () => {
  it.skipIf(!cluster.local)("every request settles cleanly, the pool recovers by itself, and no save is half-written", async () => {
    const params = { projectId: hx.projectId, foundationId: hx.foundationId };
    const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";
    const reads = ["v1/projects/[projectId]", "v1/projects/[projectId]/foundations", DRAFT];
    const outcome = new Tally();
    const saves: { version: number; shearModulus: number }[] = [];
    const attempted = new Set<number>();
    let marker = 0;
    let stopAt = Number.POSITIVE_INFINITY;
    let restartMs = 0;
    let restartEnd = 0;
    let firstOkAfterRestart: number | undefined;
    let lastErrorAfterRestart = 0;

    const settle = async (what: string, call: () => Promise<Response>): Promise<Response | null> => {
      try {
        const res = await within(call(), 20_000);
        const sinceRestart = restartEnd ? performance.now() - restartEnd : undefined;
        if (sinceRestart !== undefined && res.status < 300) firstOkAfterRestart ??= Math.round(sinceRestart);
        if (sinceRestart !== undefined && res.status >= 500) lastErrorAfterRestart = Math.max(lastErrorAfterRestart, Math.round(sinceRestart));
        if (res.status >= 400 && res.status !== 409) {
          const err = await errorOf(res.clone());
          expect(err, `${what}: ${res.status} without a JSON error`).not.toBeNull();
          outcome.add(`${res.status} ${err?.code}`);
        } else outcome.add(res.status);
        return res;
      } catch (e) {
        outcome.add(e instanceof TimedOut ? "hung" : "threw");
        return null;
      }
    };

    const reader = async (i: number) => {
      while (performance.now() < stopAt) {
        const route = reads[i % reads.length]!;
        await settle(`GET ${route}`, () => callRouteAt(route, "GET", params, { cookie: fx.cookies.manager }));
      }
    };
    const writer = async () => {
      while (performance.now() < stopAt) {
        const current = await settle("GET draft", () => callRouteAt(DRAFT, "GET", params, { cookie: fx.cookies.manager }));
        if (!current || current.status !== 200) continue;
        const { draft } = (await current.json()) as { draft: { version: number } };
        const input = sampleAnalysisInput();
        marker += 1;
        const shearModulus = 4.0e7 + marker * 1000;
        input.soil.shearModulus = shearModulus;
        attempted.add(shearModulus);
        const res = await settle("PUT draft", () => callRouteAt(DRAFT, "PUT", params, { cookie: fx.cookies.manager, body: { version: draft.version, input } }));
        if (res?.status === 200) {
          const saved = (await res.json()) as { draft: { version: number; input: { soil: { shearModulus: number } } } };
          saves.push({ version: saved.draft.version, shearModulus: saved.draft.input.soil.shearModulus });
        }
      }
    };

    await getPool().query("SELECT 1");
    const start = (await getPool().query<{ version: number }>("SELECT version FROM foundation_drafts WHERE foundation_id = $1", [hx.foundationId])).rows[0]?.version ?? 0;
    const t0 = performance.now();
    // 40 clients: 30 readers, 10 writers, until 1.5 s after the restart has finished.
    const clients = [...Array.from({ length: 30 }, (_, i) => reader(i)), ...Array.from({ length: 10 }, () => writer())];
    const restart = (async () => {
      await new Promise((r) => setTimeout(r, 400));
      const r0 = performance.now();
      await run("bash", ["scripts/lib/pg.sh", "restart"], { timeout: 90_000 });
      restartMs = Math.round(performance.now() - r0);
      restartEnd = performance.now();
      stopAt = restartEnd + 1500;
    })();
    await Promise.all([restart, ...clients]);
    const burstMs = Math.round(performance.now() - t0);

    // Recovery: the pool replaces its dropped connections itself; time to the first good answers.
    const r0 = performance.now();
    let recovered = false;
    const seen: string[] = [];
    const poolState = () => `pool total ${getPool().totalCount}, idle ${getPool().idleCount}, waiting ${getPool().waitingCount}`;
    seen.push(poolState());
    while (performance.now() - r0 < 10_000) {
      const res = await within(callRouteAt("v1/projects/[projectId]", "GET", params, { cookie: fx.cookies.manager }), 3_000).catch((e: unknown) => String(e));
      if (typeof res !== "string" && res.status === 200) {
        recovered = true;
        break;
      }
      seen.push(typeof res === "string" ? res : `${res.status}`);
      await new Promise((r) => setTimeout(r, 100));
    }
    const recoveryMs = Math.round(performance.now() - r0);
    expect(firstOkAfterRestart, "no request succeeded in the 1.5 s after the restart").toBeDefined();
    expect(firstOkAfterRestart!).toBeLessThan(1500);
    expect(recovered, `the app did not recover within 10 s: ${seen.join("; ")}; ${poolState()}; burst ${outcome}`).toBe(true);
    const after = await Promise.all(Array.from({ length: 20 }, (_, i) => callRouteAt(reads[i % reads.length]!, "GET", params, { cookie: fx.cookies.manager })));
    expect(after.map((r) => r.status)).toEqual(Array.from({ length: 20 }, () => 200));

    expect(outcome.keys().filter((k) => k === "hung" || k === "threw"), `outcomes ${outcome}`).toEqual([]);
    expect(outcome.keys().some((k) => k.startsWith("5")), `no request met the restart: ${outcome}`).toBe(true);
    expect(saves.length, `no save succeeded: ${outcome}`).toBeGreaterThan(0);
    for (const k of outcome.keys()) expect(["200", "409", "503 unavailable"], `outcomes ${outcome}`).toContain(k);

    // Nothing half-written: each reported save has its own version, the stored draft is one
    // whole input that was sent, and its version is the last reported one, or one more when
    // a save committed but its answer was lost to the restart (its content is then stored).
    const versions = saves.map((s) => s.version);
    expect(new Set(versions).size).toBe(versions.length);
    const stored = (await getPool().query<{ version: number; input: unknown }>("SELECT version, input FROM foundation_drafts WHERE foundation_id = $1", [hx.foundationId])).rows[0];
    expect(stored).toBeDefined();
    expect(parseAnalysisInput(stored!.input).ok).toBe(true);
    const storedG = (stored!.input as { soil: { shearModulus: number } }).soil.shearModulus;
    const last = saves.reduce((m, s) => (s.version > m.version ? s : m), { version: start, shearModulus: Number.NaN });
    expect(stored!.version).toBeGreaterThanOrEqual(last.version);
    if (stored!.version === last.version) expect(storedG).toBe(last.shearModulus);
    else {
      expect(stored!.version - last.version).toBeLessThanOrEqual(10);
      expect(attempted.has(storedG)).toBe(true);
    }
    for (const s of saves) expect(attempted.has(s.shearModulus)).toBe(true);
    figures.push(
      `PostgreSQL restart: 40 clients for ${burstMs} ms, pg_ctl restart took ${restartMs} ms; ${outcome.total} requests: ${outcome}; ` +
        `once pg_ctl returned: first good answer after ${firstOkAfterRestart} ms, last 5xx after ${lastErrorAfterRestart} ms; after the burst: first probe ok in ${recoveryMs} ms, then 20/20 ok; ${saves.length} saves reported, draft version ${start} -> ${stored!.version}`,
    );
  }, 120_000);

  it.skipIf(!cluster.local)("the fake SMTP server recovered from the restart too: mail still arrives", async () => {
    const email = `hx-after-restart-${Date.now()}@example.test`;
    await createUser({ email, name: "Rhea Restart" });
    const { state } = await callAction(forgotPasswordAction, { email }, null, freshPeer());
    expect(state).toMatchObject({ ok: true });
    await waitForEmail(email, "reset your password", 15_000);
  }, 30_000);
});
