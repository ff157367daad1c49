import { describe, expect, it } from "vitest";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { DEMO_FOUNDATION_TAGS, projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, foundationIdByTag, getDraft } from "./support/workspace";

const browser = sharedBrowser();
const P101 = DEMO_FOUNDATION_TAGS[0];
// Design-input panels; everything in them is the checker's to read, not to change.
const INPUT_PANELS = ["block", "soil", "machines", "method"] as const;
const RESULT_PANELS = ["checks", "modes", "plots", "response", "mass", "impedance", "crosscheck"] as const;

interface Control {
  panel: string;
  tag: string;
  type: string;
  label: string;
  readOnly: boolean;
  disabled: boolean;
}

describe("who may change the foundation workspace", () => {
  it("a checker reads PH1-P101 with every input read-only, the results and the cautions", async () => {
    await asDemo(browser(), "checker", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const ws = new WorkspacePage(page);
      const foundationId = await ws.openFromTable(P101);
      await ws.waitForState("fresh");
      await ws.readOnlyTag.waitFor({ state: "visible" });
      expect(await ws.saveButton.count()).toBe(0);
      expect(await ws.saveState.count()).toBe(0);

      const controls: Control[] = [];
      for (const id of INPUT_PANELS) {
        const panel = ws.panel(id);
        await panel.waitFor({ state: "visible" });
        // No add, copy, reorder, delete or "use this" buttons anywhere in the inputs.
        expect(await panel.getByRole("button").count(), `buttons in panel-${id}`).toBe(0);
        controls.push(
          ...(await panel.locator("input, select, textarea").evaluateAll(
            (els, panelId) =>
              els.map((el) => {
                const e = el as HTMLInputElement;
                const label = e.getAttribute("aria-label") ?? (e.id ? document.querySelector(`label[for="${e.id}"]`)?.textContent : null) ?? e.closest("label")?.textContent ?? e.name;
                return { panel: panelId, tag: e.tagName.toLowerCase(), type: e.type, label: (label ?? "").trim(), readOnly: e.readOnly, disabled: e.matches(":disabled") };
              }),
            id,
          )),
        );
      }
      // The seeded foundation has four boxes, two machines and two check points: plenty of fields.
      expect(controls.length).toBeGreaterThan(60);
      // The SPT helper only converts a blow count for display; it is not a design input.
      const design = controls.filter((c) => c.label !== "SPT N");
      expect(design.length).toBe(controls.length - 1);
      const editable = design.filter((c) => (c.tag === "select" || c.type === "checkbox" || c.type === "radio" ? !c.disabled : !c.readOnly && !c.disabled));
      expect(editable).toEqual([]);

      // Typing into a coordinate changes nothing and starts no calculation.
      const xTo = ws.box(1, "x", "to", "m");
      const before = await xTo.inputValue();
      await xTo.click();
      await page.keyboard.type("9");
      await page.keyboard.press("Backspace");
      await page.keyboard.type("7");
      expect(await xTo.inputValue()).toBe(before);
      await page.waitForTimeout(600);
      expect(await ws.state()).toBe("fresh");

      // The results and the cautions are all there.
      expect(await textOf(ws.summary)).toMatch(/^(all \d+ checks pass|\d+ of \d+ checks fail(, \d+ of them accepted with justification)?)$/);
      const { total, failing, accepted = 0 } = await ws.checks();
      expect(await ws.checkRows().count()).toBe(total);
      expect(await ws.checkRows("fail").count()).toBe(failing - accepted);
      expect(await ws.checkRows("accepted").count()).toBe(accepted);
      for (const id of RESULT_PANELS) await ws.panel(id).waitFor({ state: "visible" });
      expect((await ws.plotPaths("plot-displacement")).length).toBeGreaterThan(0);
      await page.getByTestId("drawing-plan").getByTestId("cg-plan").waitFor();
      const cautions = await textOf(ws.cautions);
      expect(cautions).toContain("aid to a qualified engineer");
      expect(cautions).toContain("Soil properties are uncertain");
      expect(cautions).toContain("licensed professional review govern");
      await screenshot(page, "checker-workspace-read-only");

      // Hiding the button is not the check: the API refuses the checker's save too.
      const draft = await getDraft(context.request, projectId, foundationId);
      const put = await context.request.put(`/api/v1/projects/${projectId}/foundations/${foundationId}/draft`, {
        data: { version: draft.version, input: draft.input },
      });
      expect(put.status()).toBe(403);
      expect((await getDraft(context.request, projectId, foundationId)).version).toBe(draft.version);
    });
  });

  it("a vendor typing the workspace URL gets the not-found page, and the draft API answers 403", async () => {
    const { projectId, foundationId } = await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      return { projectId, foundationId: await foundationIdByTag(context.request, projectId, P101) };
    });
    await asDemo(browser(), "vendor", async ({ context, page }) => {
      const url = `/projects/${projectId}/foundations/${foundationId}`;
      const response = await page.goto(url);
      expect(response?.status()).toBe(404);
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Nothing to see here");
      const body = (await page.textContent("body")) ?? "";
      expect(body).not.toContain(P101);
      expect(body).not.toContain("RWM-101");
      expect(await page.getByTestId("calc-state").count()).toBe(0);
      expect(await page.getByTestId("panel-block").count()).toBe(0);
      await screenshot(page, "vendor-workspace-refused");

      const draftUrl = `/api/v1/projects/${projectId}/foundations/${foundationId}/draft`;
      const get = await context.request.get(draftUrl);
      expect(get.status()).toBe(403);
      const text = await get.text();
      expect(text).not.toContain("RWM-101");
      expect(text).not.toContain("shearWaveVelocity");
      const put = await context.request.put(draftUrl, { data: { version: 1, input: {} } });
      expect(put.status()).toBe(403);
      const foundation = await context.request.get(`/api/v1/projects/${projectId}/foundations/${foundationId}`);
      expect(foundation.status()).toBe(403);
    });
  });
});
