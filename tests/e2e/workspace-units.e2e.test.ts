import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();
const FOOT = 0.3048;

/** The value and limit cells of the checks table (the source column quotes limits in SI). */
async function numbersOfChecks(ws: WorkspacePage): Promise<string> {
  const cells = await ws.checksTable.locator("tbody td:nth-child(2), tbody td:nth-child(3)").allTextContents();
  return cells.join(" | ");
}

describe("display units in the foundation workspace", () => {
  it("US customary relabels and converts what is shown and typed, while the saved draft stays SI", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const seeded = example("raw-water-pump-train.json");
      const { id: foundationId } = await seededFoundation(context.request, projectId, "E2E-UNITS", seeded);
      const ws = new WorkspacePage(page);
      await ws.open(projectId, foundationId);
      await ws.waitForState("fresh");

      // SI first (the project's units): metres, kilograms, kilopascals, micrometres, mm/s.
      expect(await ws.unitSwitch("SI").getAttribute("aria-checked")).toBe("true");
      expect(await ws.box(1, "x", "to", "m").inputValue()).toBe("3.8");
      expect(await ws.numberField("Allowable bearing pressure", "kPa").inputValue()).toBe("200");
      const siChecks = await numbersOfChecks(ws);
      expect(siChecks).toContain(" µm");
      expect(siChecks).toContain(" mm/s");

      await ws.unitSwitch("US customary").click();
      expect(await ws.unitSwitch("US customary").getAttribute("aria-checked")).toBe("true");
      // Lengths in feet: the mat's 3.8 m end is 12.467 ft; no field is labelled in metres any more.
      expect(await ws.box(1, "x", "to", "ft").inputValue()).toBe("12.467");
      expect(await ws.box(1, "x", "from", "ft").inputValue()).toBe("-12.467");
      expect(await ws.box(1, "x", "to", "m").count()).toBe(0);
      expect(await page.getByLabel(/\(m\)\s*$/).count()).toBe(0);
      // Masses in pounds, pressures in psf, densities in pcf, wave speed in ft/s.
      expect(await page.getByTestId("machine-0").getByLabel("Mass (lb)", { exact: true }).inputValue()).toBe("20944");
      expect(await ws.numberField("Allowable bearing pressure", "psf").inputValue()).toBe("4177");
      expect(await ws.numberField("Concrete density", "pcf").inputValue()).toBe("149.8");
      expect(await ws.numberField("Shear-wave velocity Vs", "ft/s").inputValue()).toBe("459");
      // Results: amplitudes in mil and in/s, the modulus in ksf, the drawing's dimensions in feet.
      const usChecks = await numbersOfChecks(ws);
      expect(usChecks).toContain(" mil");
      expect(usChecks).toContain(" in/s");
      expect(usChecks).not.toContain(" µm");
      expect(usChecks).not.toContain(" mm/s");
      expect(await textOf(page.getByTestId("plot-displacement"))).toContain("peak (mil)");
      expect(await textOf(page.getByTestId("plot-velocity"))).toContain("peak (in/s)");
      expect(await textOf(ws.panel("mass"))).toContain(" psf");
      expect(await textOf(ws.panel("impedance"))).toContain(" ksf");
      expect(await textOf(page.getByTestId("drawing-plan"))).toContain("24.934 ft");
      await screenshot(page, "designer-units-us");

      // Switching units is no change to the draft.
      expect(await ws.shownVersion()).toBe(1);
      expect(await ws.saveButton.isDisabled()).toBe(true);

      // Typed in feet, stored in metres; the untouched values keep their exact SI numbers.
      await ws.setNumber(ws.box(1, "x", "to", "ft"), "13");
      await ws.waitForState("fresh");
      expect(await ws.save()).toBe(2);
      const stored = await getDraft(context.request, projectId, foundationId);
      const mat = stored.input!.block.solids[0]!;
      expect(mat.x[1]).toBeCloseTo(13 * FOOT, 10);
      expect(mat.x[0]).toBe(-3.8);
      expect(stored.input!.block.concreteDensity).toBe(2400);
      expect(stored.input!.soil.allowableBearingPressure).toBe(200_000);
      expect(stored.input!.soil.shearWaveVelocity).toBe(140);
      expect(stored.input!.machines[0]!.mass).toBe(9500);
      expect(stored.input!.machines.map((m) => m.cg)).toEqual(seeded.machines.map((m) => m.cg));

      // The choice is this person's in this browser: it survives a reload.
      await page.reload();
      await ws.waitForState("fresh");
      expect(await ws.unitSwitch("US customary").getAttribute("aria-checked")).toBe("true");
      expect(await ws.box(1, "x", "to", "ft").inputValue()).toBe("13");

      await ws.unitSwitch("SI").click();
      expect(await ws.box(1, "x", "to", "m").inputValue()).toBe("3.962");
      expect(await page.getByTestId("machine-0").getByLabel("Mass (kg)", { exact: true }).inputValue()).toBe("9500");
      expect(await ws.numberField("Allowable bearing pressure", "kPa").inputValue()).toBe("200");
    });
  });

  it("unit symbols keep their case as the browser renders them (headers, labels, badges)", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const { id: foundationId } = await seededFoundation(context.request, projectId, "E2E-CASE", example("raw-water-pump-train.json"));
      const ws = new WorkspacePage(page);
      await ws.open(projectId, foundationId);
      await ws.waitForState("fresh");
      // innerText is the text as rendered, after CSS text-transform: a capitalised header turned
      // "µm" into "ΜM" (a Greek capital mu, read as "MM": a factor of 1000 off).
      const rendered = await page.evaluate(() => document.body.innerText);
      expect(rendered).toContain("µm");
      expect(rendered).toContain("kPa");
      for (const wrong of ["ΜM", "MM/S", "KPA", "KN/M", "MN/M", "(KG)"]) expect(rendered, wrong).not.toContain(wrong);
      const transformed = await page.evaluate(() =>
        [...document.querySelectorAll("th, label, .tag, .field-label")].filter((el) => getComputedStyle(el).textTransform === "uppercase").map((el) => (el as HTMLElement).innerText),
      );
      expect(transformed).toEqual([]);
    });
  });
});
