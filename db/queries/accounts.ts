import { and, eq, gt, isNotNull, isNull, sql } from "drizzle-orm";
import { createHash, randomBytes } from "node:crypto";
import { getDb } from "../client";
import { knownSignInAddresses, oneTimeTokens, passwordResetRequests, sessions, signInFailures, users, type UserRow } from "../schema";

export type PublicUser = Pick<UserRow, "id" | "email" | "name" | "isAdmin" | "mayCreateProjects" | "unitsPreference">;

const publicColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  isAdmin: users.isAdmin,
  mayCreateProjects: users.mayCreateProjects,
  unitsPreference: users.unitsPreference,
};

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function getUserByEmail(email: string): Promise<UserRow | undefined> {
  const rows = await getDb().select().from(users).where(eq(users.email, normaliseEmail(email))).limit(1);
  return rows[0];
}

export async function getPublicUser(id: string): Promise<PublicUser | undefined> {
  const rows = await getDb().select(publicColumns).from(users).where(eq(users.id, id)).limit(1);
  return rows[0];
}

export async function createUser(input: {
  email: string;
  name: string;
  passwordHash?: string | null;
  isAdmin?: boolean;
  mayCreateProjects?: boolean;
}): Promise<PublicUser> {
  const rows = await getDb()
    .insert(users)
    .values({
      email: normaliseEmail(input.email),
      name: input.name,
      passwordHash: input.passwordHash ?? null,
      isAdmin: input.isAdmin ?? false,
      mayCreateProjects: input.mayCreateProjects ?? false,
    })
    .returning(publicColumns);
  const row = rows[0];
  if (!row) throw new Error("user insert returned nothing");
  return row;
}

export async function setUserPassword(userId: string, passwordHash: string, name?: string): Promise<void> {
  await getDb()
    .update(users)
    .set({ passwordHash, ...(name ? { name } : {}), updatedAt: new Date() })
    .where(eq(users.id, userId));
}

/**
 * Sets the password of an account that has none yet (an invitation); false when the
 * account already has one, which is then left as it is.
 */
export async function setUserPasswordIfUnset(userId: string, passwordHash: string, name?: string): Promise<boolean> {
  const rows = await getDb()
    .update(users)
    .set({ passwordHash, ...(name ? { name } : {}), updatedAt: new Date() })
    .where(and(eq(users.id, userId), isNull(users.passwordHash)))
    .returning({ id: users.id });
  return rows.length > 0;
}

export async function userHasPassword(userId: string): Promise<boolean> {
  const rows = await getDb().select({ id: users.id }).from(users).where(and(eq(users.id, userId), isNotNull(users.passwordHash))).limit(1);
  return rows.length > 0;
}

// ---- sessions -------------------------------------------------------------

export const SESSION_TTL_MS = 12 * 60 * 60 * 1000;

export async function createSession(userId: string): Promise<{ id: string; expiresAt: Date }> {
  const id = randomBytes(24).toString("base64url");
  const expiresAt = new Date(Date.now() + SESSION_TTL_MS);
  await getDb().insert(sessions).values({ id, userId, expiresAt });
  return { id, expiresAt };
}

/** The user behind a live session, or undefined when it expired or was revoked. */
export async function getSessionUser(sessionId: string): Promise<PublicUser | undefined> {
  const rows = await getDb()
    .select(publicColumns)
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(and(eq(sessions.id, sessionId), isNull(sessions.revokedAt), gt(sessions.expiresAt, new Date())))
    .limit(1);
  return rows[0];
}

export async function revokeSession(sessionId: string): Promise<void> {
  await getDb().update(sessions).set({ revokedAt: new Date(), updatedAt: new Date() }).where(eq(sessions.id, sessionId));
}

export async function revokeUserSessions(userId: string): Promise<void> {
  await getDb()
    .update(sessions)
    .set({ revokedAt: new Date(), updatedAt: new Date() })
    .where(and(eq(sessions.userId, userId), isNull(sessions.revokedAt)));
}

// ---- one-time links -------------------------------------------------------

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export async function createOneTimeToken(input: {
  purpose: "password-reset" | "invitation";
  userId: string;
  ttlMs: number;
  projectId?: string;
  role?: string;
  companyId?: string | null;
}): Promise<string> {
  const token = randomBytes(32).toString("base64url");
  await getDb()
    .insert(oneTimeTokens)
    .values({
      purpose: input.purpose,
      tokenHash: hashToken(token),
      userId: input.userId,
      projectId: input.projectId ?? null,
      role: input.role ?? null,
      companyId: input.companyId ?? null,
      expiresAt: new Date(Date.now() + input.ttlMs),
    });
  return token;
}

export type OneTimeTokenRow = typeof oneTimeTokens.$inferSelect;

/** Reads a live token without using it (to show the form). */
export async function getLiveToken(purpose: OneTimeTokenRow["purpose"], token: string): Promise<OneTimeTokenRow | undefined> {
  const rows = await getDb()
    .select()
    .from(oneTimeTokens)
    .where(
      and(
        eq(oneTimeTokens.tokenHash, hashToken(token)),
        eq(oneTimeTokens.purpose, purpose),
        isNull(oneTimeTokens.usedAt),
        gt(oneTimeTokens.expiresAt, new Date()),
      ),
    )
    .limit(1);
  return rows[0];
}

/**
 * Marks a token used and returns it, atomically: of two concurrent uses only
 * one gets the row back.
 */
export async function consumeToken(purpose: OneTimeTokenRow["purpose"], token: string): Promise<OneTimeTokenRow | undefined> {
  const rows = await getDb()
    .update(oneTimeTokens)
    .set({ usedAt: new Date(), updatedAt: new Date() })
    .where(
      and(
        eq(oneTimeTokens.tokenHash, hashToken(token)),
        eq(oneTimeTokens.purpose, purpose),
        isNull(oneTimeTokens.usedAt),
        gt(oneTimeTokens.expiresAt, new Date()),
      ),
    )
    .returning();
  return rows[0];
}

/**
 * Kills every outstanding reset and invitation link of an account (after its password
 * changed): a link mailed earlier must not set the password again. Returns how many.
 */
export async function revokeUserTokens(userId: string): Promise<number> {
  const now = new Date();
  const rows = await getDb()
    .update(oneTimeTokens)
    .set({ usedAt: now, updatedAt: now })
    .where(and(eq(oneTimeTokens.userId, userId), isNull(oneTimeTokens.usedAt)))
    .returning({ id: oneTimeTokens.id });
  return rows.length;
}

// ---- sign-in throttling ---------------------------------------------------

export async function recordSignInFailure(email: string, clientAddress: string): Promise<void> {
  await getDb().insert(signInFailures).values({ email: normaliseEmail(email), clientAddress });
}

export interface RecentFailures {
  byAccount: number;
  byAddress: number;
  byPair: number;
  lastByAccount: Date | null;
  lastByPair: Date | null;
  oldestByAddress: Date | null;
}

export async function countRecentFailures(email: string, clientAddress: string, windowMs: number): Promise<RecentFailures> {
  const since = new Date(Date.now() - windowMs);
  const e = normaliseEmail(email);
  const rows = await getDb()
    .select({
      byAccount: sql<number>`count(*) filter (where ${signInFailures.email} = ${e})::int`,
      byAddress: sql<number>`count(*) filter (where ${signInFailures.clientAddress} = ${clientAddress})::int`,
      byPair: sql<number>`count(*) filter (where ${signInFailures.email} = ${e} and ${signInFailures.clientAddress} = ${clientAddress})::int`,
      lastByAccount: sql<string | null>`max(${signInFailures.createdAt}) filter (where ${signInFailures.email} = ${e})`,
      lastByPair: sql<string | null>`max(${signInFailures.createdAt}) filter (where ${signInFailures.email} = ${e} and ${signInFailures.clientAddress} = ${clientAddress})`,
      oldestByAddress: sql<string | null>`min(${signInFailures.createdAt}) filter (where ${signInFailures.clientAddress} = ${clientAddress})`,
    })
    .from(signInFailures)
    .where(gt(signInFailures.createdAt, since));
  const r = rows[0];
  const date = (v: string | null | undefined) => (v ? new Date(v) : null);
  return {
    byAccount: r?.byAccount ?? 0,
    byAddress: r?.byAddress ?? 0,
    byPair: r?.byPair ?? 0,
    lastByAccount: date(r?.lastByAccount),
    lastByPair: date(r?.lastByPair),
    oldestByAddress: date(r?.oldestByAddress),
  };
}

/** Forgets failures of an account: all of them (a new password), or one address's (a good sign-in from it). */
export async function clearSignInFailures(email: string, clientAddress?: string): Promise<void> {
  const e = eq(signInFailures.email, normaliseEmail(email));
  await getDb()
    .delete(signInFailures)
    .where(clientAddress === undefined ? e : and(e, eq(signInFailures.clientAddress, clientAddress)));
}

export async function isKnownSignInAddress(userId: string, clientAddress: string): Promise<boolean> {
  const rows = await getDb()
    .select({ id: knownSignInAddresses.id })
    .from(knownSignInAddresses)
    .where(and(eq(knownSignInAddresses.userId, userId), eq(knownSignInAddresses.clientAddress, clientAddress)))
    .limit(1);
  return rows.length > 0;
}

export async function rememberSignInAddress(userId: string, clientAddress: string): Promise<void> {
  const now = new Date();
  await getDb()
    .insert(knownSignInAddresses)
    .values({ userId, clientAddress, lastSeenAt: now })
    .onConflictDoUpdate({ target: [knownSignInAddresses.userId, knownSignInAddresses.clientAddress], set: { lastSeenAt: now, updatedAt: now } });
}

// ---- forgot-password requests ---------------------------------------------

export async function countRecentResetRequests(email: string, clientAddress: string, windowMs: number): Promise<{ byAccount: number; byAddress: number }> {
  const since = new Date(Date.now() - windowMs);
  const e = normaliseEmail(email);
  const rows = await getDb()
    .select({
      byAccount: sql<number>`count(*) filter (where ${passwordResetRequests.email} = ${e})::int`,
      byAddress: sql<number>`count(*) filter (where ${passwordResetRequests.clientAddress} = ${clientAddress})::int`,
    })
    .from(passwordResetRequests)
    .where(gt(passwordResetRequests.createdAt, since));
  return { byAccount: rows[0]?.byAccount ?? 0, byAddress: rows[0]?.byAddress ?? 0 };
}

export async function createResetRequest(email: string, clientAddress: string): Promise<void> {
  await getDb().insert(passwordResetRequests).values({ email: normaliseEmail(email), clientAddress });
}

/** Takes pending requests for processing; two workers never take the same one. */
export async function claimPendingResetRequests(limit = 20): Promise<{ id: number; email: string }[]> {
  const result = await getDb().execute(sql`
    update ${passwordResetRequests} set processed_at = now(), updated_at = now()
    where id in (
      select id from ${passwordResetRequests} where processed_at is null
      order by created_at limit ${limit} for update skip locked
    )
    returning id, email`);
  return (result.rows as { id: string | number; email: string }[]).map((r) => ({ id: Number(r.id), email: r.email }));
}

export async function setUnitsPreference(userId: string, units: "si" | "us" | null): Promise<void> {
  await getDb().update(users).set({ unitsPreference: units, updatedAt: new Date() }).where(eq(users.id, userId));
}
