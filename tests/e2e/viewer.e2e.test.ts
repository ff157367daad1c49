import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import {
  DEMO_FOUNDATION_TAGS,
  DeskHeader,
  FoundationsPage,
  demo,
  pathOf,
  projectIdOf,
  textOf,
} from "./support/desk";
import { expectFoundationsHome } from "./support/landing";

const browser = sharedBrowser();

describe("viewer", () => {
  it("reads the foundations without the add form, signs out, and the back button does not show the desk", async () => {
    await asDemo(browser(), "viewer", async ({ context, page }) => {
      await expectFoundationsHome(page, "viewer");
      const projectId = projectIdOf(page.url());
      const foundations = new FoundationsPage(page);
      await page.getByRole("heading", { name: "Foundations", level: 2 }).waitFor();
      expect(await foundations.addFoundation.count()).toBe(0);
      expect(await page.getByRole("button", { name: /add foundation/i }).count()).toBe(0);
      // A viewer has no Team page, in the navigation or by URL.
      const header = new DeskHeader(page);
      expect(await header.nav("Foundations").count()).toBe(1);
      expect(await header.nav("Team").count()).toBe(0);
      await screenshot(page, "viewer-home");
      await page.goto(`/projects/${projectId}/members`);
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Nothing to see here");
      expect(await page.getByTestId("member-table").count()).toBe(0);
      await page.goBack();
      await expectFoundationsHome(page, "viewer");

      // Signing out returns to the sign-in page...
      await header.signOut();
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Sign in to the desk");
      await screenshot(page, "viewer-signed-out");
      // ...the session is over for the API...
      const session = await context.request.get("/api/v1/session");
      expect(session.status()).toBe(401);
      // ...and the back button does not bring the desk back, not even for a moment:
      // watch the DOM for the header or a foundation tag while history goes back.
      await page.evaluate((tag) => {
        const w = window as unknown as { __deskSeen: string[] };
        w.__deskSeen = [];
        new MutationObserver(() => {
          if (document.querySelector('[data-testid="whoami"]') || document.body.innerText.includes(tag)) w.__deskSeen.push(location.pathname);
        }).observe(document, { subtree: true, childList: true, characterData: true });
      }, DEMO_FOUNDATION_TAGS[0]);
      const visited: string[] = [];
      page.on("framenavigated", (frame) => {
        if (frame === page.mainFrame()) visited.push(new URL(frame.url()).pathname);
      });
      await page.goBack();
      await page.waitForURL((u) => u.pathname === "/sign-in");
      await page.waitForTimeout(1000);
      // History did go back to the project (so this is not a no-op) and was sent to sign in.
      expect(visited).toContain(`/projects/${projectId}`);
      const seen = await page.evaluate(() => (window as unknown as { __deskSeen?: string[] }).__deskSeen ?? []);
      expect(seen).toEqual([]);
      expect(await page.getByTestId("whoami").count()).toBe(0);
      expect(await page.getByText(demo.viewer.name).count()).toBe(0);
      expect(pathOf(page)).toBe("/sign-in");
      // Opening the project directly sends a signed-out browser to sign in.
      await page.goto(`/projects/${projectId}`);
      expect(pathOf(page)).toBe("/sign-in");
    });
  });
});
