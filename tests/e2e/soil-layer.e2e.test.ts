// Issue 13 in the browser: a designer puts the embedded pump set on a soil layer over rock;
// the explanation shows the stratum factors and cutoffs the engine computes, the response
// plots mark the cutoffs, and the saved draft keeps the depth to rock.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { formatSignificant } from "@/modules/units";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("designer: soil layer over rock", () => {
  it("enters the depth to rock, sees the factors and cutoffs, the plot marks them, and the save keeps it", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const start = example("gazetas-embedded.json");
      const { id } = await seededFoundation(context.request, projectId, "E2E-ROCK", start);
      const ws = new WorkspacePage(page);
      await ws.open(projectId, id);
      await ws.waitForState("fresh");
      // a half-space: no stratum line and no cutoff marks
      expect(await page.getByTestId("stratum-cutoffs").count()).toBe(0);
      expect(await page.getByTestId("cutoff-marker").count()).toBe(0);

      const soil = ws.panel("soil");
      await soil.getByLabel("one soil layer over rock").check();
      await ws.setNumber(soil.getByLabel("Depth from grade to rock H (m)", { exact: true }), "6");
      await ws.waitForState("fresh");

      const parsed = parseAnalysisInput({ ...start, soil: { ...start.soil, stratum: { thickness: 6, base: "rigid" } } });
      if (!parsed.ok) throw new Error("stratum input invalid");
      const expected = analyse(parsed.input).impedance.details!;
      const line = await textOf(page.getByTestId("stratum-cutoffs"));
      expect(line).toContain("H = 6.00 m");
      expect(line).toContain(`vertical and rocking ${formatSignificant(expected.cutoffHzCompression!)} Hz`);
      expect(line).toContain(`sliding and torsion ${formatSignificant(expected.cutoffHzShear!)} Hz`);
      const factors = await textOf(page.getByTestId("soil-factors"));
      expect(factors).toContain("Stratum factor (layer over rock)");
      // every table prints through the one formatter (3 significant figures)
      expect(factors).toContain(formatSignificant(expected.stratumFactorZ!));
      expect(factors).toContain("Kausel (1974)");
      // both cutoffs lie inside the default sweep: each plot marks two lines
      expect(await page.getByTestId("plot-displacement").getByTestId("cutoff-marker").count()).toBe(2);
      await screenshot(page, "designer-soil-layer-over-rock");

      const version = await ws.save();
      const saved = await getDraft(context.request, projectId, id);
      expect(saved.version).toBe(version);
      expect(saved.input?.soil.stratum).toEqual({ thickness: 6, base: "rigid" });
      await page.reload();
      await ws.waitForState("fresh");
      expect(await ws.panel("soil").getByLabel("one soil layer over rock").isChecked()).toBe(true);
    });
  });
});
