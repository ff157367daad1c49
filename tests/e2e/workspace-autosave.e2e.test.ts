import { describe, expect, it } from "vitest";
import type { Dialog, Page } from "playwright-core";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { DeskHeader, pathOf, projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation, workspaceUrl } from "./support/workspace";

const browser = sharedBrowser();

/** Answers the next dialog (confirm or beforeunload) and resolves with it. */
function nextDialog(page: Page, answer: "accept" | "dismiss"): Promise<Dialog> {
  return new Promise((resolve) => {
    page.once("dialog", (d) => {
      void (answer === "accept" ? d.accept() : d.dismiss()).then(() => resolve(d));
    });
  });
}

/** Fails the test if a dialog opens while `action` runs. */
async function withoutDialog(page: Page, action: () => Promise<void>): Promise<void> {
  let opened: string | null = null;
  const onDialog = (d: Dialog) => {
    opened = d.message();
    void d.dismiss();
  };
  page.on("dialog", onDialog);
  try {
    await action();
  } finally {
    page.off("dialog", onDialog);
  }
  expect(opened).toBeNull();
}

describe("no silent loss of edits in the workspace", () => {
  it("an edit saves itself after a pause and is there after leaving by a header link and coming back", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const { id, tag } = await seededFoundation(context.request, projectId, "E2E-AUTOSAVE", example("raw-water-pump-train.json"));
      const ws = new WorkspacePage(page);
      await page.reload(); // the foundations table lists the new foundation
      await ws.openFromTable(tag);
      await ws.waitForState("fresh");
      expect(await ws.saveStatus()).toBe("clean");
      expect(await ws.shownVersion()).toBe(1);

      await ws.setNumber(ws.box(1, "x", "to", "m"), "4.1");
      // (On a busy machine the pause may already be over here, so "saving…" is right too.)
      expect(["unsaved", "saving", "saved"]).toContain(await ws.saveStatus());
      // No button pressed: the draft saves itself once typing pauses.
      await ws.waitForSaveStatus("saved");
      expect(await textOf(ws.saveState)).toMatch(/^saved .* · v2$/);
      const stored = await getDraft(context.request, projectId, id);
      expect(stored.version).toBe(2);
      expect(stored.input!.block.solids[0]!.x).toEqual([-3.8, 4.1]);

      // Saved, so leaving asks nothing.
      await withoutDialog(page, async () => {
        await new DeskHeader(page).nav("Foundations").click();
        await page.waitForURL((u) => !workspaceUrl.test(u.pathname), { timeout: 20_000 });
      });
      await page.getByTestId("foundation-table").waitFor({ state: "visible" });
      await ws.openFromTable(tag);
      await ws.waitForState("fresh");
      expect(await ws.box(1, "x", "to", "m").inputValue()).toBe("4.1");
      expect(await ws.shownVersion()).toBe(2);
    });
  });

  it("leaving with unsaved changes asks first: a header link, the back button, closing the tab, the project switcher", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const { id, tag } = await seededFoundation(context.request, projectId, "E2E-LEAVE", example("raw-water-pump-train.json"));
      const ws = new WorkspacePage(page);
      await page.reload();
      await ws.openFromTable(tag);
      const here = pathOf(page);
      await ws.waitForState("fresh");

      // Saves are held at the network until released, so the edit is still unsaved whatever
      // the speed of the machine when the link is clicked.
      let release: () => void = () => undefined;
      const gate = new Promise<void>((r) => (release = r));
      await page.route("**/draft", async (route) => {
        if (route.request().method() === "PUT") await gate;
        await route.continue();
      });

      // A header link with unsaved changes: asked; staying keeps the page and the edit.
      await ws.setNumber(ws.box(1, "y", "to", "m"), "1.9");
      expect(["unsaved", "saving"]).toContain(await ws.saveStatus());
      const asked = nextDialog(page, "dismiss");
      await new DeskHeader(page).nav("Team").click();
      const dialog = await asked;
      expect(dialog.type()).toBe("confirm");
      expect(dialog.message()).toContain("not saved");
      expect(pathOf(page)).toBe(here);
      expect(await ws.box(1, "y", "to", "m").inputValue()).toBe("1.9");

      // The browser's back button with unsaved changes: asked; staying keeps the page and the edit.
      const askedBack = nextDialog(page, "dismiss");
      await page.goBack({ timeout: 5000 }).catch(() => null);
      expect((await askedBack).message()).toContain("not saved");
      await page.waitForURL((u) => u.pathname === here, { timeout: 10_000 });
      await ws.heading.waitFor({ state: "visible" });
      expect(await ws.box(1, "y", "to", "m").inputValue()).toBe("1.9");

      // Once the network lets the save through, it is stored and leaving would ask nothing.
      release();
      await ws.waitForSaveStatus("saved");
      await page.unroute("**/draft");
      expect((await getDraft(context.request, projectId, id)).input!.block.solids[0]!.y).toEqual([-1.6, 1.9]);

      // A form that cannot be saved (a field in error) is never sent on its own: it stays
      // unsaved, says so, and leaving still asks.
      const before = await getDraft(context.request, projectId, id);
      await ws.setNumber(ws.box(1, "y", "to", "m"), "wide");
      await ws.waitForSaveStatus("invalid");
      expect(await textOf(ws.saveState)).toContain("fix the fields marked in red");
      await page.waitForTimeout(3000); // longer than the autosave pause
      expect(await ws.saveStatus()).toBe("invalid");
      expect((await getDraft(context.request, projectId, id)).version).toBe(before.version);
      await screenshot(page, "designer-autosave-invalid");

      // Closing the tab: the browser's own leave-page question (beforeunload), and staying keeps it open.
      const askedClose = nextDialog(page, "dismiss");
      await page.close({ runBeforeUnload: true });
      expect((await askedClose).type()).toBe("beforeunload");
      expect(page.isClosed()).toBe(false);
      expect(await ws.saveStatus()).toBe("invalid");

      // The header's project switcher navigates without a link: it asks too, and staying keeps the page.
      const askedSwitch = nextDialog(page, "dismiss");
      await page.getByLabel("Switch project").selectOption("");
      expect((await askedSwitch).message()).toContain("not saved");
      expect(pathOf(page)).toBe(here);
      expect(await page.getByLabel("Switch project").inputValue()).toBe(projectId);

      // Agreeing to leave by a link goes, and the unsaved junk never reached the server.
      const leave = nextDialog(page, "accept");
      await new DeskHeader(page).nav("Foundations").click();
      await leave;
      await page.waitForURL((u) => u.pathname !== here, { timeout: 20_000 });
      expect((await getDraft(context.request, projectId, id)).input!.block.solids[0]!.y).toEqual([-1.6, 1.9]);
    });
  });
});
