import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { mkdirSync } from "node:fs";
import path from "node:path";

// Debian's chromium driven by playwright-core. The flags keep it from reaching
// for the network this machine does not have.
export const appUrl = process.env.PLINTH_TEST_APP_URL ?? "http://127.0.0.1:3100";
export const artifactsDir = path.join(process.cwd(), "test-artifacts", "screenshots");

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--disable-dev-shm-usage",
    ],
  });
}

export async function newContext(browser: Browser): Promise<BrowserContext> {
  return browser.newContext({ baseURL: appUrl, viewport: { width: 1360, height: 900 } });
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(artifactsDir, { recursive: true });
  await page.screenshot({ path: path.join(artifactsDir, `${name}.png`), fullPage: true });
}

/** Page object for the sign-in screen. */
export class SignInPage {
  constructor(private readonly page: Page) {}
  async open(): Promise<void> {
    await this.page.goto("/sign-in");
  }
  async signIn(email: string, password: string): Promise<void> {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }
}
