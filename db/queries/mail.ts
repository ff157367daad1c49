import { and, desc, eq, lt } from "drizzle-orm";
import { getDb } from "../client";
import { capturedEmails, outgoingEmails, type CapturedEmailRow, type OutgoingEmailRow } from "../schema";

export async function enqueueEmail(input: { to: string; subject: string; text: string }): Promise<OutgoingEmailRow> {
  const rows = await getDb().insert(outgoingEmails).values(input).returning();
  const row = rows[0];
  if (!row) throw new Error("email insert returned nothing");
  return row;
}

export async function listQueuedEmails(limit = 20, maxAttempts = 20): Promise<OutgoingEmailRow[]> {
  return getDb()
    .select()
    .from(outgoingEmails)
    .where(and(eq(outgoingEmails.status, "queued"), lt(outgoingEmails.attempts, maxAttempts)))
    .orderBy(outgoingEmails.createdAt)
    .limit(limit);
}

export async function markEmailSent(id: string): Promise<void> {
  await getDb()
    .update(outgoingEmails)
    .set({ status: "sent", sentAt: new Date(), updatedAt: new Date(), lastError: null })
    .where(eq(outgoingEmails.id, id));
}

export async function markEmailAttemptFailed(row: OutgoingEmailRow, error: string, maxAttempts = 20): Promise<void> {
  const attempts = row.attempts + 1;
  await getDb()
    .update(outgoingEmails)
    .set({ attempts, lastError: error.slice(0, 500), status: attempts >= maxAttempts ? "failed" : "queued", updatedAt: new Date() })
    .where(eq(outgoingEmails.id, row.id));
}

export async function listOutgoingEmails(limit = 100): Promise<OutgoingEmailRow[]> {
  return getDb().select().from(outgoingEmails).orderBy(desc(outgoingEmails.createdAt)).limit(limit);
}

export async function storeCapturedEmail(input: { envelopeFrom: string; envelopeTo: string[]; subject: string; text: string; raw: string }): Promise<void> {
  await getDb().insert(capturedEmails).values(input);
}

export async function listCapturedEmails(limit = 100): Promise<CapturedEmailRow[]> {
  return getDb().select().from(capturedEmails).orderBy(desc(capturedEmails.createdAt)).limit(limit);
}
