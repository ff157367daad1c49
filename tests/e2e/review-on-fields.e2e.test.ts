// Review on the fields, not on paths (issue 18, item 4): issuing asks for a revision note and
// names the failing checks first; the checker comments by choosing a value or a check row on
// the revision page; the designer sees the open comment beside the field in the workspace.
import { describe, expect, it } from "vitest";
import { analyse } from "@/modules/calc";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { RevisionPages, revisionUrl } from "./support/revisions";
import { WorkspacePage, example, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("review on the fields", () => {
  it("the issue dialog lists the failing checks; the checker comments on a chosen value and check; the designer sees the marker beside the field", async () => {
    // A throwaway copy of the pump train whose mass-ratio limit (20, deliberately out of
    // reach) makes at least that check fail, so the confirmation must appear.
    const input = example("raw-water-pump-train.json");
    input.criteria = { ...(input.criteria ?? {}), minMassRatio: 20 };
    const failing = analyse(input).checks.filter((c) => !c.pass);
    expect(failing.map((c) => c.id)).toContain("mass-ratio");

    const made = await asDemo(browser(), "manager", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      const f = await seededFoundation(context.request, projectId, "E2E-RF", input);
      return { projectId, foundationId: f.id };
    });

    // 1. The designer issues it: a note is required, and the failing checks are named first.
    const note = "Mass-ratio limit raised to 20 to try the confirmation; nothing else changed.";
    const revisionId = await asDemo(browser(), "designer", async ({ page }) => {
      const revisions = new RevisionPages(page);
      await revisions.openList(made.projectId, made.foundationId);
      const dialog = page.getByTestId("issue-failing-dialog");
      await page.getByRole("button", { name: "Issue for check" }).click();
      await dialog.waitFor({ state: "visible" });
      const listed = await dialog.getByTestId("issue-failing-checks").getByRole("listitem").allInnerTexts();
      expect(listed.map((t) => t.trim())).toEqual(failing.map((c) => c.label));
      await screenshot(page, "review-issue-failing-checks");
      await dialog.getByRole("button", { name: "Go back" }).click();
      await dialog.waitFor({ state: "hidden" });
      await page.getByRole("button", { name: "Issue for check" }).click();
      // Issuing anyway without a note: the server names the field, nothing is issued.
      await dialog.getByRole("button", { name: "Issue anyway" }).click();
      await page.getByText("Write a revision note: what changed and why").first().waitFor({ state: "visible", timeout: 20_000 });
      expect(revisionUrl.test(new URL(page.url()).pathname)).toBe(false);

      const id = await revisions.issue(note);
      expect(await textOf(page.getByTestId("revision-note"))).toContain(note);
      await revisions.openList(made.projectId, made.foundationId);
      expect(await textOf(page.getByTestId("revision-table"))).toContain(note);
      return id;
    });

    // 2. The checker chooses Poisson's ratio by clicking its value, then a check row by keyboard.
    await asDemo(browser(), "checker", async ({ page }) => {
      const revisions = new RevisionPages(page);
      await revisions.open(made.projectId, made.foundationId, revisionId);
      await page.getByTitle("Comment on Soil · Poisson's ratio", { exact: true }).click();
      expect(await textOf(page.getByTestId("field-comment-label"))).toBe("Soil · Poisson's ratio");
      await revisions.commentBox.getByLabel("Comment", { exact: true }).fill("Which borehole gives this Poisson's ratio?");
      await revisions.commentBox.getByRole("button", { name: "Post comment" }).click();
      await revisions.commentBox.getByText("Comment posted.").waitFor({ state: "visible", timeout: 20_000 });
      await screenshot(page, "review-checker-field-comment");

      const checkButton = page.getByTitle("Comment on Check · mass ratio", { exact: true });
      await checkButton.focus();
      await page.keyboard.press("Enter");
      await page.getByTestId("field-comment-label").filter({ hasText: "Check · mass ratio" }).waitFor({ state: "visible" });
      await revisions.commentBox.getByLabel("Comment", { exact: true }).fill("A ratio of 20 is not a project criterion; state its source.");
      await revisions.commentBox.getByRole("button", { name: "Post comment" }).click();
      await revisions.commentBox.getByText("Comment posted.").waitFor({ state: "visible", timeout: 20_000 });

      await page.reload();
      const comments = await textOf(page.getByTestId("revision-comments"));
      expect(comments).toContain("Soil · Poisson's ratio");
      expect(comments).toContain("Check · mass ratio");
      expect(comments).not.toContain("soil.poissonRatio");
    });

    // 3. The designer sees the marker beside the field and the list that leads to it.
    await asDemo(browser(), "designer", async ({ page }) => {
      const ws = new WorkspacePage(page);
      await ws.open(made.projectId, made.foundationId);
      const list = page.getByTestId("open-review-comments");
      await list.waitFor({ state: "visible" });
      const listed = await textOf(list);
      expect(listed).toContain("Open review comments (2)");
      expect(listed).toContain("Which borehole gives this Poisson's ratio?");
      expect(listed).toContain("Check · mass ratio");
      const marker = page.getByTestId("panel-soil").getByTestId("field-comment-marker");
      expect(await marker.count()).toBe(1);
      expect(await textOf(marker)).toBe("1 comment");
      await marker.focus();
      await page.getByRole("tooltip").filter({ hasText: "Which borehole gives this Poisson's ratio?" }).waitFor({ state: "visible" });
      await screenshot(page, "review-designer-marker");
      await list.getByRole("link", { name: "Go to the field" }).click();
      await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute("name")), { timeout: 10_000 }).toBe("soil.poissonRatio");
    });
  });
});
