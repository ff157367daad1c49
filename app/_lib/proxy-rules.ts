// What proxy.ts decides for each request, kept free of Next so the integration tests can
// call it with plain Requests: the content security policy with a fresh nonce, HSTS only
// over https, and the refusals of server-action posts that Next itself would answer with
// a bare 500 (a foreign origin, a body over the action body limit).
import { foreignOriginReason, isServedOverHttps } from "./request-origin";

/**
 * Next's server-action body limit (serverActions.bodySizeLimit, default 1 MB = 1024 * 1024
 * bytes in next/dist/server/app-render/action-handler.js). next.config.js leaves it at the
 * default; a test checks that, so the two cannot drift apart.
 */
export const ACTION_BODY_LIMIT_BYTES = 1024 * 1024;

/** HSTS for a year; subdomains are the operator's to decide, so they are not included. */
export const HSTS_VALUE = "max-age=31536000";

export interface ProxyEnv {
  trustProxy: boolean;
  appUrl: string;
  dev: boolean;
}

/**
 * Where a page's scripts get their permission: this request's nonce (every page rendered per
 * request), or, for a page prerendered at build time (app/_lib/static-pages.ts), the SHA-256
 * of each of its inline scripts. A prerendered page's external scripts are the build's own
 * chunks under /_next/static: 'self' admits them, since without a nonce 'strict-dynamic'
 * would refuse them (they carry neither nonce nor integrity). No 'unsafe-inline' either way.
 */
export type ScriptSource = { nonce: string } | { hashes: string[] };

/**
 * Scripts run only with this request's nonce; 'strict-dynamic' passes the trust on to the
 * chunks Next's runtime loads, so no host list or 'unsafe-inline' is needed. Styles keep
 * 'unsafe-inline': the charts and the resizable panes set style attributes, which a nonce
 * cannot cover (and a nonce in style-src would switch 'unsafe-inline' off).
 * worker-src 'self': the workspace's engine runs in a Web Worker loaded from the app's own
 * /_next/static chunks; without it the worker falls back to script-src, where 'strict-dynamic'
 * ignores 'self' and the worker would be refused. No blob: (Turbopack starts workers from a URL).
 */
export function contentSecurityPolicy(source: ScriptSource, env: ProxyEnv, https: boolean): string {
  const scripts = "nonce" in source ? `'self' 'nonce-${source.nonce}' 'strict-dynamic'` : ["'self'", ...source.hashes].join(" ");
  return [
    "default-src 'self'",
    `script-src ${scripts}${env.dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "worker-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(https ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return Buffer.from(bytes).toString("base64");
}

export type ProxyDecision =
  | { kind: "refuse"; response: Response }
  | { kind: "pass"; requestHeaders: Headers; responseHeaders: Record<string, string> };

function refusal(status: number, code: string, message: string, headers: Record<string, string>): Response {
  return Response.json({ error: { code, message } }, { status, headers: { ...headers, "cache-control": "no-store" } });
}

/** `scriptHashes`: the inline-script hashes when the request is for a prerendered page (else a fresh nonce). */
export function decideProxy(request: Request, env: ProxyEnv, opts: { nonce?: string; scriptHashes?: string[] | null } = {}): ProxyDecision {
  const https = isServedOverHttps(request.headers, env.trustProxy, env.appUrl);
  const source: ScriptSource = opts.scriptHashes ? { hashes: opts.scriptHashes } : { nonce: opts.nonce ?? newNonce() };
  const csp = contentSecurityPolicy(source, env, https);
  const responseHeaders: Record<string, string> = { "content-security-policy": csp };
  if (https) responseHeaders["strict-transport-security"] = HSTS_VALUE;

  // Outside /api (whose route wrapper has its own checks) a POST is a server action: with
  // Next's Next-Action header from script, or a plain form post carrying $ACTION_ fields.
  if (request.method === "POST" && !new URL(request.url).pathname.startsWith("/api/")) {
    const foreign = foreignOriginReason(request.headers, env.trustProxy);
    if (foreign) {
      return { kind: "refuse", response: refusal(403, "cross_site", `Cross-site request refused: ${foreign}. Open the desk at its own address and try again.`, responseHeaders) };
    }
    // A chunked body has no length to check here, and Next would refuse it past its own limit
    // with a 500 after reading: browsers always send Content-Length for forms, so ask for it.
    if (request.headers.get("content-length") === null && /chunked/i.test(request.headers.get("transfer-encoding") ?? "")) {
      return { kind: "refuse", response: refusal(411, "length_required", "A form must be sent with its length (Content-Length); send it again from the page.", responseHeaders) };
    }
    const declared = Number(request.headers.get("content-length") ?? "0");
    if (declared > ACTION_BODY_LIMIT_BYTES) {
      return {
        kind: "refuse",
        response: refusal(413, "payload_too_large", `The form sent ${Math.ceil(declared / 1024)} kB; a form may send at most ${ACTION_BODY_LIMIT_BYTES / 1024} kB.`, responseHeaders),
      };
    }
  }

  // Next reads the nonce from the request's policy and puts it on its own scripts.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", csp);
  if ("nonce" in source) requestHeaders.set("x-nonce", source.nonce);
  else requestHeaders.delete("x-nonce");
  // Next's own action check always believes X-Forwarded-Host (a spoofed one made a
  // same-origin action answer 500); without a trusted proxy it is the Host, as for the API.
  const host = request.headers.get("host");
  if (!env.trustProxy && host) requestHeaders.set("x-forwarded-host", host);
  return { kind: "pass", requestHeaders, responseHeaders };
}
