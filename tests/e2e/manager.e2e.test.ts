import { describe, expect, it } from "vitest";
import { sharedBrowser } from "./support/fixtures";
import { appUrl, newContext, screenshot } from "./support/browser";
import {
  DEMO_FOUNDATION_TAGS,
  DEMO_PROJECT_CODE,
  DEMO_PROJECT_NAME,
  DeskHeader,
  FoundationsPage,
  OutboxPage,
  TeamPage,
  demo,
  pathOf,
  projectIdOf,
  homeOf,
  signInAs,
  textOf,
} from "./support/desk";
import { expectFoundationsHome } from "./support/landing";

const browser = sharedBrowser();

describe("manager", () => {
  it("lands on the foundations page, invites a member from Team, and the invitee sets a password and lands in the project", async () => {
    const stamp = Date.now();
    const invitee = { name: `Rosalind Test ${stamp}`, email: `invitee-${stamp}@example.test`, role: "checker" };

    const manager = await signInAs(browser(), demo.manager.email, homeOf.manager);
    const admin = await signInAs(browser(), demo.admin.email, homeOf.admin);
    const fresh = await newContext(browser());
    try {
      const { page } = manager;
      await expectFoundationsHome(page, "manager");
      const projectId = projectIdOf(page.url());
      const foundations = new FoundationsPage(page);
      for (const tag of DEMO_FOUNDATION_TAGS) expect(await textOf(foundations.foundationTable)).toContain(tag);
      await foundations.addFoundation.waitFor({ state: "visible" });
      await screenshot(page, "manager-home");

      // The manager's API view of the team, for contrast with the vendor's 403.
      const apiMembers = await manager.context.request.get(`/api/v1/projects/${projectId}/members`);
      expect(apiMembers.status()).toBe(200);
      expect(await apiMembers.text()).toContain(demo.vendor.email);

      // Team: invite someone new.
      await new DeskHeader(page).nav("Team").click();
      await page.waitForURL((u) => u.pathname === `/projects/${projectId}/members`);
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Project team");
      const team = new TeamPage(page);
      await team.invite(invitee);
      await page.reload();
      const invitedRow = await textOf(team.row(invitee.email));
      expect(invitedRow).toContain(invitee.name);
      expect(invitedRow).toContain("Checker");
      expect(invitedRow).toContain("invited");
      await screenshot(page, "manager-invited");

      // The invitation e-mail shows on the administrator's outbox page.
      const outbox = new OutboxPage(admin.page);
      await outbox.open();
      expect(await textOf(outbox.sentRow(invitee.email))).toContain(`Plinthwise: you are invited to ${DEMO_PROJECT_CODE}`);
      const link = await outbox.linkIn(invitee.email, "/invite/");
      expect(new URL(link).origin, "the invitation link points at the app").toBe(new URL(appUrl).origin);
      expect(await textOf(outbox.received(invitee.email).first())).toContain(DEMO_PROJECT_NAME);
      await screenshot(admin.page, "admin-outbox-invitation");

      // The invitee follows the link in a browser of their own.
      const invitePage = await fresh.newPage();
      await invitePage.goto(link);
      expect(await textOf(invitePage.getByRole("heading", { level: 1 }))).toBe("Welcome to Plinthwise");
      expect(await textOf(invitePage.getByText(`Set a password for ${invitee.email}`))).toContain(invitee.email);
      expect(await invitePage.getByLabel("Your name").inputValue()).toBe(invitee.name);
      const password = `invitee-pass-${stamp}`;
      await invitePage.getByLabel("New password").fill(password);
      await invitePage.getByLabel("Repeat it").fill(password);
      await invitePage.getByRole("button", { name: "Set password and open the project" }).click();
      await invitePage.waitForURL((u) => u.pathname === `/projects/${projectId}`, { timeout: 20_000 });
      expect(await textOf(invitePage.getByRole("heading", { level: 1 }))).toBe(DEMO_PROJECT_NAME);
      const who = await new DeskHeader(invitePage).whoamiText();
      expect(who).toContain(invitee.name);
      expect(who).toContain(`Checker · ${DEMO_PROJECT_CODE}`);
      await screenshot(invitePage, "invitee-landed");

      // The link worked once.
      const again = await newContext(browser());
      try {
        const againPage = await again.newPage();
        await againPage.goto(link);
        expect(await textOf(againPage.getByRole("heading", { level: 1 }))).toBe("This invitation no longer works");
        expect(pathOf(againPage)).toMatch(/^\/invite\//);
      } finally {
        await again.close();
      }

      // The manager now sees the member as active.
      await page.reload();
      expect(await textOf(team.row(invitee.email))).toContain("active");
    } finally {
      await fresh.close();
      await admin.context.close();
      await manager.context.close();
    }
  });
});
