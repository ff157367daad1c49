import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import {
  DEMO_PROJECT_CODE,
  DEMO_FOUNDATION_TAGS,
  DeskHeader,
  demo,
  pathOf,
  projectIdOf,
  textOf,
  vendorHomeUrl,
} from "./support/desk";

const browser = sharedBrowser();

describe("vendor", () => {
  it("lands on the data requests and is refused the manager's pages and API", async () => {
    await asDemo(browser(), "vendor", async ({ context, page }) => {
      expect(pathOf(page)).toMatch(vendorHomeUrl);
      const projectId = projectIdOf(page.url());
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Machine data requests");
      const who = await new DeskHeader(page).whoamiText();
      expect(who).toContain(demo.vendor.name);
      expect(who).toContain(`Vendor · ${DEMO_PROJECT_CODE}`);
      // A vendor's navigation offers only the requests.
      const nav = page.getByRole("navigation", { name: "Project" });
      expect(await nav.getByRole("link").allTextContents()).toEqual(["Data requests"]);
      await screenshot(page, "vendor-home");

      // Typing a manager's URLs: the not-found page, never the data.
      for (const path of [`/projects/${projectId}/members`, `/projects/${projectId}`]) {
        await page.goto(path);
        expect(await textOf(page.getByRole("heading", { level: 1 })), path).toBe("Nothing to see here");
        const body = (await page.textContent("body")) ?? "";
        expect(body).not.toContain(demo.manager.email);
        for (const tag of DEMO_FOUNDATION_TAGS) expect(body).not.toContain(tag);
      }
      await screenshot(page, "vendor-refused");

      // The API with the vendor's own cookie: the session is valid...
      const session = await context.request.get("/api/v1/session");
      expect(session.status()).toBe(200);
      expect(JSON.stringify(await session.json())).toContain(demo.vendor.email);
      // ...and the members and project endpoints answer 403 without the data.
      const members = await context.request.get(`/api/v1/projects/${projectId}/members`);
      expect(members.status()).toBe(403);
      const membersBody = await members.text();
      expect(membersBody).not.toContain(demo.manager.email);
      const project = await context.request.get(`/api/v1/projects/${projectId}`);
      expect(project.status()).toBe(403);
      const foundations = await context.request.get(`/api/v1/projects/${projectId}/foundations`);
      expect(foundations.status()).toBe(403);
      expect(await foundations.text()).not.toContain(DEMO_FOUNDATION_TAGS[0]);
    });
  });
});
