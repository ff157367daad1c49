// The pages that need no session are prerendered at build time (sign-in, forgot password),
// so no request renders them and no per-request nonce can be put on their scripts. Their
// script policy lists instead the SHA-256 of each inline script the build wrote into the
// page's HTML (CSP Level 3 hash-source), read once per server process from the build output.
// README "Requests and headers" says what this policy allows and why it is no weaker.
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";

/**
 * Each prerendered page by the path the browser asks for. In demo mode `/sign-in` is served
 * from its variant that lists the invented accounts (a second prerendered page), so whether
 * the list shows is decided when the server runs, not when it was built.
 */
export const PRERENDERED_PAGES = ["/sign-in", "/sign-in/demo", "/forgot-password"] as const;
export type PrerenderedPage = (typeof PRERENDERED_PAGES)[number];

export function isPrerenderedPage(pathname: string): pathname is PrerenderedPage {
  return (PRERENDERED_PAGES as readonly string[]).includes(pathname);
}

/** The page actually served for a path: the demo variant of sign-in only in demo mode, never outside it. */
export function servedPage(pathname: PrerenderedPage, demo: boolean): PrerenderedPage {
  if (pathname === "/sign-in" && demo) return "/sign-in/demo";
  if (pathname === "/sign-in/demo" && !demo) return "/sign-in";
  return pathname;
}

/** `'sha256-…'` of every inline `<script>` (one without src) in the HTML, in document order, without repeats. */
export function inlineScriptHashes(html: string): string[] {
  const out: string[] = [];
  for (const m of html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)) {
    const attrs = m[1] ?? "";
    if (/\ssrc\s*=/i.test(attrs)) continue;
    // A script element's text is raw text: the browser hashes exactly these characters (UTF-8).
    const hash = `'sha256-${createHash("sha256").update(m[2] ?? "", "utf8").digest("base64")}'`;
    if (!out.includes(hash)) out.push(hash);
  }
  return out;
}

const memo = new Map<string, string[] | null>();

/**
 * The inline-script hashes of a prerendered page in this server's build, or null when the
 * page is not there as a prerendered file (next dev, or a build that rendered it per
 * request): the caller then uses the nonce policy, as for every other page.
 */
export function prerenderedScriptHashes(page: PrerenderedPage, root = process.cwd(), distDir = process.env.NEXT_DIST_DIR ?? ".next"): string[] | null {
  const file = path.join(root, distDir, "server", "app", `${page}.html`);
  if (memo.has(file)) return memo.get(file) ?? null;
  let hashes: string[] | null = null;
  try {
    hashes = inlineScriptHashes(readFileSync(file, "utf8"));
  } catch {
    hashes = null;
  }
  memo.set(file, hashes);
  return hashes;
}
