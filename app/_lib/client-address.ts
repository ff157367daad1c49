import { subscribe } from "node:diagnostics_channel";
import type { IncomingMessage } from "node:http";
import type { Socket } from "node:net";
import { getTrustedProxyHops } from "@/modules/platform/env";
import { pickClientAddress } from "@/modules/platform/client-address";
import type { RequestPort } from "./request-context";

/**
 * The socket's address, as a request header our own code writes.
 *
 * Under `next start` a route handler or server action sees only headers, and Next 16
 * copies the socket address into X-Forwarded-For only when the client sent none
 * (`req.headers['x-forwarded-for'] ??= socket.remoteAddress` in next/dist/server/base-server.js),
 * so a client that sends the header hides its socket address. Node publishes every
 * incoming request on the `http.server.request.start` diagnostics channel before the
 * server's request listener (Next's) runs; our subscriber overwrites this header there
 * with the socket's address, whatever the client sent under that name.
 */
export const PEER_ADDRESS_HEADER = "x-plinthwise-peer";

const holder = globalThis as unknown as { __plinthPeerHook?: boolean };

/** Installed once per server process (instrumentation.ts); idempotent. */
export function installPeerAddressHook(): void {
  if (holder.__plinthPeerHook) return;
  subscribe("http.server.request.start", (message) => {
    const { request, socket } = message as { request: IncomingMessage; socket: Socket };
    request.headers[PEER_ADDRESS_HEADER] = socket.remoteAddress ?? "unknown";
  });
  holder.__plinthPeerHook = true;
}

let warned = false;

/**
 * The one place that says which address a request comes from (throttling, audit).
 * Without the hook in this process the header could have come from the client, so it
 * is not read: every request then counts as one address (safe for throttling, and
 * logged once, since it means the server was started without instrumentation.ts).
 */
export function clientAddressOf(port: RequestPort): string {
  if (!holder.__plinthPeerHook) {
    if (!warned) {
      warned = true;
      console.warn("[client-address] peer hook not installed: all requests share one throttling address");
    }
    return "unknown";
  }
  return pickClientAddress({
    peer: port.getHeader(PEER_ADDRESS_HEADER),
    forwardedFor: port.getHeader("x-forwarded-for"),
    trustedHops: getTrustedProxyHops(),
  });
}
