// Runs once per server process: records each request's socket address where route
// handlers can read it (app/_lib/client-address.ts), and retries queued e-mail (and
// pending password-reset requests) every 15 s, so a mail server that was down catches up
// by itself.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { installPeerAddressHook } = await import("./app/_lib/client-address");
  installPeerAddressHook();
  const { processPasswordResetRequests } = await import("./app/_lib/reset-mail");
  const timer = setInterval(() => {
    // Takes pending forgot-password requests, then sends everything queued.
    processPasswordResetRequests().catch((e: unknown) => console.error("[mail] queue flush failed:", e instanceof Error ? e.message : e));
  }, 15_000);
  timer.unref();
}
