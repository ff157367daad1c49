import type { Browser, BrowserContext, Locator, Page } from "playwright-core";
import { appUrl, newContext, SignInPage } from "./browser";

// Fixtures and page objects for the signed-in desk. The demo data is the seed's
// invented scenario; the tests read it, and only ever add throwaway accounts.
export const DEMO_PASSWORD = "plinth-demo-2026";
export const DEMO_PROJECT_CODE = "WRP-PH1";

export const demo = {
  admin: { email: "admin@plinthwise.test", name: "Ines Okafor-Lund" },
  manager: { email: "manager@plinthwise.test", name: "Tomasz Achterberg", roleLabel: "Manager" },
  designer: { email: "designer@plinthwise.test", name: "Priya Valcourt", roleLabel: "Designer" },
  checker: { email: "checker@plinthwise.test", name: "Henrik Osei-Barros", roleLabel: "Checker" },
  vendor: { email: "vendor@corvane-pumps.test", name: "Lucía Brennagh", roleLabel: "Vendor" },
  viewer: { email: "viewer@plinthwise.test", name: "Mateo Lindqvist", roleLabel: "Viewer" },
} as const;

export type DemoRole = keyof typeof demo;

const uuid = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";
/** The foundations page of a project: /projects/<uuid> and nothing after it. */
export const projectHomeUrl = new RegExp(`/projects/${uuid}$`);
/** The vendor's home: /projects/<uuid>/requests. */
export const vendorHomeUrl = new RegExp(`/projects/${uuid}/requests$`);

export function projectIdOf(url: string): string {
  const id = new RegExp(`/projects/(${uuid})`).exec(new URL(url).pathname)?.[1];
  if (!id) throw new Error(`no project id in ${url}`);
  return id;
}

export function pathOf(page: Page): string {
  return new URL(page.url()).pathname;
}

/** Text as the DOM holds it (the role line is upper-cased by CSS only). */
export async function textOf(locator: Locator): Promise<string> {
  await locator.waitFor({ state: "visible" });
  return ((await locator.textContent()) ?? "").replace(/\s+/g, " ").trim();
}

export interface Session {
  context: BrowserContext;
  page: Page;
}

/** Where each demo account lands after signing in (the desk, or its role's home in the demo project). */
export const homeOf: Record<DemoRole, RegExp> = {
  admin: /^\/$/,
  manager: projectHomeUrl,
  designer: projectHomeUrl,
  checker: projectHomeUrl,
  viewer: projectHomeUrl,
  vendor: vendorHomeUrl,
};

/**
 * A fresh context (own cookies) signed in as `email`. Waits for the URL to match
 * `home` (sign-in passes through "/" before the role's home).
 */
export async function signInAs(browser: Browser, email: string, home: RegExp, password = DEMO_PASSWORD): Promise<Session> {
  const context = await newContext(browser);
  const page = await context.newPage();
  const signInPage = new SignInPage(page);
  await signInPage.open();
  await signInPage.signIn(email, password);
  try {
    await page.waitForURL((u) => home.test(u.pathname), { timeout: 20_000 });
  } catch (e) {
    throw new Error(`${email} did not land on ${home} (at ${page.url()})`, { cause: e });
  }
  await new DeskHeader(page).whoami.waitFor({ state: "visible" });
  return { context, page };
}

/** The signed-in shell's header. */
export class DeskHeader {
  constructor(private readonly page: Page) {}
  get whoami(): Locator {
    return this.page.getByTestId("whoami");
  }
  async whoamiText(): Promise<string> {
    return textOf(this.whoami);
  }
  nav(label: string): Locator {
    return this.page.getByRole("navigation", { name: "Project" }).getByRole("link", { name: label, exact: true });
  }
  async signOut(): Promise<void> {
    await this.page.getByRole("button", { name: "Sign out" }).click();
    await this.page.waitForURL((u) => u.pathname === "/sign-in", { timeout: 20_000 });
  }
}

/** A project's foundations page (the home of manager, designer, checker, viewer). */
export class FoundationsPage {
  constructor(private readonly page: Page) {}
  get heading(): Locator {
    return this.page.getByRole("heading", { level: 1 });
  }
  get addFoundation(): Locator {
    return this.page.getByRole("heading", { name: "Add a foundation" });
  }
  get foundationTable(): Locator {
    return this.page.getByTestId("foundation-table");
  }
}

/** The Team page: member table and invitation form. */
export class TeamPage {
  constructor(private readonly page: Page) {}
  async open(projectId: string): Promise<void> {
    await this.page.goto(`/projects/${projectId}/members`);
  }
  get table(): Locator {
    return this.page.getByTestId("member-table");
  }
  row(email: string): Locator {
    return this.table.getByRole("row").filter({ hasText: email });
  }
  async invite(member: { name: string; email: string; role: string; company?: string }): Promise<void> {
    const form = this.page.locator("form").filter({ has: this.page.getByRole("button", { name: "Send invitation" }) });
    await form.getByLabel("Name", { exact: true }).fill(member.name);
    await form.getByLabel("E-mail").fill(member.email);
    await form.getByLabel("Role").selectOption(member.role);
    if (member.company) await form.getByLabel("Company (vendors)").fill(member.company);
    await form.getByRole("button", { name: "Send invitation" }).click();
    await this.page.getByText("Invitation sent.").waitFor({ state: "visible", timeout: 20_000 });
  }
}

/** The administrator's mail outbox. */
export class OutboxPage {
  constructor(private readonly page: Page) {}
  async open(): Promise<void> {
    await this.page.goto("/admin/outbox");
  }
  sentRow(to: string): Locator {
    return this.page.getByTestId("outgoing-table").getByRole("row").filter({ hasText: to });
  }
  received(to: string): Locator {
    return this.page.getByTestId("captured-email").filter({ hasText: to });
  }
  /**
   * The one-time link in the e-mail to `to` that the local mail server received,
   * reloading a few times while delivery catches up.
   */
  async linkIn(to: string, pathPrefix: string): Promise<string> {
    const pattern = new RegExp(`https?://[^\\s]+${pathPrefix}[A-Za-z0-9_-]+`);
    for (let attempt = 0; attempt < 10; attempt += 1) {
      const mail = this.received(to).first();
      if ((await mail.count()) > 0) {
        const match = pattern.exec((await mail.textContent()) ?? "");
        if (match) return match[0];
      }
      await this.page.waitForTimeout(500);
      await this.page.reload();
    }
    throw new Error(`no e-mail to ${to} with a ${pathPrefix} link on the outbox page`);
  }
}

export { appUrl };

export const DEMO_PROJECT_NAME = "Kestrel Bay Reclamation Works: Pump House 1";
export const DEMO_FOUNDATION_TAGS = ["PH1-P101", "PH1-B201"] as const;
