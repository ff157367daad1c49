// The vendor data journey in the browser: a designer asks Corvane Pumps for a foundation's
// machine data; the vendor downloads the workbook, uploads a bad one and sees the problems
// by sheet and cell, then a good one; the designer takes it into the draft, whose machine
// data change.
import { describe, expect, it } from "vitest";
import { machineFieldRow, rotorFieldRow } from "@/modules/vendor-data/layout";
import { screenshot } from "./support/browser";
import { projectIdOf } from "./support/desk";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { example, getDraft, seededFoundation } from "./support/workspace";
import { RequestPage, RequestsPage, editWorkbook } from "./support/vendor-data";

const browser = sharedBrowser();

describe("vendor data", () => {
  it("goes from a designer's request through a refused and an accepted upload into the draft", async () => {
    const pumpTrain = example("raw-water-pump-train.json");
    const { projectId, foundationId, tag, requestId } = await asDemo(browser(), "designer", async ({ page, context }) => {
      const projectId = projectIdOf(page.url());
      const foundation = await seededFoundation(context.request, projectId, "E2E-VND", pumpTrain);
      const list = new RequestsPage(page);
      await list.open(projectId);
      const requestId = await list.send(foundation.tag, "Corvane Pumps");
      return { projectId, foundationId: foundation.id, tag: foundation.tag, requestId };
    });

    await asDemo(browser(), "vendor", async ({ page }) => {
      await page.getByRole("link", { name: tag }).click();
      const request = new RequestPage(page);
      await page.waitForURL((u) => u.pathname.endsWith(requestId));
      const workbook = await request.downloadWorkbook();
      const bad = await editWorkbook(workbook, (wb) => {
        const ws = wb.getWorksheet("Machine 2");
        ws!.getCell(`C${rotorFieldRow("mass")}`).value = "about a tonne";
        ws!.getCell(`C${machineFieldRow("mass")}`).value = -14000;
      });
      await request.uploadData("filled.xlsx", bad);
      await request.problems.waitFor({ state: "visible", timeout: 20_000 });
      const problems = await request.problems.innerText();
      expect(problems).toContain("Machine 2");
      expect(problems).toContain(`C${rotorFieldRow("mass")}`);
      expect(problems).toMatch(/expected a number in kg/);
      expect(problems).toMatch(/must be greater than 0/);
      await screenshot(page, "vendor-data-refused");
      const good = await editWorkbook(workbook, (wb) => {
        wb.getWorksheet("Machine 2")!.getCell(`C${rotorFieldRow("mass")}`).value = 1234;
      });
      await request.uploadData("filled.xlsx", good);
      await request.accepted.waitFor({ state: "visible", timeout: 20_000 });
      expect(await request.accepted.innerText()).toMatch(/version 1/);
      await request.version(1).waitFor({ state: "visible" });
    });

    await asDemo(browser(), "designer", async ({ page, context }) => {
      const request = new RequestPage(page);
      await request.open(projectId, requestId);
      const version = request.version(1);
      await expect.poll(() => version.getByTestId("data-diff").innerText()).toMatch(/impeller › rotor mass/);
      const before = await getDraft(context.request, projectId, foundationId);
      await version.getByRole("button", { name: "Take into draft" }).click();
      await expect.poll(() => page.getByTestId("request-status").innerText(), { timeout: 20_000 }).toBe("Taken into draft");
      await screenshot(page, "vendor-data-accepted");
      const after = await getDraft(context.request, projectId, foundationId);
      expect(after.version).toBe(before.version + 1);
      const impeller = after.input?.machines.find((m) => m.name === "Raw-water pump RWP-101")?.rotors[0];
      expect(impeller?.mass).toBe(1234);
      expect(before.input?.machines.find((m) => m.name === "Raw-water pump RWP-101")?.rotors[0]?.mass).toBe(1100);
    });
  });
});
