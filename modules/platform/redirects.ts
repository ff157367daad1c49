/**
 * The one check on where to send someone after signing in (the `next` parameter).
 *
 * Only a path on this site is accepted, returned normalised; anything else gives "/".
 * Browsers treat `\` as `/` and drop tabs and newlines inside a URL, so `/\evil`,
 * `/\t/evil` or `\\evil` are other sites to them: such characters are refused outright
 * (also percent-encoded, since `%5C` and `%2F` decode to them further along). An absolute
 * URL to our own origin is reduced to its path; every other absolute URL is refused.
 */
export function safeRedirectPath(next: unknown, ownOrigin?: string): string {
  if (typeof next !== "string" || next.length === 0 || next.length > 2000) return "/";
  // Control characters, whitespace and backslashes, raw or percent-encoded.
  if (/[\u0000-\u0020\u007f\\]/.test(next)) return "/";
  if (/%(?:5c|2f|0[0-9a-f]|1[0-9a-f]|20|7f)/i.test(next)) return "/";
  let candidate = next;
  if (!candidate.startsWith("/")) {
    // Only an absolute URL to our own origin may stand in for a path.
    if (!ownOrigin) return "/";
    let url: URL;
    try {
      url = new URL(candidate);
    } catch {
      return "/";
    }
    if (url.origin !== new URL(ownOrigin).origin) return "/";
    candidate = `${url.pathname}${url.search}${url.hash}`;
  }
  if (candidate.startsWith("//")) return "/";
  const base = "http://plinthwise.invalid";
  let resolved: URL;
  try {
    resolved = new URL(candidate, base);
  } catch {
    return "/";
  }
  if (resolved.origin !== base) return "/";
  // Dot segments can leave `//host` at the front (`/..//evil`): collapse repeated slashes.
  const path = resolved.pathname.replace(/\/{2,}/g, "/");
  const result = `${path}${resolved.search}${resolved.hash}`;
  return result.startsWith("/") && !result.startsWith("//") ? result : "/";
}
