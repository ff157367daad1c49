// Requests and headers: the route wrapper's same-site rules (X-Forwarded-Host only behind
// a trusted proxy, JSON bodies only, no origin signal means JSON or nothing), the private
// cache header on signed-in answers, and proxy.ts's decisions (CSP nonce, HSTS only over
// https, server-action refusals as 403/413 instead of Next's 500).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { ACTION_BODY_LIMIT_BYTES, decideProxy, HSTS_VALUE, type ProxyEnv } from "@/app/_lib/proxy-rules";
import { requestHost } from "@/app/_lib/request-origin";
import { callRoute, cookieFor, getFixture, type Fixture } from "./support/fixture";

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  await closeDb();
});

async function errorCode(res: Response): Promise<string> {
  const body = (await res.json()) as { error?: { code: string } };
  return body.error?.code ?? "(none)";
}

describe("the route wrapper's same-site check", () => {
  it("ignores X-Forwarded-Host when no trusted proxy is configured (TRUST_PROXY=0)", async () => {
    const res = await callRoute("v1/calculate", "POST", {}, {
      cookie: fx.cookies.designer,
      body: {},
      headers: { origin: "https://evil.example", "x-forwarded-host": "evil.example" },
    });
    expect(res.status).toBe(403);
    expect(await errorCode(res)).toBe("cross_site");
    // The same request from this site passes the check (and fails only on its empty input).
    const ok = await callRoute("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body: {} });
    expect(ok.status).toBe(400);
    // Behind a trusted proxy its X-Forwarded-Host (first hop) is the host; without one, Host is.
    const h = new Headers({ host: "10.0.0.5:3000", "x-forwarded-host": "desk.example, inner" });
    expect(requestHost(h, true)).toBe("desk.example");
    expect(requestHost(h, false)).toBe("10.0.0.5:3000");
  });

  it("refuses a text/plain, form or typeless body to a JSON route with 415", async () => {
    for (const type of ["text/plain", "text/plain;charset=UTF-8", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"]) {
      const res = await callRoute("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body: {}, headers: { "content-type": type } });
      expect(res.status, type).toBe(415);
      expect(await errorCode(res)).toBe("unsupported_media_type");
    }
    const json = await callRoute("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body: {}, headers: { "content-type": "application/json; charset=utf-8" } });
    expect(json.status).toBe(400);
  });

  it("refuses a state-changing request with neither Origin nor Sec-Fetch-Site unless it carries a JSON type", async () => {
    const cookie = await cookieFor(fx.userIds.viewer);
    const bare = await callRoute("v1/session", "DELETE", {}, { cookie, headers: { origin: "" } });
    expect(bare.status).toBe(403);
    expect(await errorCode(bare)).toBe("cross_site");
    const plain = await callRoute("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body: "{}", headers: { origin: "", "content-type": "text/plain" } });
    expect(plain.status).toBe(403);
    // A script (curl) sending JSON without Origin is served, as is a browser's same-origin request.
    const script = await callRoute("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body: {}, headers: { origin: "" } });
    expect(script.status).toBe(400);
    const fetchSite = await callRoute("v1/session", "DELETE", {}, { cookie, headers: { origin: "", "sec-fetch-site": "same-origin" } });
    expect(fetchSite.status).toBe(200);
  });
});

describe("cache headers on signed-in JSON", () => {
  it("answers to a signed-in caller, and their refusals, carry Cache-Control: private, no-store", async () => {
    const me = await callRoute("v1/session", "GET", {}, { cookie: fx.cookies.designer });
    expect(me.status).toBe(200);
    expect(me.headers.get("cache-control")).toBe("private, no-store");
    const projects = await callRoute("v1/projects", "GET", {}, { cookie: fx.cookies.viewer });
    expect(projects.status).toBe(200);
    expect(projects.headers.get("cache-control")).toBe("private, no-store");
    const refused = await callRoute("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body: {} });
    expect(refused.status).toBe(400);
    expect(refused.headers.get("cache-control")).toBe("private, no-store");
    const anonymous = await callRoute("v1/session", "GET", {}, {});
    expect(anonymous.status).toBe(401);
    expect(anonymous.headers.get("cache-control")).toBe("private, no-store");
  });
});

describe("proxy.ts decisions", () => {
  const plainHttp: ProxyEnv = { trustProxy: false, appUrl: "http://127.0.0.1:3100", dev: false };
  const action = (headers: Record<string, string>, url = "http://127.0.0.1:3100/projects/x") =>
    new Request(url, { method: "POST", headers: { host: "127.0.0.1:3100", "next-action": "7f00aa", "content-type": "text/plain;charset=UTF-8", ...headers }, body: "[]" });

  it("refuses a server action from a foreign origin with 403 and a message, before Next answers 500", async () => {
    const foreign: Record<string, string>[] = [
      { origin: "https://evil.example" },
      { origin: "null" },
      { origin: "https://evil.example", "x-forwarded-host": "evil.example" },
      { "sec-fetch-site": "cross-site" },
    ];
    for (const headers of foreign) {
      const d = decideProxy(action(headers), plainHttp);
      expect(d.kind, JSON.stringify(headers)).toBe("refuse");
      if (d.kind !== "refuse") continue;
      expect(d.response.status).toBe(403);
      const body = (await d.response.json()) as { error: { code: string; message: string } };
      expect(body.error.code).toBe("cross_site");
      expect(body.error.message).toMatch(/Cross-site request refused/);
    }
    // A plain form post (no Next-Action header, $ACTION_ fields) is judged the same way.
    const form = new Request("http://127.0.0.1:3100/sign-in", { method: "POST", headers: { host: "127.0.0.1:3100", origin: "https://evil.example" }, body: new FormData() });
    expect(decideProxy(form, plainHttp).kind).toBe("refuse");
    expect(decideProxy(action({ origin: "http://127.0.0.1:3100" }), plainHttp).kind).toBe("pass");
    // Behind a trusted proxy, the proxy's X-Forwarded-Host is the site.
    expect(decideProxy(action({ origin: "https://desk.example", "x-forwarded-host": "desk.example" }), { ...plainHttp, trustProxy: true }).kind).toBe("pass");
    // A client's X-Forwarded-Host is replaced by Host before Next's own check sees it (Next believes it and answers 500).
    const spoofed = decideProxy(action({ origin: "http://127.0.0.1:3100", "x-forwarded-host": "elsewhere.example" }), plainHttp);
    expect(spoofed.kind === "pass" && spoofed.requestHeaders.get("x-forwarded-host")).toBe("127.0.0.1:3100");
    const trusted = decideProxy(action({ origin: "https://desk.example", "x-forwarded-host": "desk.example" }), { ...plainHttp, trustProxy: true });
    expect(trusted.kind === "pass" && trusted.requestHeaders.get("x-forwarded-host")).toBe("desk.example");
    // API routes are the route wrapper's to judge.
    expect(decideProxy(action({ origin: "https://evil.example" }, "http://127.0.0.1:3100/api/v1/calculate"), plainHttp).kind).toBe("pass");
  });

  it("refuses a server action whose declared body is over the action body limit with 413", async () => {
    const d = decideProxy(action({ origin: "http://127.0.0.1:3100", "content-length": String(ACTION_BODY_LIMIT_BYTES + 1) }), plainHttp);
    expect(d.kind).toBe("refuse");
    if (d.kind === "refuse") {
      expect(d.response.status).toBe(413);
      expect(((await d.response.json()) as { error: { message: string } }).error.message).toMatch(/at most 1024 kB/);
    }
    expect(decideProxy(action({ origin: "http://127.0.0.1:3100", "content-length": String(ACTION_BODY_LIMIT_BYTES) }), plainHttp).kind).toBe("pass");
    // The limit is Next's default, which next.config.js must leave alone for the two to agree.
    // @ts-expect-error -- next.config.js is plain JavaScript without a declaration file
    const config = (await import("../../next.config.js")).default as { serverActions?: unknown; experimental?: { serverActions?: unknown } };
    expect(config.serverActions).toBeUndefined();
    expect(config.experimental?.serverActions).toBeUndefined();
  });

  it("refuses a chunked server-action body without a length with 411, before Next reads it", async () => {
    const d = decideProxy(action({ origin: "http://127.0.0.1:3100", "transfer-encoding": "chunked" }), plainHttp);
    expect(d.kind).toBe("refuse");
    if (d.kind === "refuse") {
      expect(d.response.status).toBe(411);
      expect(((await d.response.json()) as { error: { code: string } }).error.code).toBe("length_required");
    }
    expect(decideProxy(action({ origin: "http://127.0.0.1:3100", "content-length": "10" }), plainHttp).kind).toBe("pass");
  });

  it("sets a script policy with a fresh nonce and 'strict-dynamic' and no 'unsafe-inline', on the answer and for Next's renderer", () => {
    const page = () => new Request("http://127.0.0.1:3100/sign-in", { headers: { host: "127.0.0.1:3100" } });
    const a = decideProxy(page(), plainHttp);
    const b = decideProxy(page(), plainHttp);
    if (a.kind !== "pass" || b.kind !== "pass") throw new Error("expected pass");
    const csp = a.responseHeaders["content-security-policy"]!;
    const scriptSrc = csp.split("; ").find((d) => d.startsWith("script-src "))!;
    expect(scriptSrc).toMatch(/^script-src 'self' 'nonce-[A-Za-z0-9+/=]{20,}' 'strict-dynamic'$/);
    expect(scriptSrc).not.toContain("unsafe-inline");
    expect(scriptSrc).not.toContain("unsafe-eval");
    expect(a.requestHeaders.get("content-security-policy")).toBe(csp);
    expect(csp).toContain(`'nonce-${a.requestHeaders.get("x-nonce")}'`);
    expect(b.requestHeaders.get("x-nonce")).not.toBe(a.requestHeaders.get("x-nonce"));
    expect(csp).toContain("frame-ancestors 'none'");
    // the workspace's engine worker: same-origin chunks only (under 'strict-dynamic' a worker
    // would otherwise fall back to script-src, where 'self' no longer counts)
    expect(csp.split("; ")).toContain("worker-src 'self'");
  });

  it("gives a prerendered page a script policy of 'self' and its inline scripts' hashes: no nonce, no 'strict-dynamic', no 'unsafe-inline'", () => {
    const req = new Request("http://127.0.0.1:3100/sign-in", { headers: { host: "127.0.0.1:3100" } });
    const hashes = ["'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='", "'sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU='"];
    const d = decideProxy(req, plainHttp, { scriptHashes: hashes });
    if (d.kind !== "pass") throw new Error("expected pass");
    const csp = d.responseHeaders["content-security-policy"]!;
    const scriptSrc = csp.split("; ").find((x) => x.startsWith("script-src "));
    expect(scriptSrc).toBe(`script-src 'self' ${hashes.join(" ")}`);
    expect(csp).not.toContain("nonce-");
    expect(scriptSrc).not.toContain("unsafe-inline");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(d.requestHeaders.get("x-nonce")).toBeNull();
    // a page that was not found prerendered (null) gets the nonce policy
    const n = decideProxy(req, plainHttp, { scriptHashes: null });
    if (n.kind !== "pass") throw new Error("expected pass");
    expect(n.responseHeaders["content-security-policy"]).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
  });

  it("leaves response compression on (next start gzips route-handler answers, the lean calculate answer relies on it)", async () => {
    // @ts-expect-error -- next.config.js is plain JavaScript without a declaration file
    const config = (await import("../../next.config.js")).default as { compress?: boolean };
    expect(config.compress).toBe(true);
  });

  it("sends HSTS only over https: an https APP_URL, or a trusted proxy's X-Forwarded-Proto", () => {
    const hsts = (url: string, env: ProxyEnv, headers: Record<string, string> = {}) => {
      const d = decideProxy(new Request(url, { headers: { host: "desk.example", ...headers } }), env);
      return d.kind === "pass" ? (d.responseHeaders["strict-transport-security"] ?? null) : "refused";
    };
    expect(hsts("http://127.0.0.1:3100/", plainHttp)).toBeNull();
    // A client's own X-Forwarded-Proto counts for nothing without a trusted proxy.
    expect(hsts("http://127.0.0.1:3100/", plainHttp, { "x-forwarded-proto": "https" })).toBeNull();
    // Next builds the request URL's scheme from X-Forwarded-Proto, so that scheme is not asked either.
    expect(hsts("https://desk.example/", plainHttp)).toBeNull();
    expect(hsts("http://127.0.0.1:3100/", { ...plainHttp, appUrl: "https://desk.example" })).toBe(HSTS_VALUE);
    expect(hsts("http://10.0.0.5:3000/", { ...plainHttp, trustProxy: true }, { "x-forwarded-proto": "https" })).toBe(HSTS_VALUE);
    expect(hsts("http://10.0.0.5:3000/", { ...plainHttp, trustProxy: true, appUrl: "https://desk.example" }, { "x-forwarded-proto": "http" })).toBeNull();
  });
});
