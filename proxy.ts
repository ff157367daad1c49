// Next 16's proxy (formerly middleware): runs before every page, action and API call.
// The decisions live in app/_lib/proxy-rules.ts; this file only hands them to Next.
import { NextResponse, type NextRequest } from "next/server";
import { getServerEnv, isDemoMode } from "@/modules/platform/env";
import { decideProxy } from "@/app/_lib/proxy-rules";
import { isPrerenderedPage, prerenderedScriptHashes, servedPage } from "@/app/_lib/static-pages";

export function proxy(request: NextRequest): Response {
  const env = getServerEnv();
  const pathname = request.nextUrl.pathname;
  // A prerendered page (sign-in, forgot password) is served as the build wrote it: its
  // policy names its inline scripts by hash. A form post to it is a server action, rendered
  // per request like any other answer, so it keeps the nonce policy.
  const prerendered = (request.method === "GET" || request.method === "HEAD") && isPrerenderedPage(pathname) ? servedPage(pathname, isDemoMode()) : null;
  const decision = decideProxy(
    request,
    { trustProxy: Number(env.TRUST_PROXY) > 0, appUrl: env.APP_URL, dev: env.NODE_ENV === "development" },
    { scriptHashes: prerendered ? prerenderedScriptHashes(prerendered) : null },
  );
  if (decision.kind === "refuse") return decision.response;
  // The rewrite stays inside the server only when the server was started with -H localhost (or
  // no -H): Next turns a loopback address in a proxy's URL into "localhost" but resolves
  // rewrites against the -H address as given, so under -H 127.0.0.1 this rewrite became an HTTP
  // proxy to the server itself (now and then "socket hang up"; a 500 behind TLS with
  // X-Forwarded-Proto: https). The project's scripts start it with -H localhost.
  const response =
    prerendered && prerendered !== pathname
      ? NextResponse.rewrite(new URL(prerendered, request.url), { request: { headers: decision.requestHeaders } })
      : NextResponse.next({ request: { headers: decision.requestHeaders } });
  for (const [k, v] of Object.entries(decision.responseHeaders)) response.headers.set(k, v);
  return response;
}

export const config = {
  // Built assets are files with hashed names and carry no script of their own.
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
