import { sealData, unsealData } from "iron-session";
import { getServerEnv, getSessionSecret } from "@/modules/platform/env";
import { createSession, getSessionUser, revokeSession, SESSION_TTL_MS, type PublicUser } from "@/db/queries/accounts";
import type { RequestPort } from "./request-context";

// The session cookie is sealed with iron-session 8 (AES + HMAC): it carries only
// the session id, whose row in PostgreSQL makes sign-out final.
export const SESSION_COOKIE = "plinth_session";

interface SessionPayload {
  sid: string;
}

function secureCookies(): boolean {
  const env = getServerEnv();
  if (env.SECURE_COOKIES === "1") return true;
  if (env.SECURE_COOKIES === "0") return false;
  // Secure in production. Browsers treat loopback as a secure context, so the local
  // production build on http://localhost or 127.0.0.1 keeps working too.
  return env.NODE_ENV === "production";
}

export async function sealSessionCookie(sid: string): Promise<string> {
  return sealData({ sid } satisfies SessionPayload, { password: getSessionSecret(), ttl: SESSION_TTL_MS / 1000 });
}

export async function startSession(port: RequestPort, userId: string): Promise<string> {
  const { id } = await createSession(userId);
  port.setCookie(SESSION_COOKIE, await sealSessionCookie(id), {
    httpOnly: true,
    sameSite: "lax",
    secure: secureCookies(),
    path: "/",
    maxAge: SESSION_TTL_MS / 1000,
  });
  return id;
}

// Unsealing derives two keys with PBKDF2 and checks the HMAC: about a millisecond of CPU on
// every signed-in request (measured with --cpu-prof on next start). A cookie that unsealed
// once maps to the same session id until it expires, so the answer is remembered for a
// minute (never past the seal's own expiry), per server process and bounded. Only the
// cookie -> session id step is remembered: revocation (sign-out, password change) and expiry
// are read from the session's row on every request (getSessionUser), and project membership
// on every request too (guard.ts, page-guard.ts), so nothing about who may do what is cached.
const UNSEALED_FOR_MS = 60_000;
const UNSEALED_MAX = 2000;
const unsealed = new Map<string, { sid: string; until: number }>();

/** The expiry (ms since epoch) written in an iron seal, `Fe26.2*id*salt*iv*data*expiration*hmacSalt*hmac~2`, if any. */
export function sealExpiry(raw: string): number | undefined {
  const field = raw.split("~")[0]?.split("*")[5];
  return field && /^\d+$/.test(field) ? Number(field) : undefined;
}

export async function readSessionId(port: RequestPort): Promise<string | undefined> {
  const raw = port.getCookie(SESSION_COOKIE);
  if (!raw) return undefined;
  const now = Date.now();
  const known = unsealed.get(raw);
  if (known && known.until > now) return known.sid;
  try {
    const data = await unsealData<Partial<SessionPayload>>(raw, { password: getSessionSecret(), ttl: SESSION_TTL_MS / 1000 });
    const sid = typeof data.sid === "string" && data.sid.length > 0 ? data.sid : undefined;
    if (sid) {
      if (unsealed.size >= UNSEALED_MAX) unsealed.delete(unsealed.keys().next().value as string);
      unsealed.set(raw, { sid, until: Math.min(now + UNSEALED_FOR_MS, sealExpiry(raw) ?? now) });
    }
    return sid;
  } catch {
    // A tampered or foreign cookie unseals to an error: treated as signed out.
    return undefined;
  }
}

export async function getUserFromPort(port: RequestPort): Promise<PublicUser | undefined> {
  const sid = await readSessionId(port);
  if (!sid) return undefined;
  return getSessionUser(sid);
}

export async function endSession(port: RequestPort): Promise<void> {
  const sid = await readSessionId(port);
  if (sid) await revokeSession(sid);
  port.deleteCookie(SESSION_COOKIE);
}
