import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { APIRequestContext } from "playwright-core";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { changeDraft, foundationIdByTag, RevisionPages } from "./support/revisions";
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

  // Issue 18 item 5 and issue 12 item 4: the client's journey. A foundation of its own gets
  // revision A approved by the checker and revision B issued after it (in check), through
  // the API as the designer and the checker; the viewer then sees A as the latest approved
  // revision with its package, B without one, and no way into the draft.
  it("sees the latest approved revision with its package, an unapproved one without, and no draft", async () => {
    const tag = `ZZ-E2E-CLIENT-${Date.now().toString(36)}`;
    const ids = await asDemo(browser(), "designer", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      const request: APIRequestContext = context.request;
      const created = await request.post(`/api/v1/projects/${projectId}/foundations`, { data: { tag, machineTrain: "Client journey", location: "" } });
      expect(created.status()).toBe(201);
      const foundationId = await foundationIdByTag(request, projectId, tag);
      const input = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "aeration-blower.json"), "utf8")) as unknown;
      const saved = await request.put(`/api/v1/projects/${projectId}/foundations/${foundationId}/draft`, { data: { version: 0, input } });
      expect(saved.status()).toBe(200);
      const a = await request.post(`/api/v1/projects/${projectId}/foundations/${foundationId}/revisions`, { data: { note: "Issued for the client journey." } });
      expect(a.status()).toBe(201);
      const revisionA = ((await a.json()) as { revision: { id: string } }).revision.id;
      return { projectId, foundationId, revisionA };
    });
    await asDemo(browser(), "checker", async ({ context }) => {
      const res = await context.request.post(`/api/v1/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions/${ids.revisionA}/decision`, {
        data: { outcome: "approved", note: "Approved for construction (browser test)." },
      });
      expect(res.status()).toBe(201);
    });
    const revisionB = await asDemo(browser(), "designer", async ({ context }) => {
      await changeDraft(context.request, ids.projectId, ids.foundationId, (input) => (input.soil.poissonRatio = 0.31));
      const b = await context.request.post(`/api/v1/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions`, { data: { note: "Issued for the client journey." } });
      expect(b.status()).toBe(201);
      return ((await b.json()) as { revision: { id: string } }).revision.id;
    });

    await asDemo(browser(), "viewer", async ({ page, context }) => {
      await expectFoundationsHome(page, "viewer");
      // The project table: the tag leads to the revisions, never the workspace (no draft link);
      // latest approved A beside latest issued B; no open-comments column.
      const row = page.getByTestId("foundation-table").locator("tr", { hasText: tag });
      await row.waitFor();
      const workspaceHref = `/projects/${ids.projectId}/foundations/${ids.foundationId}`;
      expect(await page.locator(`a[href="${workspaceHref}"]`).count()).toBe(0);
      expect(await row.getByRole("link", { name: tag }).getAttribute("href")).toBe(`${workspaceHref}/revisions`);
      expect(await textOf(row.getByTestId("latest-approved"))).toBe("A");
      expect(await page.getByTestId("foundation-table").getByRole("button", { name: /open comments/i }).count()).toBe(0);
      await screenshot(page, "viewer-latest-approved");

      // The revisions: A marked latest approved, B in check; no comment column.
      const revisions = new RevisionPages(page);
      await row.getByRole("link", { name: tag }).click();
      await page.waitForURL((u) => u.pathname === `${workspaceHref}/revisions`);
      await revisions.heading.waitFor();
      const table = page.getByTestId("revision-table");
      expect(await textOf(table.locator("tr", { hasText: "latest approved" }).locator("td").first())).toBe("A");
      expect(await table.getByRole("columnheader", { name: "Open comments" }).count()).toBe(0);
      expect(await page.locator(`a[href="${workspaceHref}"]`).count()).toBe(0);

      // A: approved, its approval note, its package offered; no review comments section.
      await revisions.open(ids.projectId, ids.foundationId, ids.revisionA);
      expect(await page.getByTestId("package-download").count()).toBe(1);
      expect(await page.getByText("Approved for construction (browser test).").count()).toBe(1);
      expect(await page.getByTestId("latest-approved-note").count()).toBe(1);
      expect(await page.getByRole("heading", { name: "Review comments" }).count()).toBe(0);
      const okPackage = await context.request.get(`/api/v1/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions/${ids.revisionA}/package`);
      expect(okPackage.status()).toBe(200);

      // B: in check, readable, but its package is not offered and the API refuses it.
      await revisions.open(ids.projectId, ids.foundationId, revisionB);
      expect(await page.getByTestId("package-download").count()).toBe(0);
      expect(await page.getByTestId("package-pdf-download").count()).toBe(0);
      expect(await page.getByTestId("package-not-released").count()).toBe(1);
      expect(await page.getByRole("heading", { name: "Review comments" }).count()).toBe(0);
      const refused = await context.request.get(`/api/v1/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions/${revisionB}/package`);
      expect(refused.status()).toBe(403);
      await screenshot(page, "viewer-unapproved-revision");

      // The workspace by URL is the not-found page, and the draft API answers 403.
      await page.goto(workspaceHref);
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Nothing to see here");
      const draft = await context.request.get(`/api/v1/projects/${ids.projectId}/foundations/${ids.foundationId}/draft`);
      expect(draft.status()).toBe(403);
    });
  });
});
