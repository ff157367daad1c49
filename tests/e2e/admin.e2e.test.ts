import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { DEMO_PROJECT_CODE, DeskHeader, demo, pathOf, textOf } from "./support/desk";

const browser = sharedBrowser();

describe("administrator", () => {
  it("signs in to Your desk (no project memberships) and opens the mail outbox", async () => {
    await asDemo(browser(), "admin", async ({ context, page }) => {
      // An administrator is not sent into a project: the desk lists them.
      expect(pathOf(page)).toBe("/");
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Your desk");
      const who = await new DeskHeader(page).whoamiText();
      expect(who).toContain(demo.admin.name);
      expect(who).toContain("Administrator");
      // The administrator runs the instance and is a member of no demo project.
      await page.getByText("No projects yet").waitFor();
      expect(await page.getByText(DEMO_PROJECT_CODE).count()).toBe(0);
      await page.getByRole("main").getByRole("link", { name: "New project" }).waitFor();

      await page.getByRole("main").getByRole("link", { name: "mail outbox" }).click();
      await page.waitForURL((u) => u.pathname === "/admin/outbox");
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Mail outbox");
      await page.getByRole("heading", { name: "Sent by the desk" }).waitFor();
      await page.getByRole("heading", { name: "Received by the local mail server" }).waitFor();
      await screenshot(page, "admin-outbox");

      // The outbox API answers the administrator too.
      const api = await context.request.get("/api/v1/admin/outbox");
      expect(api.status()).toBe(200);
    });
  });

  it("the outbox is refused to a non-administrator", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      await page.goto("/admin/outbox");
      // (The not-found page answers HTTP 200: the desk layout streams; see the report.)
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Nothing to see here");
      expect(await page.getByRole("heading", { name: "Mail outbox" }).count()).toBe(0);
      const api = await context.request.get("/api/v1/admin/outbox");
      expect(api.status()).toBe(403);
    });
  });
});
