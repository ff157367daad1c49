/**
 * Which address a request comes from, for throttling and the audit trail.
 *
 * `peer` is the address of the TCP socket (the only value a client cannot choose);
 * `forwardedFor` is the X-Forwarded-For header as received. With no trusted proxy the
 * header is ignored: anyone can send it. With `trustedHops` proxies in front of us, each
 * one appends the address it was connected from, so the client is the entry that the
 * outermost trusted proxy appended: counting the socket peer as the last hop, the entry
 * `trustedHops` places left of it. Entries further left were written by the client and
 * are never used. (The same rule as a hop count in Express's `trust proxy`.)
 */
export function pickClientAddress(input: { peer: string | null; forwardedFor: string | null; trustedHops: number }): string {
  const peer = normaliseAddress(input.peer);
  if (input.trustedHops <= 0 || !peer) return peer ?? "unknown";
  const hops = (input.forwardedFor ?? "")
    .split(",")
    .map((h) => normaliseAddress(h))
    .filter((h): h is string => h !== null);
  const chain = [...hops, peer];
  // Fewer entries than trusted proxies: the request skipped a proxy or the count is too
  // high; the leftmost entry is still one a trusted hop wrote (or the socket itself).
  return chain[Math.max(0, chain.length - 1 - input.trustedHops)] ?? peer;
}

/** Trims, drops the IPv4-mapped IPv6 prefix and caps the length; null when empty. */
export function normaliseAddress(raw: string | null | undefined): string | null {
  if (!raw) return null;
  let a = raw.trim();
  if (!a) return null;
  if (a.toLowerCase().startsWith("::ffff:") && a.includes(".")) a = a.slice(7);
  return a.slice(0, 64);
}
