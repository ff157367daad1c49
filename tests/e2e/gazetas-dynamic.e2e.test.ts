// Engine 1.5.0 in the browser: the Gazetas method's dynamic coefficients come from the paper's
// charts by default, and the designer may choose the Pais & Kausel closed forms instead; the
// explanation panel names the source used and the save keeps the choice.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { formatSignificant } from "@/modules/units";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("designer: Gazetas dynamic coefficients", () => {
  it("sees the charts named as the default source, switches to Pais & Kausel, the panel follows and the save keeps it", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const start = example("gazetas-embedded.json");
      const { id } = await seededFoundation(context.request, projectId, "E2E-CHARTS", start);
      const ws = new WorkspacePage(page);
      await ws.open(projectId, id);
      await ws.waitForState("fresh");

      const method = ws.panel("method");
      const chartsRadio = method.getByRole("radio", { name: /^Gazetas' charts/ });
      const pkRadio = method.getByRole("radio", { name: /^Pais & Kausel closed forms/ });
      expect(await chartsRadio.isChecked()).toBe(true);
      expect(await pkRadio.isChecked()).toBe(false);
      const impedance = ws.panel("impedance");
      const before = await textOf(impedance);
      expect(before).toContain("Gazetas (1991) charts");
      expect(before).toContain("geofound");

      await pkRadio.check();
      await expect.poll(async () => textOf(impedance), { timeout: 20_000 }).toContain("NIST GCR 12-917-21 (2012) Table 2-3a");
      await ws.waitForState("fresh");
      // the rocking damping ratio shown is the engine's for the closed forms
      const parsed = parseAnalysisInput({ ...start, impedance: { method: "gazetas", gazetasDynamic: "pais-kausel" } });
      if (!parsed.ok) throw new Error("pais-kausel input invalid");
      const expected = analyse(parsed.input).impedance.dampingRatio;
      const after = await textOf(impedance);
      expect(after).toContain(`${formatSignificant(expected.rx * 100)} %`);
      expect(after).toContain("Pais & Kausel closed forms");
      await screenshot(page, "designer-gazetas-pais-kausel");

      const version = await ws.save();
      const saved = await getDraft(context.request, projectId, id);
      expect(saved.version).toBe(version);
      expect(saved.input?.impedance).toEqual({ method: "gazetas", gazetasDynamic: "pais-kausel" });
      await page.reload();
      await ws.waitForState("fresh");
      expect(await ws.panel("method").getByRole("radio", { name: /^Pais & Kausel closed forms/ }).isChecked()).toBe(true);
    });
  });
});
