import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { DEMO_FOUNDATION_TAGS, FoundationsPage, projectIdOf, textOf } from "./support/desk";
import { changeDraft, foundationIdByTag, RevisionPages } from "./support/revisions";

const browser = sharedBrowser();
const P101 = DEMO_FOUNDATION_TAGS[0];

describe("revisions", () => {
  it("designer issues, checker compares with the demo's revision A, comments and returns; designer re-issues; checker approves; the project page shows it approved", async () => {
    // 1. The designer changes the draft and issues it from the workspace's revision bar.
    const first = await asDemo(browser(), "designer", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      const foundationId = await foundationIdByTag(context.request, projectId, P101);
      await changeDraft(context.request, projectId, foundationId, (input) => {
        input.soil.poissonRatio = Math.round(((input.soil.poissonRatio ?? 0.3) + 0.01) * 1000) / 1000;
      });
      await page.goto(`/projects/${projectId}/foundations/${foundationId}`);
      await page.getByTestId("revision-bar").getByRole("link", { name: "Issue for check…" }).click();
      await page.waitForURL((u) => u.pathname.endsWith("/revisions"), { timeout: 20_000 });
      const revisions = new RevisionPages(page);
      const revisionId = await revisions.issue();
      expect(await textOf(revisions.status)).toBe("in check");
      expect(await page.getByTestId("cautions").count()).toBe(1);
      await screenshot(page, "revisions-designer-issued");
      return { projectId, foundationId, revisionId, label: await revisions.label() };
    });
    expect(first.label).not.toBe("A");

    // 2. The checker compares it with revision A, comments on a field and returns it.
    await asDemo(browser(), "checker", async ({ page, context }) => {
      const revisions = new RevisionPages(page);
      await revisions.openList(first.projectId, first.foundationId);
      await revisions.compare("A", first.label);
      // Rows read by the quantity's name in display units; the raw path is on hover and in the download.
      const inputs = await textOf(page.getByTestId("diff-input"));
      expect(inputs).toContain("soil · Poisson's ratio");
      expect(inputs).toContain("Raw-water pump RWP-101 · impeller · mass");
      expect(inputs).not.toContain("soil.poissonRatio");
      const poisson = page.getByTestId("diff-input").locator('[data-path="soil.poissonRatio"] td').first();
      expect(await poisson.getAttribute("title")).toBe("soil.poissonRatio");
      const mass = page.getByTestId("diff-input").getByTestId("diff-row").filter({ hasText: "Raw-water pump RWP-101 · impeller · mass" }).first();
      expect(await mass.getAttribute("data-path")).toBe('machines["Raw-water pump RWP-101"].rotors["impeller"].mass');
      // the demo project is in SI; a checker who switched to US customary sees pounds
      const shown = await page.getByTestId("units-note").getAttribute("data-units");
      expect(await textOf(mass.locator("td").nth(3))).toBe(shown === "us" ? "lb" : "kg");
      expect(await textOf(page.getByTestId("noise-rule"))).toContain("1 nm displacement");
      const csvHref = await page.getByTestId("download-csv").getAttribute("href");
      expect(csvHref).toContain("format=csv");
      const csv = await context.request.get(csvHref ?? "");
      expect(csv.status()).toBe(200);
      expect(csv.headers()["content-disposition"]).toMatch(/^attachment; filename="compare-A-/);
      const csvText = await csv.text();
      expect(csvText.split("\r\n")[0]).toMatch(/^group,label,path,change,/);
      expect(csvText).toContain("inputs,soil · Poisson's ratio,soil.poissonRatio,changed,");
      // The overlaid plots draw once their container has been measured.
      await page.getByTestId("compare-plot-displacement").locator("svg").first().waitFor({ state: "visible", timeout: 20_000 });
      expect(await page.getByTestId("cautions").count()).toBe(1);
      await screenshot(page, "revisions-checker-compare");

      await revisions.open(first.projectId, first.foundationId, first.revisionId);
      await revisions.comment("Soil · Poisson's ratio", "Which borehole gives this Poisson's ratio? Use the report's value or cite it.");
      await revisions.decide("Return with comments", "See the comment on Poisson's ratio.");
      await page.reload();
      expect(await textOf(revisions.status)).toBe("returned with comments");
      expect(await textOf(page.getByTestId("revision-comments"))).toContain("Soil · Poisson's ratio");
      await screenshot(page, "revisions-checker-returned");
    });

    // 3. The designer answers with a changed draft and issues again.
    const second = await asDemo(browser(), "designer", async ({ page, context }) => {
      await changeDraft(context.request, first.projectId, first.foundationId, (input) => {
        input.soil.poissonRatio = 0.3;
      });
      const revisions = new RevisionPages(page);
      await revisions.openList(first.projectId, first.foundationId);
      const revisionId = await revisions.issue();
      expect(await textOf(revisions.status)).toBe("in check");
      // The designer gets no verdict buttons on a revision they issued.
      expect(await page.getByRole("button", { name: "Approve revision" }).count()).toBe(0);
      return { revisionId, label: await revisions.label() };
    });
    expect(second.label).not.toBe(first.label);

    // 4. The checker approves it, and the project page shows the foundation approved.
    await asDemo(browser(), "checker", async ({ page }) => {
      const revisions = new RevisionPages(page);
      await revisions.open(first.projectId, first.foundationId, second.revisionId);
      await revisions.decide("Approve revision");
      await page.reload();
      expect(await textOf(revisions.status)).toBe("approved");
      await page.goto(`/projects/${first.projectId}`);
      const row = new FoundationsPage(page).foundationTable.getByRole("row").filter({ hasText: P101 });
      const text = await textOf(row);
      expect(text).toContain("approved");
      expect(text).toContain(second.label);
      await screenshot(page, "revisions-project-approved");
    });
  });

  it("a vendor gets the not-found page for a foundation's revisions", async () => {
    const ids = await asDemo(browser(), "designer", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      return { projectId, foundationId: await foundationIdByTag(context.request, projectId, P101) };
    });
    await asDemo(browser(), "vendor", async ({ page }) => {
      const res = await page.goto(`/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions`);
      expect(res?.status()).toBe(404);
      expect(await page.content()).not.toContain("revision-table");
    });
  });
});
