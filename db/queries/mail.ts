import { and, desc, eq, lt } from "drizzle-orm";
import { getDb } from "../client";
import { redactOneTimeLinks } from "@/modules/platform/mail-redaction";
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

/** Marks a message sent and, when given, replaces its stored text (one-time links removed). */
export async function markEmailSent(id: string, storedText?: string): Promise<void> {
  await getDb()
    .update(outgoingEmails)
    .set({ status: "sent", sentAt: new Date(), updatedAt: new Date(), lastError: null, ...(storedText === undefined ? {} : { text: storedText }) })
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

/**
 * What the instance administrator may read on the outbox: one-time links are removed
 * from every stored message (a queued one still holds its link for the retry), and from
 * what the local fake mail server received unless this is the demo, whose accounts are
 * invented and whose links the reader must be able to follow.
 */
export async function listOutboxForAdmin(limit: number, showReceivedLinks: boolean): Promise<{ outgoing: OutgoingEmailRow[]; received: CapturedEmailRow[] }> {
  const [outgoing, received] = await Promise.all([listOutgoingEmails(limit), listCapturedEmails(limit)]);
  return {
    outgoing: outgoing.map((m) => ({ ...m, text: redactOneTimeLinks(m.text) })),
    received: showReceivedLinks ? received : received.map((m) => ({ ...m, text: redactOneTimeLinks(m.text), raw: redactOneTimeLinks(m.raw) })),
  };
}
