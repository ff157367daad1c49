// The mail queue shared by several servers (issue 15, item 5): every server flushes the
// outgoing_emails table on its own timer, and the request that queued a message sends it at
// once. Two flushes racing over the same queued messages (as two servers' timers do) send
// each message exactly once: each delivery first claims its row in one UPDATE (status
// "sending", a claim token and a lease; db/queries/mail.ts deliverQueuedEmail), sends outside
// any transaction, and writes the outcome under its own token; a message already claimed or
// sent is skipped, and a lapsed claim is taken over.
import { eq, inArray, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { flushEmailQueue, queueEmail, sendEmail } from "@/app/_lib/mailer";
import { deliverQueuedEmail, enqueueEmail } from "@/db/queries/mail";
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

  it("the claim is committed before the SMTP exchange: meanwhile another connection reads the message as sending, so no transaction is held while SMTP answers", async () => {
    const row = await enqueueEmail({ to: `claim-${Date.now()}@example.test`, subject: "Plinthwise: claim", text: "claimed" });
    let seen: { status: string; claimedUntil: Date | null } | undefined;
    const outcome = await deliverQueuedEmail(row.id, async () => {
      // another pooled connection: it reads "sending" only if the claim was committed (read
      // committed), so the send runs outside the claiming transaction
      const [r] = await getDb().select().from(outgoingEmails).where(eq(outgoingEmails.id, row.id));
      seen = { status: r?.status ?? "", claimedUntil: r?.claimedUntil ?? null };
      return "kept text";
    });
    expect(outcome).toBe("sent");
    expect(seen?.status).toBe("sending");
    expect(seen!.claimedUntil!.getTime()).toBeGreaterThan(Date.now() + 60_000);
    const [after] = await getDb().select().from(outgoingEmails).where(eq(outgoingEmails.id, row.id));
    expect(after).toMatchObject({ status: "sent", text: "kept text", claimToken: null, claimedUntil: null, attempts: 0 });
  });

  it("a live claim is skipped; a lapsed one is taken over, and the first server's late outcome does not overwrite the second's", async () => {
    const row = await enqueueEmail({ to: `lease-${Date.now()}@example.test`, subject: "Plinthwise: lease", text: "lease" });
    await getDb().update(outgoingEmails).set({ status: "sending", claimedUntil: sql`now() + interval '1 minute'` }).where(eq(outgoingEmails.id, row.id));
    expect(await deliverQueuedEmail(row.id, async () => "never")).toBe("skipped");
    expect((await getDb().select().from(outgoingEmails).where(eq(outgoingEmails.id, row.id)))[0]?.status).toBe("sending");
    await getDb().update(outgoingEmails).set({ status: "queued", claimedUntil: null }).where(eq(outgoingEmails.id, row.id));
    // server A claims; while it is (slowly) sending its claim lapses and server B takes the message over
    const a = await deliverQueuedEmail(row.id, async () => {
      await getDb().update(outgoingEmails).set({ claimedUntil: sql`now() - interval '1 second'` }).where(eq(outgoingEmails.id, row.id));
      const b = await deliverQueuedEmail(row.id, async () => "sent by B");
      expect(b).toBe("sent");
      return "sent by A";
    });
    expect(a).toBe("sent");
    const [after] = await getDb().select().from(outgoingEmails).where(eq(outgoingEmails.id, row.id));
    expect(after).toMatchObject({ status: "sent", text: "sent by B" });
  });

  it("a failed send puts the message back in the queue with the error and releases the claim", async () => {
    const row = await enqueueEmail({ to: `fail-${Date.now()}@example.test`, subject: "Plinthwise: fail", text: "fail" });
    expect(await deliverQueuedEmail(row.id, async () => { throw new Error("421 try later"); })).toBe("failed");
    const [after] = await getDb().select().from(outgoingEmails).where(eq(outgoingEmails.id, row.id));
    expect(after).toMatchObject({ status: "queued", attempts: 1, lastError: "421 try later", claimToken: null, claimedUntil: null });
    await getDb().update(outgoingEmails).set({ status: "sent" }).where(eq(outgoingEmails.id, row.id));
  });
});
