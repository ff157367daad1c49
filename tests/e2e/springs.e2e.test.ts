// Issue 16 in the browser, method "springs": the designer switches a foundation on soil to an
// inertia block on steel springs, enters four springs, sees the natural frequencies and the
// isolation efficiency the engine gives for them, the springs drawn at their positions under the
// block with their text list, the bearing-pressure check marked not applicable and the no-lift-off
// checks, and the save keeps the springs.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { formatSignificant } from "@/modules/units";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("designer: inertia block on four steel springs", () => {
  it("picks springs, enters four, sees the engine's frequencies and isolation, the springs drawn and listed, and the save keeps them", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const sprung = example("fan-on-springs.json");
      // the same block and fan, first on the equivalent-radius soil springs
      const start = { ...sprung, impedance: { method: "equivalent-radius" } };
      const { id } = await seededFoundation(context.request, projectId, "E2E-SPRINGS", start);
      const ws = new WorkspacePage(page);
      await ws.open(projectId, id);
      await ws.waitForState("fresh");

      const method = ws.panel("method");
      await method.getByRole("radio", { name: /^Inertia block on steel springs/ }).check();
      // four blank rows to start with
      await expect.poll(async () => page.getByLabel(/^Spring \d+ kz/).count()).toBe(4);
      if (sprung.impedance.method !== "springs") throw new Error("fan-on-springs example is not on springs");
      for (const [i, s] of sprung.impedance.springs.entries()) {
        await ws.setNumber(ws.numberField(`Spring ${i + 1} x`, "m"), String(s.x));
        await ws.setNumber(ws.numberField(`Spring ${i + 1} y`, "m"), String(s.y));
        // catalogue stiffness typed in MN/m (4e5 N/m = 0.4 MN/m)
        await ws.setNumber(ws.numberField(`Spring ${i + 1} kz`, "MN/m"), String(s.kz / 1e6));
        await ws.setNumber(ws.numberField(`Spring ${i + 1} kh`, "MN/m"), String(s.kh / 1e6));
      }
      await ws.waitForState("fresh");

      // the frequencies and the isolation are the engine's for the example's springs
      const parsed = parseAnalysisInput(sprung);
      if (!parsed.ok) throw new Error("fan-on-springs example invalid");
      const result = analyse(parsed.input);
      const modes = await textOf(page.getByTestId("modes-table"));
      for (const m of result.modes) expect(modes).toContain(formatSignificant(m.frequencyHz));
      const impedance = await textOf(ws.panel("impedance"));
      const isolation = result.springs!.rotors[0]!.isolation;
      expect(isolation.length).toBeGreaterThan(0);
      for (const row of isolation) expect(impedance).toContain(`${formatSignificant(row.isolationEfficiency * 100)} %`);
      expect(impedance).toContain("Static load per spring");

      // drawn at their positions: four in plan, two in elevation (two springs behind each), the text list
      expect(await page.getByTestId("springs-plan").locator("[data-spring]").count()).toBe(4);
      expect(await page.getByTestId("springs-elevation").locator("[data-spring]").count()).toBe(2);
      expect(await page.getByTestId("springs-plan").locator("[data-damper]").count()).toBe(0);
      const list = await textOf(page.getByTestId("springs-text"));
      expect(list).toContain("4 at their positions");
      expect(list).toContain("Spring 3 at x");
      expect(await page.getByTestId("springs-list").locator("li").count()).toBe(4);

      // the soil bearing pressure is not the load path: shown for information, not applicable
      const bearing = ws.checksTable.locator('tbody tr[data-check-key="bearing-pressure"]');
      expect(await bearing.getAttribute("data-verdict")).toBe("not-applicable");
      expect(await textOf(bearing)).toContain("through the springs");
      // every spring stays in compression (no lift-off)
      expect(await ws.checksTable.locator('tbody tr[data-check-key^="spring-compression/"]').count()).toBe(4);
      await screenshot(page, "designer-springs-4");

      await ws.save();
      const saved = await getDraft(context.request, projectId, id);
      expect(saved.input?.impedance).toEqual(sprung.impedance);
    });
  });
});
