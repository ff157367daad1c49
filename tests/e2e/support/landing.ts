import { expect } from "vitest";
import type { Page } from "playwright-core";
import { DEMO_PROJECT_CODE, DEMO_PROJECT_NAME, DeskHeader, FoundationsPage, pathOf, projectHomeUrl, textOf, demo } from "./desk";

type ProjectRole = "manager" | "designer" | "checker" | "viewer";

/**
 * The home of every role that reads the project: its foundations page with the
 * project's name as the heading, and the header naming the person and the role.
 */
export async function expectFoundationsHome(page: Page, role: ProjectRole): Promise<void> {
  expect(pathOf(page)).toMatch(projectHomeUrl);
  const foundations = new FoundationsPage(page);
  expect(await textOf(foundations.heading)).toBe(DEMO_PROJECT_NAME);
  expect(await page.title()).toContain("Foundations");
  const who = await new DeskHeader(page).whoamiText();
  expect(who).toContain(demo[role].name);
  expect(who).toContain(`${demo[role].roleLabel} · ${DEMO_PROJECT_CODE}`);
}
