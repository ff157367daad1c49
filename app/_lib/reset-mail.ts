import { claimPendingResetRequests, createOneTimeToken, getUserByEmail } from "@/db/queries/accounts";
import { recordAuditEvent } from "@/db/queries/audit";
import { appUrl, flushEmailQueue, queueEmail } from "./mailer";

export const RESET_TTL_MS = 60 * 60 * 1000;

/**
 * The off-request half of forgot-password: for each pending request, look the account
 * up and, when there is one, make the link and queue the message; then send the queue.
 * Called right after a request is answered (kickResetMail) and on the server's timer.
 */
export async function processPasswordResetRequests(): Promise<number> {
  let queued = 0;
  for (const req of await claimPendingResetRequests()) {
    const user = await getUserByEmail(req.email);
    if (!user) continue;
    const token = await createOneTimeToken({ purpose: "password-reset", userId: user.id, ttlMs: RESET_TTL_MS });
    await queueEmail({
      to: user.email,
      subject: "Plinthwise: reset your password",
      text: [
        `Hello ${user.name},`,
        "",
        "Someone (hopefully you) asked to reset the password of your Plinthwise account.",
        `Open this link within ${RESET_TTL_MS / 60000} minutes to choose a new one; it works once:`,
        appUrl(`/reset/${token}`),
        "",
        "If you did not ask for this, ignore this message.",
      ].join("\n"),
    });
    await recordAuditEvent({ actorId: user.id, action: "account.reset-requested" });
    queued += 1;
  }
  await flushEmailQueue();
  return queued;
}

let running: Promise<void> | null = null;
let scheduled = false;
let again = false;

/**
 * Starts the worker after the current request has been answered (setImmediate, never
 * awaited by the request); requests that arrive meanwhile are picked up by one more pass.
 */
export function kickResetMail(): void {
  if (running || scheduled) {
    again = true;
    return;
  }
  scheduled = true;
  setImmediate(() => {
    scheduled = false;
    running = (async () => {
      do {
        again = false;
        try {
          await processPasswordResetRequests();
        } catch (e) {
          console.error("[mail] password-reset requests failed:", e instanceof Error ? e.message : e);
        }
      } while (again);
    })().finally(() => {
      running = null;
    });
  });
}

/** For tests: resolves when the worker started by kickResetMail has finished. */
export async function resetMailIdle(): Promise<void> {
  await new Promise((r) => setImmediate(r));
  while (running || scheduled) {
    if (running) await running;
    else await new Promise((r) => setImmediate(r));
  }
}
