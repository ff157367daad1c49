// Two `next start` processes on the same database (scripts/test.sh starts the second one on
// PLINTH_TEST_APP_URL_2): what one server writes, the other honours. A session signed in on
// one is used and ended on the other; a manager's invitation sent through one server's mail
// queue is read from the other's outbox and accepted there; failed sign-ins counted by one
// server throttle the next attempt on the other. Nothing here lives in a server's memory.
// Then the same two servers behind nginx with the committed deploy/nginx/plinthwise.conf
// (scripts/test.sh starts it on PLINTH_TEST_BALANCER_URL): requests are spread over both,
// and a browser signs in and opens the project through the balancer.
import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD, DEMO_PROJECT_CODE } from "@/modules/platform/demo";
import { appUrl, newContext } from "./support/browser";
import { sharedBrowser } from "./support/fixtures";

// app/_lib/session.ts SESSION_COOKIE (not imported: that module pulls the database client)
const SESSION_COOKIE = "plinth_session";
const serverA = appUrl;
const serverB = process.env.PLINTH_TEST_APP_URL_2 ?? "";
const balancer = process.env.PLINTH_TEST_BALANCER_URL ?? "";
if (!balancer) {
  console.error(
    "\n[two-servers] WARNING: PLINTH_TEST_BALANCER_URL is not set: the tests through nginx DO NOT RUN (scripts/test.sh starts nginx; see its log for why it could not)\n",
  );
}

interface Answer {
  status: number;
  json: Record<string, unknown>;
  cookie: string | null;
}

async function call(base: string, method: string, path: string, opts: { cookie?: string; body?: unknown } = {}): Promise<Answer> {
  const res = await fetch(`${base}${path}`, {
    method,
    headers: {
      "content-type": "application/json",
      origin: base,
      ...(opts.cookie ? { cookie: opts.cookie } : {}),
    },
    body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
  });
  const set = res.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`));
  return { status: res.status, json: ((await res.json().catch(() => ({}))) as Record<string, unknown>) ?? {}, cookie: set ? set.split(";")[0]! : null };
}

async function signIn(base: string, email: string, password: string): Promise<string> {
  const r = await call(base, "POST", "/api/v1/session", { body: { email, password } });
  expect(r.status, `sign-in of ${email} on ${base}`).toBe(200);
  expect(r.cookie).not.toBeNull();
  return r.cookie!;
}

describe("two servers on one database", () => {
  const browser = sharedBrowser();

  it("runs two distinct server processes", async () => {
    expect(serverB, "PLINTH_TEST_APP_URL_2: the second server (scripts/test.sh starts it)").toMatch(/^http:\/\//);
    expect(new URL(serverB).port).not.toBe(new URL(serverA).port);
    for (const base of [serverA, serverB]) expect((await fetch(`${base}/api/health`)).status, base).toBe(200);
  });

  it("a session signed in on one server is used and ended on the other", async () => {
    const cookie = await signIn(serverA, "manager@plinthwise.test", DEMO_PASSWORD);
    const onB = await call(serverB, "GET", "/api/v1/session", { cookie });
    expect(onB.status).toBe(200);
    expect((onB.json.user as { email: string }).email).toBe("manager@plinthwise.test");
    expect((onB.json.projects as { code: string }[]).map((p) => p.code)).toContain(DEMO_PROJECT_CODE);
    // Signed out on B: A refuses the same cookie at once (the session row is revoked, not a server's memory).
    expect((await call(serverB, "DELETE", "/api/v1/session", { cookie })).status).toBe(200);
    expect((await call(serverA, "GET", "/api/v1/session", { cookie })).status).toBe(401);
  });

  it("an invitation queued on one server is read from the other's outbox, accepted there, and its sign-ins throttled across both", async () => {
    const stamp = Date.now();
    const invitee = { email: `two-servers-${stamp}@plinthwise.test`, name: `Two Servers ${stamp}` };
    const manager = await signIn(serverA, "manager@plinthwise.test", DEMO_PASSWORD);
    const me = await call(serverA, "GET", "/api/v1/session", { cookie: manager });
    const project = (me.json.projects as { id: string; code: string }[]).find((p) => p.code === DEMO_PROJECT_CODE);
    expect(project).toBeDefined();

    // The invitation is queued and sent by server B (its mail queue is the outgoing_emails table).
    const invited = await call(serverB, "POST", `/api/v1/projects/${project!.id}/members`, {
      cookie: manager,
      body: { projectId: project!.id, email: invitee.email, name: invitee.name, role: "checker", company: "" },
    });
    expect(invited.status, JSON.stringify(invited.json)).toBe(201);

    // The administrator reads server A's outbox: the message is there, sent once, and the mail server got one copy.
    const admin = await signIn(serverA, "admin@plinthwise.test", DEMO_PASSWORD);
    let link: string | undefined;
    let outbox: { outgoing: { to: string; status: string; subject: string }[]; received: { envelopeTo: string[]; text: string }[] } | undefined;
    for (let attempt = 0; attempt < 20 && !link; attempt++) {
      const r = await call(serverA, "GET", "/api/v1/admin/outbox", { cookie: admin });
      expect(r.status).toBe(200);
      outbox = r.json as unknown as typeof outbox;
      link = outbox!.received.filter((m) => m.envelopeTo.includes(invitee.email)).map((m) => /https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/.exec(m.text)?.[0])[0];
      if (!link) await new Promise((r) => setTimeout(r, 500));
    }
    expect(link, "the invitation link in the mail the fake SMTP server received").toBeDefined();
    const sent = outbox!.outgoing.filter((m) => m.to === invitee.email);
    expect(sent.map((m) => m.status)).toEqual(["sent"]);
    expect(sent[0]!.subject).toBe(`Plinthwise: you are invited to ${DEMO_PROJECT_CODE}`);
    expect(outbox!.received.filter((m) => m.envelopeTo.includes(invitee.email))).toHaveLength(1);

    // The invitee opens the link on server A (the token was made on B) and sets a password.
    const ctx = await newContext(browser());
    const password = `two-servers-pass-${stamp}`;
    try {
      const page = await ctx.newPage();
      await page.goto(`${serverA}${new URL(link!).pathname}`);
      await page.getByLabel("New password").fill(password);
      await page.getByLabel("Repeat it").fill(password);
      await page.getByRole("button", { name: "Set password and open the project" }).click();
      await page.waitForURL((u) => u.pathname === `/projects/${project!.id}`, { timeout: 20_000 });
    } finally {
      await ctx.close();
    }
    // ... and signs in with it on server B.
    await signIn(serverB, invitee.email, password);

    // Five wrong passwords on A cost nothing more (PAIR_FREE_FAILURES); the next attempt on B
    // waits, even with the right password: B counted A's failures from the database.
    for (let i = 0; i < 5; i++) expect((await call(serverA, "POST", "/api/v1/session", { body: { email: invitee.email, password: `wrong-${i}` } })).status).toBe(401);
    const throttled = await call(serverB, "POST", "/api/v1/session", { body: { email: invitee.email, password } });
    expect(throttled.status).toBe(429);
    expect(JSON.stringify(throttled.json)).toMatch(/Too many failed sign-ins/);
    expect(throttled.cookie).toBeNull();
  });
});

describe("two servers behind nginx (deploy/nginx/plinthwise.conf)", () => {
  const browser = sharedBrowser();

  it.skipIf(!balancer)("spreads requests over both servers, and a session signed in through it works whichever answers", async () => {
    const cookie = await signIn(balancer, "designer@plinthwise.test", DEMO_PASSWORD);
    const upstreams = new Set<string>();
    for (let i = 0; i < 8; i++) {
      const res = await fetch(`${balancer}/api/v1/session`, { headers: { cookie } });
      expect(res.status).toBe(200);
      expect(((await res.json()) as { user: { email: string } }).user.email).toBe("designer@plinthwise.test");
      // the runtime copy of the config adds the answering server (scripts/lib/balancer-config.mts)
      upstreams.add(res.headers.get("x-plinthwise-upstream") ?? "none");
    }
    expect([...upstreams].sort()).toEqual([new URL(serverA).host, new URL(serverB).host].sort());
  });

  it.skipIf(!balancer)("a browser signs in with the form on the balancer's address and opens the project, without a script policy violation", async () => {
    const ctx = await browser().newContext({ baseURL: balancer, viewport: { width: 1360, height: 900 } });
    await ctx.addInitScript(() => {
      const w = window as unknown as { __cspViolations: string[] };
      w.__cspViolations = [];
      document.addEventListener("securitypolicyviolation", (e) => w.__cspViolations.push(`${e.violatedDirective} ${e.blockedURI}`));
    });
    try {
      const page = await ctx.newPage();
      await page.goto("/sign-in");
      expect(page.url().startsWith(balancer)).toBe(true);
      await page.getByLabel("E-mail").fill("manager@plinthwise.test");
      await page.getByLabel("Password").fill(DEMO_PASSWORD);
      // the sign-in is a server action: Next compares its Origin with the Host nginx passes on
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"), { timeout: 20_000 });
      // the manager has one project: the desk opens it straight away (app/(desk)/page.tsx)
      await page.waitForURL((u) => /^\/projects\/[0-9a-f-]{36}$/.test(u.pathname), { timeout: 20_000 });
      // the project's own page rendered (its project switcher names the demo project)
      await page.getByRole("heading", { level: 1 }).first().waitFor();
      expect(await page.locator("option", { hasText: DEMO_PROJECT_CODE }).count()).toBeGreaterThan(0);
      expect(await page.evaluate(() => (window as unknown as { __cspViolations: string[] }).__cspViolations)).toEqual([]);
    } finally {
      await ctx.close();
    }
  });
});
