// Where a request says it comes from and where it was sent, read the same way by the
// route wrapper and by proxy.ts (for server actions). X-Forwarded-Host and
// X-Forwarded-Proto are set by a load balancer, but any client can send them, so they
// count only when TRUST_PROXY (1 or more hops) says a proxy in front of the server overwrites them.

interface HeaderSource {
  get(name: string): string | null;
}

/** The first value of a comma-separated forwarded header (the hop nearest the client). */
function firstValue(value: string | null): string | null {
  const v = value?.split(",")[0]?.trim();
  return v ? v : null;
}

/** The host the request was sent to: Host, or the trusted proxy's X-Forwarded-Host. */
export function requestHost(headers: HeaderSource, trustProxy: boolean): string | null {
  if (trustProxy) {
    const forwarded = firstValue(headers.get("x-forwarded-host"));
    if (forwarded) return forwarded;
  }
  return headers.get("host");
}

/**
 * Why a request comes from another site, or null. The browser's Sec-Fetch-Site says so
 * directly; otherwise Origin is compared with the host the request was sent to. A request
 * without Origin is not judged here (see requiresJsonWithoutOrigin).
 */
export function foreignOriginReason(headers: HeaderSource, trustProxy: boolean): string | null {
  if (headers.get("sec-fetch-site") === "cross-site") return "the browser marks it cross-site";
  const origin = headers.get("origin");
  if (origin === null) return null;
  if (origin === "null") return "its origin is opaque (null)";
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    return "its Origin header is not a URL";
  }
  const host = requestHost(headers, trustProxy);
  if (!host || originHost !== host) return `its origin ${originHost} is not this site`;
  return null;
}

/** True when neither Origin nor Sec-Fetch-Site tells where a request comes from. */
export function hasNoOriginSignal(headers: HeaderSource): boolean {
  return headers.get("origin") === null && headers.get("sec-fetch-site") === null;
}

/** True for application/json and +json types (a cross-site form cannot send them without a preflight). */
export function isJsonContentType(value: string | null): boolean {
  const type = value?.split(";")[0]?.trim().toLowerCase() ?? "";
  return type === "application/json" || /^application\/[a-z0-9.+-]+\+json$/.test(type);
}

/**
 * True when the answer travels over https: the trusted proxy's X-Forwarded-Proto when
 * TRUST_PROXY of 1 or more, else an https APP_URL (the operator's TLS front end). The request URL's
 * own scheme is not asked: `next start` speaks plain http, and Next builds that URL from
 * X-Forwarded-Proto, which any client can send.
 */
export function isServedOverHttps(headers: HeaderSource, trustProxy: boolean, appUrl: string): boolean {
  if (trustProxy) {
    const proto = firstValue(headers.get("x-forwarded-proto"));
    if (proto) return proto.toLowerCase() === "https";
  }
  return appUrl.startsWith("https:");
}
