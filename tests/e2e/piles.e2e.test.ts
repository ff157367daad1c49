// Issue 16 in the browser, method "piles": the designer picks the pile cap on vertical piles for
// a block on soil, enters a 2 x 2 group (pile, tip, layout), sees the natural frequencies the
// engine gives for that group, the piles drawn to scale under the block with their text list,
// the soil-springs panel naming the methods, and the save keeps the piles.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { formatSignificant } from "@/modules/units";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("designer: pile cap on a 2 x 2 group", () => {
  it("picks piles, enters the group, sees the engine's frequencies and the pile drawing, and the save keeps the piles", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const piled = example("pile-cap.json");
      // the same cap and pump, first on the equivalent-radius soil springs
      const start = { ...piled, impedance: { method: "equivalent-radius" } };
      const { id } = await seededFoundation(context.request, projectId, "E2E-PILES", start);
      const ws = new WorkspacePage(page);
      await ws.open(projectId, id);
      await ws.waitForState("fresh");

      const method = ws.panel("method");
      await method.getByRole("radio", { name: /^Pile cap on vertical piles/ }).check();
      const fields = page.getByTestId("piles-fields");
      await expect.poll(async () => fields.count()).toBe(1);
      // four blank rows to start with: the draft is incomplete, no analysis yet
      await ws.setNumber(ws.numberField("Pile diameter d", "m"), "0.5");
      await ws.setNumber(ws.numberField("Pile length L", "m"), "14");
      await ws.setNumber(ws.numberField("Young's modulus of the pile Ep", "MPa"), "30000");
      const heads = [
        [-1.4, -0.8],
        [1.4, -0.8],
        [-1.4, 0.8],
        [1.4, 0.8],
      ];
      for (const [i, [x, y]] of heads.entries()) {
        await ws.setNumber(ws.numberField(`Pile ${i + 1} x`, "m"), String(x));
        await ws.setNumber(ws.numberField(`Pile ${i + 1} y`, "m"), String(y));
      }
      await ws.waitForState("fresh");

      // the frequencies are the engine's for the example's group
      const parsed = parseAnalysisInput(piled);
      if (!parsed.ok) throw new Error("pile-cap example invalid");
      const expected = analyse(parsed.input).modes.map((m) => formatSignificant(m.frequencyHz));
      const modes = await textOf(page.getByTestId("modes-table"));
      for (const f of expected) expect(modes).toContain(f);

      // drawn to scale: four circles in plan, two shafts in elevation (two piles behind each), the text list
      expect(await page.getByTestId("piles-plan").locator("circle").count()).toBe(4);
      expect(await page.getByTestId("piles-elevation").locator("rect").count()).toBe(2);
      const list = await textOf(page.getByTestId("piles-text"));
      expect(list).toContain("4 of diameter");
      expect(list).toContain("Pile 3 at x");

      const impedance = await textOf(ws.panel("impedance"));
      expect(impedance).toContain("Dobry & Gazetas (1988)");
      expect(impedance).toContain("Randolph & Wroth");
      expect(impedance).toContain("Static group efficiency");
      await screenshot(page, "designer-piles-2x2");

      await ws.save();
      const saved = await getDraft(context.request, projectId, id);
      expect(saved.input?.impedance).toEqual(piled.impedance);
    });
  });
});
