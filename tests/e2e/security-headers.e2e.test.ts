// Security headers on the production build, and no content-security-policy
// violation while a workspace with charts renders.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { appUrl, launchBrowser, newContext, SignInPage } from "./support/browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser.close();
});

describe("security headers", () => {
  it("pages and API answers carry CSP (no unsafe-eval), frame-ancestors none, nosniff and a referrer policy", async () => {
    for (const path of ["/sign-in", "/api/health"]) {
      const res = await fetch(`${appUrl}${path}`);
      const csp = res.headers.get("content-security-policy") ?? "";
      expect(csp, path).toContain("default-src 'self'");
      expect(csp, path).toContain("frame-ancestors 'none'");
      expect(csp, path).not.toContain("unsafe-eval");
      expect(res.headers.get("x-content-type-options")).toBe("nosniff");
      expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
      expect(res.headers.get("x-powered-by")).toBeNull();
    }
  });

  it("a cross-site POST to the API is refused", async () => {
    const res = await fetch(`${appUrl}/api/v1/session`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: "https://evil.example" },
      body: JSON.stringify({ email: "designer@plinthwise.test", password: "plinth-demo-2026" }),
    });
    expect(res.status).toBe(403);
    expect(res.headers.get("set-cookie")).toBeNull();
  });

  it("the workspace renders its charts without a CSP violation", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    const violations: string[] = [];
    page.on("console", (m) => {
      if (/Content Security Policy|Refused to (execute|load|apply)/i.test(m.text())) violations.push(m.text());
    });
    const s = new SignInPage(page);
    await s.open();
    await s.signIn("designer@plinthwise.test", "plinth-demo-2026");
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    await page.getByRole("link", { name: "PH1-B201" }).click();
    await page.getByTestId("plot-displacement").locator("svg path").first().waitFor({ timeout: 30_000 });
    expect(violations).toEqual([]);
    await ctx.close();
  });
});
