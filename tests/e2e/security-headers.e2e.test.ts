// Security headers on the production build: a script policy by per-request nonce, or by the
// SHA-256 of each inline script on the two prerendered pages (no 'unsafe-inline' either way),
// applied so that sign-in, forgot password, the project page and the workspace run without
// a single policy violation; Permissions-Policy; no HSTS over http; private JSON; and a
// foreign-origin or oversize server action answered 403 / 413 instead of Next's 500.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { appUrl, launchBrowser, newContext, SignInPage } from "./support/browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser.close();
});

describe("security headers", () => {
  it("pages and API answers carry CSP (no unsafe-eval), frame-ancestors none, nosniff and a referrer policy", async () => {
    for (const path of ["/sign-in", "/api/health"]) {
      const res = await fetch(`${appUrl}${path}`);
      const csp = res.headers.get("content-security-policy") ?? "";
      expect(csp, path).toContain("default-src 'self'");
      expect(csp, path).toContain("frame-ancestors 'none'");
      expect(csp, path).not.toContain("unsafe-eval");
      expect(res.headers.get("x-content-type-options")).toBe("nosniff");
      expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
      expect(res.headers.get("x-powered-by")).toBeNull();
    }
  });

  it("a page rendered per request: its script policy has a fresh nonce and 'strict-dynamic', no 'unsafe-inline', and every script carries the nonce", async () => {
    const nonces: string[] = [];
    // the one-time-link pages render per request without a session (an unknown link shows "no longer works")
    for (const path of ["/reset/no-such-link-0000000000", "/invite/no-such-link-0000000000", "/reset/no-such-link-0000000000"]) {
      const res = await fetch(`${appUrl}${path}`);
      expect(res.status, path).toBe(200);
      const csp = res.headers.get("content-security-policy") ?? "";
      const scriptSrc = csp.split(/;\s*/).find((d) => d.startsWith("script-src ")) ?? "";
      expect(scriptSrc, path).toMatch(/'strict-dynamic'/);
      expect(scriptSrc, path).not.toContain("unsafe-inline");
      expect(scriptSrc, path).not.toContain("sha256-");
      const nonce = /'nonce-([^']+)'/.exec(scriptSrc)?.[1];
      expect(nonce, path).toBeTruthy();
      nonces.push(nonce!);
      const html = await res.text();
      const scripts = html.match(/<script\b[^>]*>/g) ?? [];
      expect(scripts.length, path).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag, path).toContain(`nonce="${nonce}"`);
    }
    expect(new Set(nonces).size).toBe(nonces.length);
  });

  it("a prerendered page (sign-in, forgot password): its script policy names each inline script by SHA-256, no nonce, no 'unsafe-inline'; external scripts are the build's own chunks", async () => {
    for (const path of ["/sign-in", "/forgot-password"]) {
      const res = await fetch(`${appUrl}${path}`);
      expect(res.status, path).toBe(200);
      const csp = res.headers.get("content-security-policy") ?? "";
      const scriptSrc = csp.split(/;\s*/).find((d) => d.startsWith("script-src ")) ?? "";
      const sources = scriptSrc.split(/\s+/).slice(1);
      expect(sources[0], path).toBe("'self'");
      // nothing but 'self' and hashes: no nonce, no 'unsafe-inline', no host, no scheme
      for (const s of sources.slice(1)) expect(s, path).toMatch(/^'sha256-[A-Za-z0-9+/]{43}='$/);
      const html = await res.text();
      const inline = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)].filter((m) => !/\ssrc=/.test(m[1] ?? ""));
      expect(inline.length, path).toBeGreaterThan(0);
      // hashed here independently with WebCrypto: each inline script's exact text is listed
      for (const m of inline) {
        const digest = Buffer.from(await crypto.subtle.digest("SHA-256", new TextEncoder().encode(m[2] ?? ""))).toString("base64");
        expect(sources, path).toContain(`'sha256-${digest}'`);
      }
      for (const [, src] of html.matchAll(/<script\b[^>]*\ssrc="([^"]+)"/g)) expect(src, path).toMatch(/^\/_next\/static\/chunks\/[A-Za-z0-9_.~-]+\.js$/);
      // the served HTML is the build's file, not a render: the same bytes twice
      expect(await (await fetch(`${appUrl}${path}`)).text(), path).toBe(html);
    }
  });

  it("sends a Permissions-Policy that denies devices and sensors, and no HSTS over http", async () => {
    for (const path of ["/sign-in", "/api/health"]) {
      const res = await fetch(`${appUrl}${path}`);
      const pp = res.headers.get("permissions-policy") ?? "";
      for (const feature of ["camera=()", "microphone=()", "geolocation=()", "payment=()", "usb=()"]) expect(pp, path).toContain(feature);
      expect(res.headers.get("strict-transport-security"), path).toBeNull();
    }
    // A client's own X-Forwarded-Proto does not switch HSTS on (no trusted proxy here).
    const spoofed = await fetch(`${appUrl}/sign-in`, { headers: { "x-forwarded-proto": "https" } });
    expect(spoofed.headers.get("strict-transport-security")).toBeNull();
  });

  it("a cross-site POST to the API is refused", async () => {
    const res = await fetch(`${appUrl}/api/v1/session`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: "https://evil.example" },
      body: JSON.stringify({ email: "designer@plinthwise.test", password: "plinth-demo-2026" }),
    });
    expect(res.status).toBe(403);
    expect(res.headers.get("set-cookie")).toBeNull();
  });

  it("sign-in, the project page and the workspace (with charts) run without a CSP violation or console error; signed-in JSON is private", async () => {
    const ctx = await newContext(browser);
    // Registered before any page script runs (Playwright injects it outside the page's policy).
    await ctx.addInitScript(() => {
      const w = window as unknown as { __cspViolations: string[] };
      w.__cspViolations = [];
      document.addEventListener("securitypolicyviolation", (e) => w.__cspViolations.push(`${e.violatedDirective} ${e.blockedURI}`));
    });
    const page = await ctx.newPage();
    const problems: string[] = [];
    page.on("console", (m) => {
      // Failed loads are judged by their answers below (the missing favicon is not a fault of this policy).
      if (/^Failed to load resource/.test(m.text())) return;
      if (m.type() === "error" || /Content Security Policy|Refused to (execute|load|apply)/i.test(m.text())) problems.push(`${page.url()}: ${m.text()}`);
    });
    page.on("response", (r) => {
      if (r.status() >= 400 && new URL(r.url()).pathname !== "/favicon.ico") problems.push(`${r.status()} ${r.url()}`);
    });
    page.on("pageerror", (e) => problems.push(`${page.url()}: ${e.message}`));
    const violations = async (p: Page) => p.evaluate(() => (window as unknown as { __cspViolations: string[] }).__cspViolations);
    // The prerendered forgot-password page hydrates under its hash policy: its form posts and answers.
    await page.goto("/forgot-password");
    await page.getByLabel("E-mail").fill("nobody-csp@plinthwise.test");
    await page.getByRole("button", { name: "Send the link" }).click();
    await page.getByRole("status").waitFor();
    expect(await violations(page)).toEqual([]);
    const s = new SignInPage(page);
    await s.open();
    // Hydrated: the form's client code runs (a blocked script would leave a dead form).
    await page.getByLabel("E-mail").waitFor();
    expect(await violations(page)).toEqual([]);
    await s.signIn("designer@plinthwise.test", "plinth-demo-2026");
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    expect(await violations(page)).toEqual([]);
    await page.getByRole("link", { name: "PH1-B201" }).click();
    await page.getByTestId("plot-displacement").locator("svg path").first().waitFor({ timeout: 30_000 });
    expect(await violations(page)).toEqual([]);
    expect(problems).toEqual([]);
    const me = await ctx.request.get("/api/v1/session");
    expect(me.status()).toBe(200);
    expect(me.headers()["cache-control"]).toBe("private, no-store");
    await ctx.close();
  });

  it("a server action posted from a foreign origin answers 403, an oversize one 413 (not the framework's 500)", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    // The real sign-in action's id, as the browser sends it.
    let actionHeaders: Record<string, string> | null = null;
    page.on("request", (r) => {
      if (r.method() === "POST" && r.headers()["next-action"]) actionHeaders ??= r.headers();
    });
    const s = new SignInPage(page);
    await s.open();
    await s.signIn("designer@plinthwise.test", "plinth-demo-2026");
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    await ctx.close();
    expect(actionHeaders).not.toBeNull();
    const h = actionHeaders as unknown as Record<string, string>;
    const form = new FormData();
    form.append("1_email", "designer@plinthwise.test");
    form.append("1_password", "plinth-demo-2026");
    form.append("0", '["$K1"]');
    const base = { "next-action": h["next-action"]!, accept: "text/x-component", "next-router-state-tree": h["next-router-state-tree"] ?? "" };
    const foreign = await fetch(`${appUrl}/sign-in`, { method: "POST", headers: { ...base, origin: "https://evil.example" }, body: form });
    expect(foreign.status).toBe(403);
    expect(await foreign.text()).toMatch(/Cross-site request refused/);
    expect(foreign.headers.get("set-cookie")).toBeNull();
    const big = new FormData();
    big.append("1_email", "x".repeat(1024 * 1024 + 10));
    const oversize = await fetch(`${appUrl}/sign-in`, { method: "POST", headers: { ...base, origin: appUrl }, body: big });
    expect(oversize.status).toBe(413);
    expect(await oversize.text()).toMatch(/at most 1024 kB/);
  });
});
