// Next 16's proxy (formerly middleware): runs before every page, action and API call.
// The decisions live in app/_lib/proxy-rules.ts; this file only hands them to Next.
import { NextResponse, type NextRequest } from "next/server";
import { getServerEnv } from "@/modules/platform/env";
import { decideProxy } from "@/app/_lib/proxy-rules";

export function proxy(request: NextRequest): Response {
  const env = getServerEnv();
  const decision = decideProxy(request, { trustProxy: Number(env.TRUST_PROXY) > 0, appUrl: env.APP_URL, dev: env.NODE_ENV === "development" });
  if (decision.kind === "refuse") return decision.response;
  const response = NextResponse.next({ request: { headers: decision.requestHeaders } });
  for (const [k, v] of Object.entries(decision.responseHeaders)) response.headers.set(k, v);
  return response;
}

export const config = {
  // Built assets are files with hashed names and carry no script of their own.
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
