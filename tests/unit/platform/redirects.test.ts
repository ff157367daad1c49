// The sign-in `next` target: only a path on this site, normalised; the known bypass forms give "/".
import { describe, expect, it } from "vitest";
import { safeRedirectPath } from "@/modules/platform/redirects";

const origin = "https://desk.plinthwise.test";

describe("safeRedirectPath", () => {
  it.each([
    ["//evil.test"],
    ["/\\evil.test"],
    ["/\\/evil.test"],
    ["\\\\evil.test"],
    ["\\/evil.test"],
    ["/%5Cevil.test"],
    ["/%5cevil.test"],
    ["/%2F%2Fevil.test"],
    ["/%2f/evil.test"],
    ["https://evil.test"],
    ["https://evil.test/projects"],
    ["http:evil.test"],
    ["javascript:alert(1)"],
    ["JavaScript:alert(1)"],
    ["data:text/html,hi"],
    ["/\t/evil.test"],
    ["/\n/evil.test"],
    ["\t//evil.test"],
    [" //evil.test"],
    ["/%09/evil.test"],
    ["https://desk.plinthwise.test.evil.test/"],
    ["https://desk.plinthwise.test@evil.test/"],
    ["http://desk.plinthwise.test/projects"],
    ["evil.test"],
    [""],
  ])("refuses %j", (next) => {
    const out = safeRedirectPath(next, origin);
    expect(out).toBe("/");
  });

  it.each([
    ["/", "/"],
    ["/projects/4f1c/foundations", "/projects/4f1c/foundations"],
    ["/projects?tab=team#members", "/projects?tab=team#members"],
    ["/projects/../admin/outbox", "/admin/outbox"],
    ["/projects//x", "/projects/x"],
    // Dot segments that would leave `//evil.test` at the front: normalised to a path here.
    ["/..//evil.test", "/evil.test"],
    ["/./..//evil.test", "/evil.test"],
    ["/a/../..//evil.test", "/evil.test"],
    // Our own origin, absolute: reduced to its path.
    ["https://desk.plinthwise.test/projects/4f1c", "/projects/4f1c"],
  ])("accepts %j as %j", (next, expected) => {
    expect(safeRedirectPath(next, origin)).toBe(expected);
  });

  it("refuses non-strings and an absolute URL when no origin is known", () => {
    expect(safeRedirectPath(undefined)).toBe("/");
    expect(safeRedirectPath(42)).toBe("/");
    expect(safeRedirectPath("https://desk.plinthwise.test/projects")).toBe("/");
  });

  it("never returns something a browser reads as another site", () => {
    const samples = ["/\\", "//", "/./", "/..", "/%5C", "\\", "/\u2028/evil", "/\u0000/evil", "/.%2e//evil"];
    for (const s of samples) {
      const out = safeRedirectPath(s, origin);
      expect(out.startsWith("/")).toBe(true);
      expect(out.startsWith("//")).toBe(false);
      expect(out).not.toMatch(/\\/);
      expect(new URL(out, origin).origin).toBe(origin);
    }
  });
});
