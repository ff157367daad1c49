// Runs once per server process: retries queued e-mail every 15 s, so a mail
// server that was down catches up by itself.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { flushEmailQueue } = await import("./app/_lib/mailer");
  const timer = setInterval(() => {
    flushEmailQueue().catch((e: unknown) => console.error("[mail] queue flush failed:", e instanceof Error ? e.message : e));
  }, 15_000);
  timer.unref();
}
