import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { createHash, randomBytes } from "node:crypto";
import { getDb } from "../client";
import { oneTimeTokens, sessions, signInFailures, users, type UserRow } from "../schema";

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

// ---- sign-in throttling ---------------------------------------------------

export async function recordSignInFailure(email: string, clientAddress: string): Promise<void> {
  await getDb().insert(signInFailures).values({ email: normaliseEmail(email), clientAddress });
}

export async function countRecentFailures(email: string, clientAddress: string, windowMs: number): Promise<{ byAccount: number; byAddress: number; oldestByAccount: Date | null; oldestByAddress: Date | null }> {
  const since = new Date(Date.now() - windowMs);
  const rows = await getDb()
    .select({
      byAccount: sql<number>`count(*) filter (where ${signInFailures.email} = ${normaliseEmail(email)})::int`,
      byAddress: sql<number>`count(*) filter (where ${signInFailures.clientAddress} = ${clientAddress})::int`,
      oldestByAccount: sql<string | null>`min(${signInFailures.createdAt}) filter (where ${signInFailures.email} = ${normaliseEmail(email)})`,
      oldestByAddress: sql<string | null>`min(${signInFailures.createdAt}) filter (where ${signInFailures.clientAddress} = ${clientAddress})`,
    })
    .from(signInFailures)
    .where(gt(signInFailures.createdAt, since));
  const r = rows[0];
  return {
    byAccount: r?.byAccount ?? 0,
    byAddress: r?.byAddress ?? 0,
    oldestByAccount: r?.oldestByAccount ? new Date(r.oldestByAccount) : null,
    oldestByAddress: r?.oldestByAddress ? new Date(r.oldestByAddress) : null,
  };
}

export async function clearSignInFailures(email: string): Promise<void> {
  await getDb().delete(signInFailures).where(eq(signInFailures.email, normaliseEmail(email)));
}

export async function setUnitsPreference(userId: string, units: "si" | "us" | null): Promise<void> {
  await getDb().update(users).set({ unitsPreference: units, updatedAt: new Date() }).where(eq(users.id, userId));
}
