import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { DEMO_FOUNDATION_TAGS, DeskHeader, FoundationsPage, textOf } from "./support/desk";
import { expectFoundationsHome } from "./support/landing";

const browser = sharedBrowser();

describe("designer", () => {
  it("lands on the foundations page with both demo foundations and the add form", async () => {
    await asDemo(browser(), "designer", async ({ page }) => {
      await expectFoundationsHome(page, "designer");
      const foundations = new FoundationsPage(page);
      const table = await textOf(foundations.foundationTable);
      for (const tag of DEMO_FOUNDATION_TAGS) expect(table).toContain(tag);
      await foundations.addFoundation.waitFor({ state: "visible" });
      const header = new DeskHeader(page);
      expect(await header.nav("Data requests").count()).toBe(1);
      expect(await header.nav("Team").count()).toBe(1);
      await screenshot(page, "designer-home");
    });
  });
});
