// axe-core over every page of every demo role: no serious or critical violation anywhere.
// axe is injected through page.evaluate (the devtools protocol), which the page's content
// security policy does not govern; an inline <script> tag would be refused by it.
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { asDemo, asVisitor, sharedBrowser } from "./support/fixtures";
import { DEMO_FOUNDATION_TAGS, projectIdOf, type DemoRole } from "./support/desk";
import { foundationIdByTag } from "./support/revisions";

const browser = sharedBrowser();
const axeSource = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");

interface Violation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[]; failureSummary?: string }[];
}

/** Waits for the page to settle, runs axe and returns its serious and critical violations. */
async function seriousViolations(page: Page, path: string): Promise<string[]> {
  await page.goto(path);
  await page.waitForLoadState("networkidle");
  await page.getByRole("heading", { level: 1 }).first().waitFor({ state: "visible" });
  // Client components (the workspace's live results, the plots) render after hydration.
  await page.waitForTimeout(1500);
  if (!(await page.evaluate(() => "axe" in window))) await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: Violation[] }> } }).axe;
    const out = await axe.run(document, { resultTypes: ["violations"] });
    return out.violations;
  });
  return violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${path}: ${v.id} (${v.impact}) ${v.help}: ${v.nodes.slice(0, 3).map((n) => n.target.join(" ")).join(" | ")}`);
}

/** Links on the current page whose path matches. */
async function hrefsMatching(page: Page, pattern: RegExp): Promise<string[]> {
  const hrefs = await page.locator("a[href]").evaluateAll((as) => as.map((a) => new URL((a as HTMLAnchorElement).href).pathname));
  return [...new Set(hrefs.filter((h) => pattern.test(h)))];
}

const uuid = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";

/** Every page a project member may reach (a page the role may not see answers not-found: checked too). */
async function projectPages(page: Page, role: DemoRole): Promise<string[]> {
  const projectId = projectIdOf(page.url());
  const base = `/projects/${projectId}`;
  const pages = ["/", base, `${base}/requests`, `${base}/members`, `${base}/settings`];
  if (role === "vendor") {
    await page.goto(`${base}/requests`);
    await page.waitForLoadState("networkidle");
    const one = (await hrefsMatching(page, new RegExp(`^${base}/requests/${uuid}$`)))[0];
    if (one) pages.push(one);
    return pages;
  }
  const foundationId = await foundationIdByTag(page.context().request, projectId, DEMO_FOUNDATION_TAGS[0]);
  const foundation = `${base}/foundations/${foundationId}`;
  pages.push(foundation, `${foundation}/revisions`);
  await page.goto(`${foundation}/revisions`);
  await page.waitForLoadState("networkidle");
  const revisions = await hrefsMatching(page, new RegExp(`^${foundation}/revisions/${uuid}$`));
  // the seed gives PH1-P101 revisions A and B
  expect(revisions.length).toBeGreaterThanOrEqual(2);
  const [a, b] = revisions.map((r) => r.split("/").pop());
  pages.push(revisions[0]!, `${foundation}/revisions/compare?from=${a}&to=${b}`);
  await page.goto(`${base}/requests`);
  await page.waitForLoadState("networkidle");
  const request = (await hrefsMatching(page, new RegExp(`^${base}/requests/${uuid}$`)))[0];
  if (request) pages.push(request);
  return pages;
}

describe("accessibility: no serious or critical axe-core violation", () => {
  it("on the signed-out pages (sign-in, forgot password)", async () => {
    await asVisitor(browser(), async ({ page }) => {
      const found: string[] = [];
      for (const path of ["/sign-in", "/forgot-password"]) found.push(...(await seriousViolations(page, path)));
      expect(found).toEqual([]);
    });
  });

  it("on the admin's desk and mail outbox", async () => {
    await asDemo(browser(), "admin", async ({ page }) => {
      const found: string[] = [];
      for (const path of ["/", "/admin/outbox"]) found.push(...(await seriousViolations(page, path)));
      expect(found).toEqual([]);
    });
  });

  for (const role of ["manager", "designer", "checker", "viewer", "vendor"] as const) {
    it(
      `on every page the ${role} can open`,
      async () => {
        await asDemo(browser(), role, async ({ page }) => {
          const pages = await projectPages(page, role);
          const found: string[] = [];
          for (const path of pages) found.push(...(await seriousViolations(page, path)));
          expect(found).toEqual([]);
        });
      },
      240_000,
    );
  }
});
