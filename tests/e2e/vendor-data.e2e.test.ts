// The vendor data journey in the browser: a designer asks Corvane Pumps for a foundation's
// machine data; the vendor downloads the workbook, uploads a bad one and sees the problems
// by sheet and cell, then a good one; the designer takes it into the draft, whose machine
// data change. The designer first places each machine's datum on the block (issue 18, item 6):
// the workbook then comes in the machine's terms and the take-in places it back.
import { describe, expect, it } from "vitest";
import { machineFieldRow, rampFieldRow, rotorFieldRow } from "@/modules/vendor-data/layout";
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
      // The datums on the block: the motor's coupling face at x = -0.9 m, its x pointing away
      // from the pump (180°); the pump's at x = 0.3 m, unturned.
      const placements = [
        { machine: "Motor RWM-101", datum: { origin: [-0.9, 0, 2.3], rotationDeg: 180 }, vendor: null },
        { machine: "Raw-water pump RWP-101", datum: { origin: [0.3, 0, 2.3], rotationDeg: 0 }, vendor: null },
      ];
      const placed = await context.request.put(`/api/v1/projects/${projectId}/foundations/${foundation.id}/draft`, { data: { version: 1, input: pumpTrain, placements } });
      expect(placed.status()).toBe(200);
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
      // Prefilled in the motor's terms: x_machine = -(x_block - (-0.9)) = -(-2.1 + 0.9) = 1.2 m.
      await editWorkbook(workbook, (wb) => {
        expect(Number(wb.getWorksheet("Machine 1")!.getCell(`C${machineFieldRow("cgX")}`).value)).toBeCloseTo(1.2, 9);
      });
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
        wb.getWorksheet("Machine 2")!.getCell(`C${rampFieldRow("startUpS")}`).value = 14;
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
      expect(await version.getByTestId("version-ramp-times").innerText()).toMatch(/impeller: start-up 14/);
      expect(await version.getByTestId("datum-status-1").innerText()).toMatch(/datum placed/);
      const before = await getDraft(context.request, projectId, foundationId);
      await version.getByRole("button", { name: "Take into draft" }).click();
      await expect.poll(() => page.getByTestId("request-status").innerText(), { timeout: 20_000 }).toBe("Taken into draft");
      await screenshot(page, "vendor-data-accepted");
      const after = await getDraft(context.request, projectId, foundationId);
      expect(after.version).toBe(before.version + 1);
      const impeller = after.input?.machines.find((m) => m.name === "Raw-water pump RWP-101")?.rotors[0];
      expect(impeller?.mass).toBe(1234);
      expect(before.input?.machines.find((m) => m.name === "Raw-water pump RWP-101")?.rotors[0]?.mass).toBe(1100);
      // Through the datum and back: the block positions are those the desk held.
      const pump = after.input?.machines.find((m) => m.name === "Raw-water pump RWP-101");
      pump?.cg.forEach((v, i) => expect(v).toBeCloseTo(pumpTrain.machines[1]!.cg[i]!, 9));
      // The workspace shows the vendor's figures and the start-up time that feeds the runs.
      await page.goto(`/projects/${projectId}/foundations/${foundationId}`);
      await expect.poll(() => page.getByTestId("machine-ramp-times-1").innerText(), { timeout: 20_000 }).toMatch(/start-up 14.*vendor's start-up time/);
      expect(await page.getByTestId("machine-vendor-trail-1").innerText()).toMatch(/machine data version 1/);
    });
  });
});
