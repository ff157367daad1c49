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

/**
 * Hands one queued message to `send` while holding its row lock, and writes the outcome in
 * the same transaction. Several servers share the queue (the 15 s flush of each, and the
 * request that queued a message sending it at once): the lock is taken with SKIP LOCKED, so a
 * message another server is sending, or has sent, is skipped here and never sent twice.
 * `send` resolves with the text to keep (one-time links removed) or throws the failure.
 */
export async function deliverQueuedEmail(id: string, send: (row: OutgoingEmailRow) => Promise<string>, maxAttempts = 20): Promise<"sent" | "failed" | "skipped"> {
  return getDb().transaction(async (tx) => {
    const row = (
      await tx
        .select()
        .from(outgoingEmails)
        .where(and(eq(outgoingEmails.id, id), eq(outgoingEmails.status, "queued"), lt(outgoingEmails.attempts, maxAttempts)))
        .for("update", { skipLocked: true })
    )[0];
    if (!row) return "skipped";
    let storedText: string;
    try {
      storedText = await send(row);
    } catch (e) {
      const attempts = row.attempts + 1;
      const error = (e instanceof Error ? e.message : String(e)).slice(0, 500);
      await tx
        .update(outgoingEmails)
        .set({ attempts, lastError: error, status: attempts >= maxAttempts ? "failed" : "queued", updatedAt: new Date() })
        .where(eq(outgoingEmails.id, row.id));
      return "failed";
    }
    await tx.update(outgoingEmails).set({ status: "sent", sentAt: new Date(), updatedAt: new Date(), lastError: null, text: storedText }).where(eq(outgoingEmails.id, row.id));
    return "sent";
  });
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
