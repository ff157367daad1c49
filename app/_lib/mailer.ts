import nodemailer, { type Transporter } from "nodemailer";
import { getServerEnv } from "@/modules/platform/env";
import { deliverQueuedEmail, enqueueEmail, listQueuedEmails } from "@/db/queries/mail";
import type { OutgoingEmailRow } from "@/db/schema";
import { redactOneTimeLinks } from "@/modules/platform/mail-redaction";

// Mail goes through nodemailer over SMTP: a real provider when SMTP_URL says so,
// the local fake server (scripts/fake-smtp.mts) otherwise. Each message is
// written to outgoing_emails first, so a mail server that is down delays the
// message instead of failing the user's action.
const holder = globalThis as unknown as { __plinthMailer?: Transporter };

function getTransport(): Transporter {
  if (!holder.__plinthMailer) {
    // Short timeouts: a mail server that is down must not hold up the user's action.
    const url = new URL(getServerEnv().SMTP_URL);
    for (const [k, v] of [["connectionTimeout", "3000"], ["greetingTimeout", "3000"], ["socketTimeout", "5000"]] as const) {
      if (!url.searchParams.has(k)) url.searchParams.set(k, v);
    }
    holder.__plinthMailer = nodemailer.createTransport(url.toString());
  }
  return holder.__plinthMailer;
}

/** Sends a queued message unless another server has claimed or sent it (deliverQueuedEmail: claim, then SMTP outside any transaction). */
async function deliver(row: OutgoingEmailRow): Promise<boolean> {
  const outcome = await deliverQueuedEmail(row.id, async (locked) => {
    await getTransport().sendMail({ from: getServerEnv().MAIL_FROM, to: locked.to, subject: locked.subject, text: locked.text });
    // The stored copy loses its one-time link once the mail server has the message.
    return redactOneTimeLinks(locked.text);
  });
  return outcome === "sent";
}

export interface EmailMessage {
  to: string;
  subject: string;
  text: string;
}

/** Queues the message and tries to send it at once; returns whether it went out now. */
export async function sendEmail(message: EmailMessage): Promise<{ id: string; sent: boolean }> {
  const row = await enqueueEmail(message);
  const sent = await deliver(row);
  return { id: row.id, sent };
}

/** Queues the message only; the queue sends it (see kickEmailQueue and the 15 s timer). */
export async function queueEmail(message: EmailMessage): Promise<{ id: string }> {
  const row = await enqueueEmail(message);
  return { id: row.id };
}

/** Retries what is still queued (called on a timer by the server and by tests). */
export async function flushEmailQueue(): Promise<number> {
  let sent = 0;
  for (const row of await listQueuedEmails()) if (await deliver(row)) sent += 1;
  return sent;
}

export function appUrl(path: string): string {
  return new URL(path, getServerEnv().APP_URL).toString();
}
