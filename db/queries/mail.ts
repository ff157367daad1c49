import { randomUUID } from "node:crypto";
import { and, desc, eq, lt, or, sql } from "drizzle-orm";
import { getDb } from "../client";
import { redactOneTimeLinks } from "@/modules/platform/mail-redaction";
import { capturedEmails, outgoingEmails, type CapturedEmailRow, type OutgoingEmailRow } from "../schema";

export async function enqueueEmail(input: { to: string; subject: string; text: string }): Promise<OutgoingEmailRow> {
  const rows = await getDb().insert(outgoingEmails).values(input).returning();
  const row = rows[0];
  if (!row) throw new Error("email insert returned nothing");
  return row;
}

/** A message still to send: queued, or claimed by a server whose claim has lapsed. */
function sendable(maxAttempts: number) {
  return and(
    lt(outgoingEmails.attempts, maxAttempts),
    or(eq(outgoingEmails.status, "queued"), and(eq(outgoingEmails.status, "sending"), lt(outgoingEmails.claimedUntil, sql`now()`))),
  );
}

export async function listQueuedEmails(limit = 20, maxAttempts = 20): Promise<OutgoingEmailRow[]> {
  return getDb().select().from(outgoingEmails).where(sendable(maxAttempts)).orderBy(outgoingEmails.createdAt).limit(limit);
}

/** How long a server's claim on a message lasts: well above the transport's timeouts (3 s connect, 5 s socket). */
export const MAIL_CLAIM_SECONDS = 120;

/**
 * Hands one queued message to `send` and writes the outcome. Several servers share the queue
 * (the 15 s flush of each, and the request that queued a message sending it at once), so a
 * message is first claimed in one UPDATE (status "sending", a fresh claim token, a lease of
 * MAIL_CLAIM_SECONDS): of two servers racing for it one gets the row and the other none, and a
 * message another server is sending, or has sent, is skipped here. The SMTP exchange then runs
 * outside any transaction, so no database connection or row lock is held while the mail server
 * answers (it did before). The outcome is written only under the same claim token. A server
 * that dies mid-send leaves the claim to lapse, and another server sends the message again
 * after MAIL_CLAIM_SECONDS (at least once, never twice while a claim holds).
 * `send` resolves with the text to keep (one-time links removed) or throws the failure.
 */
export async function deliverQueuedEmail(id: string, send: (row: OutgoingEmailRow) => Promise<string>, maxAttempts = 20): Promise<"sent" | "failed" | "skipped"> {
  const token = randomUUID();
  const [row] = await getDb()
    .update(outgoingEmails)
    .set({ status: "sending", claimToken: token, claimedUntil: sql`now() + make_interval(secs => ${MAIL_CLAIM_SECONDS})`, updatedAt: new Date() })
    .where(and(eq(outgoingEmails.id, id), sendable(maxAttempts)))
    .returning();
  if (!row) return "skipped";
  const mine = and(eq(outgoingEmails.id, row.id), eq(outgoingEmails.claimToken, token));
  let storedText: string;
  try {
    storedText = await send(row);
  } catch (e) {
    const attempts = row.attempts + 1;
    const error = (e instanceof Error ? e.message : String(e)).slice(0, 500);
    await getDb()
      .update(outgoingEmails)
      .set({ attempts, lastError: error, status: attempts >= maxAttempts ? "failed" : "queued", claimToken: null, claimedUntil: null, updatedAt: new Date() })
      .where(mine);
    return "failed";
  }
  await getDb()
    .update(outgoingEmails)
    .set({ status: "sent", sentAt: new Date(), updatedAt: new Date(), lastError: null, text: storedText, claimToken: null, claimedUntil: null })
    .where(mine);
  return "sent";
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
