// The workspace's verdicts table with the soil band folded (issue 15 item 2, typing cost): each
// check shows its governing soil case, the passing rows of its other cases are hidden but kept
// in the table, "show all" unfolds them, and printing shows every row and every results panel
// (content-visibility reset in @media print). Read as the checker, so nothing is changed.
import { describe, expect, it } from "vitest";
import { analyse } from "@/modules/calc";
import { foldableSoilCases } from "@/modules/desk/check-soil-cases";
import { sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { DEMO_FOUNDATION_TAGS, projectIdOf } from "./support/desk";
import { WorkspacePage, getDraft } from "./support/workspace";

const browser = sharedBrowser();
const P101 = DEMO_FOUNDATION_TAGS[0];

describe("verdicts table with the soil band folded", () => {
  it("shows one row per check at its governing case, unfolds on demand, and prints every row and panel", async () => {
    await asDemo(browser(), "checker", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const ws = new WorkspacePage(page);
      const foundationId = await ws.openFromTable(P101);
      await ws.waitForState("fresh");
      const draft = await getDraft(context.request, projectId, foundationId);
      const sorted = sortChecksGoverningFirst(analyse(draft.input!).checks);
      const fold = foldableSoilCases(sorted);
      const displayed = () => ws.checkRows().evaluateAll((rows) => rows.filter((r) => getComputedStyle(r).display !== "none").map((r) => r.getAttribute("data-check-key")));

      // every check is still a row of the table (the counts are the engine's); only the folded ones are hidden
      expect(await ws.checkRows().count()).toBe(sorted.length);
      const shown = await displayed();
      expect(shown).toEqual(sorted.filter((_, i) => !fold[i]).map((c) => c.key ?? null));
      expect(shown.length).toBeLessThan(sorted.length);
      // no failing row is hidden
      for (const c of sorted.filter((x) => !x.pass)) expect(shown).toContain(c.key ?? null);
      expect(await page.getByTestId("checks-folded").textContent()).toContain(`${fold.filter(Boolean).length} passing rows at the other cases are folded`);

      const toggle = page.getByTestId("checks-show-all");
      expect(await toggle.getAttribute("aria-expanded")).toBe("false");
      await toggle.click();
      expect(await toggle.getAttribute("aria-expanded")).toBe("true");
      expect((await displayed()).length).toBe(sorted.length);
      await toggle.click();
      expect(await displayed()).toEqual(shown);

      // printed: every row, and no results panel left unrendered
      await page.emulateMedia({ media: "print" });
      expect((await displayed()).length).toBe(sorted.length);
      const lazy = await page.locator(".panel-lazy").evaluateAll((els) => els.map((e) => getComputedStyle(e).contentVisibility));
      expect(lazy.length).toBeGreaterThanOrEqual(6);
      expect(new Set(lazy)).toEqual(new Set(["visible"]));
      await page.emulateMedia({ media: "screen" });
      expect(new Set(await page.locator(".panel-lazy").evaluateAll((els) => els.map((e) => getComputedStyle(e).contentVisibility)))).toEqual(new Set(["auto"]));
    });
  });
});
