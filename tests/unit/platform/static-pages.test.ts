// The script policy of the prerendered pages (app/_lib/static-pages.ts): inline scripts named
// by SHA-256 of their exact text, external ones skipped, and the demo variant of sign-in
// served only in demo mode.
import { mkdtempSync, mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { inlineScriptHashes, isPrerenderedPage, prerenderedScriptHashes, servedPage } from "@/app/_lib/static-pages";

describe("inline script hashes", () => {
  it("matches the hash-source example of the CSP Level 3 specification (W3C, §2.3.1; value recalled from memory, recomputed here)", () => {
    // CSP3's example: <script>alert('Hello, world.');</script> is allowed by 'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='
    expect(inlineScriptHashes("<p>x</p><script>alert('Hello, world.');</script>")).toEqual(["'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"]);
  });

  it("hashes the empty script as SHA-256 of nothing (FIPS 180-4 test value e3b0c442…, base64 47DEQpj8…)", () => {
    expect(inlineScriptHashes("<script></script>")).toEqual(["'sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU='"]);
  });

  it("skips scripts with src, keeps the raw text (entities are not decoded inside a script), lists each hash once", () => {
    const html = `<script src="/_next/static/chunks/a.js" async=""></script><script>alert('Hello, world.');</script><script id="x">alert('Hello, world.');</script><script>a&amp;b</script>`;
    const hashes = inlineScriptHashes(html);
    expect(hashes).toHaveLength(2);
    expect(hashes[0]).toBe("'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='");
    expect(hashes[1]).not.toBe(inlineScriptHashes("<script>a&b</script>")[0]);
  });

  it("reads a prerendered page from the build folder, and gives null when the page was not prerendered", () => {
    const root = mkdtempSync(path.join(tmpdir(), "plinth-static-"));
    mkdirSync(path.join(root, ".next-x", "server", "app"), { recursive: true });
    writeFileSync(path.join(root, ".next-x", "server", "app", "forgot-password.html"), "<script>alert('Hello, world.');</script>");
    expect(prerenderedScriptHashes("/forgot-password", root, ".next-x")).toEqual(["'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"]);
    expect(prerenderedScriptHashes("/sign-in", root, ".next-x")).toBeNull();
  });
});

describe("which prerendered page is served", () => {
  it("serves the demo accounts' variant of sign-in only in demo mode", () => {
    expect(servedPage("/sign-in", true)).toBe("/sign-in/demo");
    expect(servedPage("/sign-in", false)).toBe("/sign-in");
    expect(servedPage("/sign-in/demo", false)).toBe("/sign-in");
    expect(servedPage("/forgot-password", true)).toBe("/forgot-password");
  });

  it("knows only the pages that need no session", () => {
    expect(isPrerenderedPage("/sign-in")).toBe(true);
    expect(isPrerenderedPage("/forgot-password")).toBe(true);
    expect(isPrerenderedPage("/")).toBe(false);
    expect(isPrerenderedPage("/reset/abc")).toBe(false);
    expect(isPrerenderedPage("/sign-in/")).toBe(false);
  });
});
