// The mail queue shared by several servers (issue 15, item 5): every server flushes the
// outgoing_emails table on its own timer, and the request that queued a message sends it at
// once. Two flushes racing over the same queued messages (as two servers' timers do) send
// each message exactly once: each delivery holds its row lock (SELECT ... FOR UPDATE SKIP
// LOCKED, db/queries/mail.ts deliverQueuedEmail), and a message already sent is skipped.
import { eq, inArray } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { flushEmailQueue, queueEmail, sendEmail } from "@/app/_lib/mailer";
import { closeDb, getDb } from "@/db/client";
import { capturedEmails, outgoingEmails } from "@/db/schema";
import { waitForEmail } from "./support/fixture";

afterAll(async () => {
  await closeDb();
});

describe("the mail queue under two servers", () => {
  it("two racing flushes send each queued message once", async () => {
    const stamp = Date.now();
    const to = Array.from({ length: 6 }, (_, i) => `queue-race-${stamp}-${i}@example.test`);
    const ids: string[] = [];
    for (const t of to) ids.push((await queueEmail({ to: t, subject: `Plinthwise: queue race ${stamp}`, text: `message for ${t}` })).id);
    const [a, b, c] = await Promise.all([flushEmailQueue(), flushEmailQueue(), flushEmailQueue()]);
    // every message went out, by one flush or another, and none twice
    const rows = await getDb().select().from(outgoingEmails).where(inArray(outgoingEmails.id, ids));
    expect(rows.map((r) => r.status)).toEqual(to.map(() => "sent"));
    expect(rows.every((r) => r.attempts === 0)).toBe(true);
    expect(a + b + c).toBeGreaterThanOrEqual(to.length);
    for (const t of to) await waitForEmail(t, `queue race ${stamp}`);
    // a moment for a duplicate, had one been sent, to arrive too
    await new Promise((r) => setTimeout(r, 500));
    const received = await getDb().select().from(capturedEmails).where(eq(capturedEmails.subject, `Plinthwise: queue race ${stamp}`));
    expect(received).toHaveLength(to.length);
    for (const t of to) expect(received.filter((m) => m.envelopeTo.includes(t)), t).toHaveLength(1);
  });

  it("a message sent at once by the request that queued it is not sent again by a flush running meanwhile", async () => {
    const stamp = Date.now();
    const to = `queue-direct-${stamp}@example.test`;
    const [direct] = await Promise.all([sendEmail({ to, subject: `Plinthwise: direct ${stamp}`, text: "once" }), flushEmailQueue(), flushEmailQueue()]);
    const row = (await getDb().select().from(outgoingEmails).where(eq(outgoingEmails.id, direct.id)))[0];
    expect(row?.status).toBe("sent");
    await waitForEmail(to, `direct ${stamp}`);
    await new Promise((r) => setTimeout(r, 500));
    const mine = (await getDb().select().from(capturedEmails).where(eq(capturedEmails.subject, `Plinthwise: direct ${stamp}`))).filter((m) => m.envelopeTo.includes(to));
    expect(mine).toHaveLength(1);
  });
});
