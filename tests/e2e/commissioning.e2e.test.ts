// Site measurements in the browser (issue 17): on an approved revision whose data request went
// to Corvane Pumps, the vendor's field staff open the site measurements from their request,
// upload a file with a problem and see it by cell, then a good one and see their verdicts
// (without the design's prediction); the designer opens the record and reads each reading
// beside the revision's prediction with the ratio, the soil fitted to the resonance the vendor
// measured (0.4 x the design G, below the band) and the flag on the project table. A second
// journey: the designer uploads a run-up trace made from the engine's own response at 1.3 x the
// design G and reads it plotted over the predicted response, the measured resonance beside the
// predicted natural frequencies, and the soil fitted back inside the band.
import { describe, expect, it } from "vitest";
import { screenshot } from "./support/browser";
import { projectIdOf } from "./support/desk";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { example, seededFoundation } from "./support/workspace";
import { RequestsPage } from "./support/vendor-data";
import { Predictor } from "@/modules/commissioning/prediction";
import { SoilResponse, buildResponseModel, findPoint, modelPoints } from "@/modules/commissioning/response";

const browser = sharedBrowser();
const B1 = "Motor RWM-101 rotor bearing 1";
const csv = (rows: string[]) => Buffer.from(["bearing,direction,quantity,unit,value", ...rows].join("\r\n") + "\r\n", "utf8");

describe("site measurements", () => {
  it("the vendor's field staff upload a record on the approved revision and the designer sees it against the prediction", async () => {
    const ids = await asDemo(browser(), "designer", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      const foundation = await seededFoundation(context.request, projectId, "E2E-CM", example("raw-water-pump-train.json"));
      const issued = await context.request.post(`/api/v1/projects/${projectId}/foundations/${foundation.id}/revisions`, { data: { note: "Issued for the commissioning journey." } });
      expect(issued.status()).toBe(201);
      const revisionId = ((await issued.json()) as { revision: { id: string } }).revision.id;
      const list = new RequestsPage(page);
      await list.open(projectId);
      const requestId = await list.send(foundation.tag, "Corvane Pumps");
      return { projectId, foundationId: foundation.id, tag: foundation.tag, revisionId, requestId };
    });
    await asDemo(browser(), "checker", async ({ context }) => {
      const res = await context.request.post(`/api/v1/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions/${ids.revisionId}/decision`, { data: { outcome: "approved", note: "Approved for construction (browser test)." } });
      expect(res.status()).toBe(201);
    });

    await asDemo(browser(), "vendor", async ({ page }) => {
      await page.goto(`/projects/${ids.projectId}/requests/${ids.requestId}`);
      await page.getByTestId("request-site-measurements-link").click();
      await page.getByTestId("measurement-form").waitFor();
      const form = page.getByTestId("measurement-form");
      const fill = async (file: Buffer) => {
        await form.getByLabel("Measured by").fill("Corvane field engineer");
        await form.getByLabel("Instrument", { exact: true }).fill("Portable analyser, serial E2E-1");
        await form.getByLabel("Instrument calibrated on").fill("2026-01-15");
        await form.getByLabel("Running speed (rpm)").fill("1785");
        await form.locator('input[type="file"]').setInputFiles({ name: "acceptance.csv", mimeType: "text/csv", buffer: file });
        await form.getByRole("button", { name: "Add the record" }).click();
      };
      await fill(csv([`${B1},vertical,velocity rms,mm/s,0.9`, `${B1},sideways,velocity rms,mm/s,1.1`]));
      const problems = page.getByTestId("measurement-problems");
      await problems.waitFor({ timeout: 20_000 });
      expect(await problems.innerText()).toMatch(/CSV!B3[\s\S]*sideways/);
      await screenshot(page, "commissioning-refused");
      // the vertical mode as the engine gives it at 0.4 x the design G
      const resonanceHz = new Predictor(example("raw-water-pump-train.json")).design.naturalHz[2]! * Math.sqrt(0.4);
      await fill(csv([`${B1},vertical,velocity rms,mm/s,0.9`, `${B1},horizontal,velocity rms,mm/s,3.2`, `${B1},vertical,resonance,Hz,${resonanceHz.toFixed(4)}`]));
      await page.getByTestId("record-verdict").waitFor({ timeout: 30_000 });
      expect(await page.getByTestId("record-verdict").innerText()).toMatch(/outside limits/);
      expect(await page.getByTestId("reading-row").count()).toBe(3);
      expect(await page.getByTestId("calibration").count()).toBe(0);
      // the vendor reads verdicts against the limits, not the design's prediction
      expect(await page.getByTestId("reading-predicted").count()).toBe(0);
      expect(await page.getByTestId("reading-measured").first().innerText()).toMatch(/mm\/s peak/);
      await screenshot(page, "commissioning-vendor-record");
    });

    await asDemo(browser(), "designer", async ({ page }) => {
      await page.goto(`/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions/${ids.revisionId}/commissioning`);
      const row = page.getByTestId("measurement-row").first();
      expect(await row.innerText()).toMatch(/Corvane field engineer/);
      await row.getByTestId("measurement-link").click();
      await page.getByTestId("reading-table").waitFor();
      const predicted = await page.getByTestId("reading-predicted").allInnerTexts();
      expect(predicted).toHaveLength(3);
      for (const p of predicted.slice(0, 2)) expect(p).toMatch(/^\d[\d.,]* mm\/s$/);
      const ratios = await page.getByTestId("reading-ratio").allInnerTexts();
      for (const r of ratios.slice(0, 2)) expect(Number(r.replace(",", ""))).toBeGreaterThan(0);
      expect(await page.getByTestId("band-position").innerText()).toBe("below the design band (softer soil)");
      expect(await page.getByTestId("fitted-g").innerText()).toMatch(/ MPa$/);
      expect(await page.getByText("Before you rely on these numbers").count()).toBeGreaterThan(0);
      await screenshot(page, "commissioning-designer-record");
      await page.goto(`/projects/${ids.projectId}`);
      const tableRow = page.getByTestId("foundation-table").locator("tr", { hasText: ids.tag });
      await tableRow.waitFor();
      expect(await tableRow.innerText()).toMatch(/site-measured soil G .* below the design band/);
    });
  });

  it("the designer uploads a run-up trace and reads it over the predicted response, with the resonance and the soil fitted to it", async () => {
    const input = example("raw-water-pump-train.json");
    // a synthetic trace: the engine's own response at 1.3 x the design G, 300 to 1800 rpm
    const model = buildResponseModel(input);
    const truth = new SoilResponse(model, 1.3);
    const point = findPoint(modelPoints(model), B1)!;
    const rows = Array.from({ length: 151 }, (_, i) => 300 + i * 10).map((rpm) => `${B1},horizontal,displacement peak-to-peak,µm,${rpm},${(2 * truth.at(point, 1, rpm).displacementPeak * 1e6).toFixed(4)}`);
    const file = Buffer.from(["bearing,direction,quantity,unit,speed_rpm,value", ...rows].join("\r\n") + "\r\n", "utf8");
    const ids = await asDemo(browser(), "designer", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      const foundation = await seededFoundation(context.request, projectId, "E2E-CM-TRACE", input);
      const issued = await context.request.post(`/api/v1/projects/${projectId}/foundations/${foundation.id}/revisions`, { data: { note: "Issued for the run-up trace journey." } });
      expect(issued.status()).toBe(201);
      return { projectId, foundationId: foundation.id, revisionId: ((await issued.json()) as { revision: { id: string } }).revision.id };
    });
    await asDemo(browser(), "checker", async ({ context }) => {
      const res = await context.request.post(`/api/v1/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions/${ids.revisionId}/decision`, { data: { outcome: "approved", note: "Approved for the trace journey (browser test)." } });
      expect(res.status()).toBe(201);
    });
    await asDemo(browser(), "designer", async ({ page }) => {
      await page.goto(`/projects/${ids.projectId}/foundations/${ids.foundationId}/revisions/${ids.revisionId}/commissioning`);
      const form = page.getByTestId("measurement-form");
      await form.waitFor();
      await form.getByLabel("Measured by").fill("Site engineer (run-up)");
      await form.getByLabel("Instrument", { exact: true }).fill("Portable analyser, serial E2E-2");
      await form.getByLabel("Instrument calibrated on").fill("2026-01-15");
      await form.getByLabel("Running speed (rpm)").fill("1785");
      await form.getByLabel("What the file holds").selectOption("run-up");
      await form.locator('input[type="file"]').setInputFiles({ name: "run-up.csv", mimeType: "text/csv", buffer: file });
      await form.getByRole("button", { name: "Add the record" }).click();
      const plot = page.getByTestId("trace-plot");
      await plot.waitFor({ timeout: 30_000 });
      // two curves drawn (measured and predicted), with the chart's text alternative
      await plot.locator("svg path").first().waitFor();
      expect(await plot.locator('[aria-label="Run-up trace measured, over the predicted frequency response"]').count()).toBe(1);
      const resonances = await page.getByTestId("trace-resonances").innerText();
      expect(resonances).toMatch(/^Measured resonance: \d[\d,.]* rpm/);
      expect(resonances).toMatch(/Predicted natural frequencies: \d/);
      expect(await page.getByTestId("band-position").innerText()).toBe("inside the design band");
      expect(await page.getByText("Before you rely on these numbers").count()).toBeGreaterThan(0);
      await screenshot(page, "commissioning-run-up-trace");
    });
  });
});
