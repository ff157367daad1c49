import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import {
  DEMO_FOUNDATION_TAGS,
  DeskHeader,
  FoundationsPage,
  TeamPage,
  demo,
  projectIdOf,
  textOf,
} from "./support/desk";
import { expectFoundationsHome } from "./support/landing";

const browser = sharedBrowser();

describe("checker", () => {
  it("lands on the foundations page, reads the team, and may add or invite nothing", async () => {
    await asDemo(browser(), "checker", async ({ page }) => {
      await expectFoundationsHome(page, "checker");
      const projectId = projectIdOf(page.url());
      const foundations = new FoundationsPage(page);
      const table = await textOf(foundations.foundationTable);
      for (const tag of DEMO_FOUNDATION_TAGS) expect(table).toContain(tag);
      expect(await foundations.addFoundation.count()).toBe(0);
      await screenshot(page, "checker-home");

      // The checker reads the project's team but gets no invitation form.
      await new DeskHeader(page).nav("Team").click();
      await page.waitForURL((u) => u.pathname === `/projects/${projectId}/members`);
      const team = new TeamPage(page);
      expect(await textOf(team.row(demo.manager.email))).toContain("Manager");
      expect(await page.getByRole("heading", { name: "Invite someone" }).count()).toBe(0);
    });
  });
});
