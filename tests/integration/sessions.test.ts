// Sessions: the sealed iron-session cookie, its database row, tampering and sign-out.
import { eq } from "drizzle-orm";
import { sealData } from "iron-session";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetPasswordAction, signInAction, signOutAction } from "@/app/(auth)/actions";
import { readSessionId, sealExpiry, SESSION_COOKIE } from "@/app/_lib/session";
import { portFromRequest } from "@/app/_lib/request-context";
import { hashPassword } from "@/app/_lib/passwords";
import { closeDb, getDb } from "@/db/client";
import { createOneTimeToken, createUser, getUserByEmail, SESSION_TTL_MS } from "@/db/queries/accounts";
import { sessions } from "@/db/schema";
import { getServerEnv } from "@/modules/platform/env";
import { callAction, callRoute, makeRequest, peer, sessionCookieFrom } from "./support/fixture";

const email = `session-${Date.now()}@example.test`;
const password = "correct horse battery";

async function signInCookie(): Promise<string> {
  const { state, port } = await callAction(signInAction, { email, password }, null);
  expect(state.ok).toBe(true);
  const cookie = sessionCookieFrom(port.setCookieHeaders);
  expect(cookie).not.toBeNull();
  return cookie!;
}

beforeAll(async () => {
  await createUser({ email, name: "Sam Session", passwordHash: await hashPassword(password) });
});
afterAll(async () => {
  await closeDb();
});

describe("sessions", () => {
  it("signing in sets an httpOnly, SameSite=Lax cookie that opens the API", async () => {
    const { port } = await callAction(signInAction, { email, password }, null);
    const header = port.setCookieHeaders.find((h) => h.startsWith(`${SESSION_COOKIE}=`));
    expect(header).toMatch(/HttpOnly/);
    expect(header).toMatch(/SameSite=Lax/);
    const cookie = sessionCookieFrom(port.setCookieHeaders);
    const res = await callRoute("v1/session", "GET", {}, { cookie });
    expect(res.status).toBe(200);
    const body = (await res.json()) as { user: { email: string } };
    expect(body.user.email).toBe(email);
  });

  it("refuses a tampered cookie", async () => {
    const cookie = await signInCookie();
    const [name, value] = cookie.split("=") as [string, string];
    const raw = decodeURIComponent(value);
    // Flip one character in the sealed payload.
    const i = Math.floor(raw.length / 2);
    const flipped = raw.slice(0, i) + (raw[i] === "A" ? "B" : "A") + raw.slice(i + 1);
    const res = await callRoute("v1/session", "GET", {}, { cookie: `${name}=${encodeURIComponent(flipped)}` });
    expect(res.status).toBe(401);
  });

  it("refuses a cookie sealed with another secret, even for a live session id", async () => {
    const rows = await getDb().select().from(sessions).limit(1);
    const sid = rows[0]?.id;
    expect(sid).toBeDefined();
    const forged = await sealData({ sid }, { password: "x".repeat(40) });
    const res = await callRoute("v1/session", "GET", {}, { cookie: `${SESSION_COOKIE}=${encodeURIComponent(forged)}` });
    expect(res.status).toBe(401);
  });

  it("sign-out ends the session: the same cookie no longer works", async () => {
    const cookie = await signInCookie();
    expect((await callRoute("v1/session", "GET", {}, { cookie })).status).toBe(200);
    const { state, port } = await callAction(signOutAction, {}, cookie);
    expect(state.ok).toBe(true);
    expect(port.setCookieHeaders.some((h) => h.startsWith(`${SESSION_COOKIE}=;`) && /Max-Age=0/.test(h))).toBe(true);
    expect((await callRoute("v1/session", "GET", {}, { cookie })).status).toBe(401);
  });

  it("an expired session row is refused", async () => {
    const cookie = await signInCookie();
    const sid = await readSessionId(portFromRequest(makeRequest("GET", "/", { cookie })));
    expect(sid).toBeDefined();
    await getDb().update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.id, sid!));
    expect((await callRoute("v1/session", "GET", {}, { cookie })).status).toBe(401);
  });

  it("a password change ends every session of the account at once, also cookies this server has just read", async () => {
    const a = await signInCookie();
    const b = await signInCookie();
    // read twice each: the unsealing of both cookies is now remembered by this process
    for (const c of [a, b, a, b]) expect((await callRoute("v1/session", "GET", {}, { cookie: c })).status).toBe(200);
    const user = await getUserByEmail(email);
    const token = await createOneTimeToken({ purpose: "password-reset", userId: user!.id, ttlMs: 60_000 });
    const newPassword = "correct horse battery";
    const reset = await callAction(resetPasswordAction, { token, password: newPassword, confirm: newPassword }, null);
    expect(reset.state.ok).toBe(true);
    expect((await callRoute("v1/session", "GET", {}, { cookie: a })).status).toBe(401);
    expect((await callRoute("v1/session", "GET", {}, { cookie: b })).status).toBe(401);
    // the reset's own new session works
    expect((await callRoute("v1/session", "GET", {}, { cookie: sessionCookieFrom(reset.port.setCookieHeaders) })).status).toBe(200);
  });

  it("the remembered unsealing never outlives the seal: its expiry is read from the cookie", async () => {
    const cookie = await signInCookie();
    const raw = decodeURIComponent(cookie.split("=")[1]!);
    const exp = sealExpiry(raw);
    expect(exp).toBeDefined();
    // sealed with the session's lifetime (iron-session writes now + ttl in ms)
    expect(Math.abs(exp! - (Date.now() + SESSION_TTL_MS))).toBeLessThan(60_000);
    expect(sealExpiry("Fe26.2**x*y*z*data**s*h~2")).toBeUndefined();
  });

  it("a wrong password is refused with a clear message and no cookie", async () => {
    const { state, port } = await callAction(signInAction, { email, password: "wrong" }, null, peer("10.9.9.9"));
    expect(state.ok).toBe(false);
    if (!state.ok) expect(state.message).toMatch(/do not match/);
    expect(sessionCookieFrom(port.setCookieHeaders)).toBeNull();
  });

  it("bad form input names the field", async () => {
    const { state } = await callAction(signInAction, { email: "not-an-email", password: "" }, null);
    expect(state.ok).toBe(false);
    if (!state.ok) {
      expect(state.fieldErrors?.email?.[0]).toMatch(/valid e-mail/);
      expect(state.fieldErrors?.password?.[0]).toMatch(/password/);
    }
  });
});

describe("API sign-in for scripts", () => {
  it("POST /api/v1/session signs in, DELETE signs out", async () => {
    const res = await callRoute("v1/session", "POST", {}, { body: { email, password } });
    expect(res.status).toBe(200);
    const set = res.headers.getSetCookie();
    const cookie = sessionCookieFrom(set);
    expect(cookie).not.toBeNull();
    expect((await callRoute("v1/session", "GET", {}, { cookie })).status).toBe(200);
    expect((await callRoute("v1/session", "DELETE", {}, { cookie })).status).toBe(200);
    expect((await callRoute("v1/session", "GET", {}, { cookie })).status).toBe(401);
  });

  it("a wrong password is 401, a malformed body 400 naming the field", async () => {
    expect((await callRoute("v1/session", "POST", {}, { body: { email, password: "nope" }, headers: peer("10.77.0.1") })).status).toBe(401);
    const bad = await callRoute("v1/session", "POST", {}, { body: { email: "x" } });
    expect(bad.status).toBe(400);
    const j = (await bad.json()) as { error: { issues: { path: string }[] } };
    expect(j.error.issues.map((i) => i.path)).toEqual(expect.arrayContaining(["email", "password"]));
  });
});

describe("where sign-in sends you (the next parameter)", () => {
  const forms: [string, string][] = [
    ["//evil.test", "/"],
    ["/\\evil.test", "/"],
    ["/\\/evil.test", "/"],
    ["\\\\evil.test", "/"],
    ["/%5Cevil.test", "/"],
    ["/%2F%2Fevil.test", "/"],
    ["https://evil.test", "/"],
    ["javascript:alert(1)", "/"],
    ["/\t/evil.test", "/"],
    ["/..//evil.test", "/evil.test"],
    [new URL("/projects", getServerEnv().APP_URL).toString(), "/projects"],
    ["/projects?tab=team", "/projects?tab=team"],
  ];
  it.each(forms)("next=%j goes to %j", async (next, expected) => {
    const { state } = await callAction(signInAction, { email, password, next }, null);
    expect(state.ok).toBe(true);
    if (state.ok) expect((state.data as { next: string }).next).toBe(expected);
  });
});
