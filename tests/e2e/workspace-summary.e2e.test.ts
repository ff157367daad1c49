// The compact results summary stays in view while the inputs are edited (sticky at desktop
// widths), follows the inputs, links into the full sections, and sits in the flow on a phone.
import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { DEMO_FOUNDATION_TAGS, projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("results in view while editing", () => {
  it("keeps the governing check, frequencies and soil band in view at the foot of the inputs, and follows a change", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const { id: foundationId } = await seededFoundation(context.request, projectId, "E2E-SUMMARY", example("raw-water-pump-train.json"));
      const ws = new WorkspacePage(page);
      await ws.open(projectId, foundationId);
      await ws.waitForState("fresh");
      const summary = page.getByTestId("results-summary");
      await page.locator('[data-testid="results-summary"][data-state="current"]').waitFor({ state: "visible", timeout: 20_000 });
      // the demo pump train is governed by the separation at the upper soil bound, and the band fails
      expect(await textOf(summary.getByTestId("results-summary-governing"))).toMatch(/^Governing: fail At the upper soil bound/);
      expect(await textOf(summary.getByTestId("results-summary-band"))).toMatch(/^Soil band: fail \d+ of \d+ band checks fail$/);
      const before = await textOf(summary.getByTestId("results-summary-frequencies"));
      expect(before).toMatch(/^f: [\d.,\s]+ Hz$/);

      // at the foot of the inputs (the mat-sizing panel) the summary is still on screen
      await ws.panel("sizing").scrollIntoViewIfNeeded();
      await page.evaluate(() => window.scrollBy(0, 400));
      const box = await summary.boundingBox();
      expect(box).not.toBeNull();
      expect(box!.y).toBeGreaterThanOrEqual(0);
      expect(box!.y + box!.height).toBeLessThanOrEqual(900);
      expect(await page.evaluate(() => window.scrollY)).toBeGreaterThan(1000);
      await screenshot(page, "workspace-summary-sticky");

      // a longer mat changes the frequencies; the summary follows once the result is fresh
      await ws.setNumber(ws.box(1, "x", "to"), "4.4");
      await ws.waitForState("fresh");
      await page.locator('[data-testid="results-summary"][data-state="current"]').waitFor({ state: "visible", timeout: 20_000 });
      await expect.poll(async () => textOf(summary.getByTestId("results-summary-frequencies")), { timeout: 20_000 }).not.toBe(before);

      // the frequencies link leads to the full table
      await summary.getByTestId("results-summary-frequencies").click();
      await page.waitForURL((u) => u.hash === "#modes");
      await ws.panel("modes").waitFor({ state: "visible" });
    });
  });

  // A designer's workspace (the viewer sees issued revisions only, not the draft desk).
  it("sits in the flow, not stuck, on a phone-sized screen", async () => {
    await asDemo(browser(), "designer", async ({ page }) => {
      await page.setViewportSize({ width: 390, height: 844 });
      const projectId = projectIdOf(page.url());
      const ws = new WorkspacePage(page);
      await ws.openFromTable(DEMO_FOUNDATION_TAGS[0]);
      await ws.heading.waitFor({ state: "visible" });
      const summary = page.getByTestId("results-summary");
      await summary.waitFor({ state: "visible" });
      expect(await summary.evaluate((el) => getComputedStyle(el).position)).toBe("static");
      const box = await summary.boundingBox();
      expect(box!.width).toBeLessThanOrEqual(390);
      expect(projectId).toMatch(/^[0-9a-f-]{36}$/);
      await screenshot(page, "workspace-summary-phone");
      // in the flow: scrolled well past it, it leaves the screen instead of covering the inputs
      await page.evaluate(() => window.scrollBy(0, 2000));
      const after = await summary.boundingBox();
      expect(after!.y + after!.height).toBeLessThan(0);
    });
  });
});
