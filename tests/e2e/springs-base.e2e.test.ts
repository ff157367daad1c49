// Issue 16 in the browser, springs on a base block (two-stage isolation, engine 1.8.0): the
// designer takes an inertia block on steel springs on a rigid floor, puts the springs on a base
// block on the soil, types the base's box, and reads the engine's twelve modes (the block of
// each named), the base's panel with the force into the ground, the base drawn under the
// springs, the bearing check applying to the base again; the save keeps the base.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { formatSignificant } from "@/modules/units";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("designer: inertia block on springs on a base block", () => {
  it("puts the springs on a base block, reads twelve modes, the force into the ground and the base drawn, and the save keeps the base", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const twoStage = example("fan-on-springs-base-block.json");
      if (twoStage.impedance.method !== "springs" || !twoStage.impedance.base) throw new Error("the example has no base block");
      const base = twoStage.impedance.base;
      // the same block on the same springs, first on a rigid floor and without speed ramps
      const { base: _base, ...floor } = twoStage.impedance;
      void _base;
      const start = { ...twoStage, impedance: floor, transient: undefined };
      const { id } = await seededFoundation(context.request, projectId, "E2E-SPRINGS-BASE", start);
      const ws = new WorkspacePage(page);
      await ws.open(projectId, id);
      await ws.waitForState("fresh");

      await ws.panel("method").getByRole("radio", { name: /^A base block on the soil/ }).check();
      for (const axis of ["x", "y", "z"] as const) {
        await ws.setNumber(ws.numberField(`Base ${axis} from`, "m"), String(base[axis][0]));
        await ws.setNumber(ws.numberField(`Base ${axis} to`, "m"), String(base[axis][1]));
      }
      await ws.waitForState("fresh");

      const parsed = parseAnalysisInput({ ...twoStage, transient: undefined });
      if (!parsed.ok) throw new Error("example invalid");
      const result = analyse(parsed.input);
      // twelve modes, the engine's frequencies, six of them the base's
      const modes = page.getByTestId("modes-table");
      expect(await modes.locator("tbody tr").count()).toBe(12);
      const modesText = await textOf(modes);
      for (const m of result.modes) expect(modesText).toContain(formatSignificant(m.frequencyHz));
      expect(await modes.locator("tbody tr", { hasText: "base block" }).count()).toBe(6);

      // the base's panel: the engine's force into the ground (N, vertical case at the rated speed)
      const panel = await textOf(page.getByTestId("springs-base-results"));
      expect(panel).toContain("Force into the ground");
      const vertical = result.springs!.base!.rotors[0]!.cases.find((c) => c.case === "vertical")!;
      expect(panel).toContain(formatSignificant(vertical.groundForce[2]));
      expect(panel).toContain("Two-mass vertical frequencies");

      // drawn to scale under the springs, in plan and elevation, and said in the text beside
      await expect.poll(async () => page.getByTestId("springs-base-plan").count()).toBe(1);
      expect(await page.getByTestId("springs-base-elevation").count()).toBe(1);
      expect(await textOf(page.getByTestId("springs-text"))).toContain("They stand on a base block");

      // the base bears on the soil: the bearing check applies again
      const bearing = ws.checksTable.locator('tbody tr[data-check-key="bearing-pressure"]');
      expect(await bearing.getAttribute("data-verdict")).toBe("pass");
      expect(await textOf(bearing)).toContain("base block");
      await screenshot(page, "designer-springs-base-block");

      await ws.save();
      const saved = await getDraft(context.request, projectId, id);
      expect((saved.input?.impedance as { base?: unknown } | undefined)?.base).toEqual(base);
    });
  });
});
