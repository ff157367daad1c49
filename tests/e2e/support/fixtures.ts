import { afterAll, beforeAll } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser, newContext } from "./browser";
import { demo, homeOf, signInAs, type DemoRole, type Session } from "./desk";

/** One Chromium per test file: launched before its tests, closed after them. */
export function sharedBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error("the browser is not running (beforeAll failed?)");
    return browser;
  };
}

/** Runs `journey` in a fresh context signed in as the demo account of `role`, then closes it. */
export async function asDemo<T>(browser: Browser, role: DemoRole, journey: (session: Session) => Promise<T>): Promise<T> {
  const session = await signInAs(browser, demo[role].email, homeOf[role]);
  try {
    return await journey(session);
  } finally {
    await session.context.close();
  }
}

/** Runs `journey` in a fresh, signed-out context, then closes it. */
export async function asVisitor<T>(browser: Browser, journey: (session: Session) => Promise<T>): Promise<T> {
  const context = await newContext(browser);
  try {
    return await journey({ context, page: await context.newPage() });
  } finally {
    await context.close();
  }
}
