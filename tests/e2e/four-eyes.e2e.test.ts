// Four eyes on the revision page: the draft's editors are listed, and a manager who edited
// the draft gets no verdict form on the revision a designer issued from it (the action
// refuses them too; see tests/integration/four-eyes.test.ts). Issue 19, item 5.
import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { DEMO_FOUNDATION_TAGS, projectIdOf, textOf } from "./support/desk";
import { foundationIdByTag, RevisionPages } from "./support/revisions";

const browser = sharedBrowser();

describe("four eyes on the revision page", () => {
  it("lists who edited the draft; the editing manager gets no verdict form, the checker does", async () => {
    const made = await asDemo(browser(), "manager", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      const source = await foundationIdByTag(context.request, projectId, DEMO_FOUNDATION_TAGS[0]);
      const input = ((await (await context.request.get(`/api/v1/projects/${projectId}/foundations/${source}/draft`)).json()) as { draft: { input: unknown } }).draft.input;
      const created = await context.request.post(`/api/v1/projects/${projectId}/foundations`, { data: { tag: `E2E-4E-${Date.now()}`, machineTrain: "Four eyes", location: "" } });
      expect(created.status()).toBe(201);
      const foundationId = ((await created.json()) as { foundation: { id: string } }).foundation.id;
      const saved = await context.request.put(`/api/v1/projects/${projectId}/foundations/${foundationId}/draft`, { data: { version: 0, input } });
      expect(saved.status()).toBe(200);
      return { projectId, foundationId };
    });
    const issued = await asDemo(browser(), "designer", async ({ context }) => {
      const res = await context.request.post(`/api/v1/projects/${made.projectId}/foundations/${made.foundationId}/revisions`, { data: { note: "Issued for check." } });
      expect(res.status()).toBe(201);
      return ((await res.json()) as { revision: { id: string; editors: { name: string }[] } }).revision;
    });
    const editorName = issued.editors[0]?.name ?? "";
    expect(editorName.length).toBeGreaterThan(0);

    await asDemo(browser(), "manager", async ({ page }) => {
      const revisions = new RevisionPages(page);
      await revisions.open(made.projectId, made.foundationId, issued.id);
      expect(await textOf(page.getByTestId("revision-editors"))).toContain(editorName);
      expect(await page.getByTestId("four-eyes-note").count()).toBe(1);
      expect(await page.getByRole("button", { name: "Approve revision" }).count()).toBe(0);
      await screenshot(page, "four-eyes-manager-editor");
    });
    await asDemo(browser(), "checker", async ({ page }) => {
      const revisions = new RevisionPages(page);
      await revisions.open(made.projectId, made.foundationId, issued.id);
      expect(await textOf(page.getByTestId("revision-editors"))).toContain(editorName);
      expect(await page.getByRole("button", { name: "Approve revision" }).count()).toBe(1);
    });
  });
});
