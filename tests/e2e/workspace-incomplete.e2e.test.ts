// Issue 18 item 2, no dead end on a new foundation: a machine with only a name is saved as an
// incomplete draft (the analysis waits, the missing values are "required"), and "Remove
// machine" works on it.
import { describe, expect, it } from "vitest";
import { sharedBrowser, asDemo } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage } from "./support/workspace";

const browser = sharedBrowser();

interface StoredDraft {
  version: number;
  input: unknown;
  incomplete: boolean;
  document: { machines: { name: string; mass: number | null }[] } | null;
}

describe("a new foundation's draft saves incomplete", () => {
  it("a machine with only a name saves itself; Remove machine works on it", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const tag = `E2E-INCOMPLETE-${Date.now()}`;
      const created = await context.request.post(`/api/v1/projects/${projectId}/foundations`, { data: { tag, machineTrain: "browser test: incomplete draft" } });
      expect(created.status()).toBe(201);
      const { foundation } = (await created.json()) as { foundation: { id: string } };
      const draftUrl = `/api/v1/projects/${projectId}/foundations/${foundation.id}/draft`;
      const stored = async (): Promise<StoredDraft> => ((await (await context.request.get(draftUrl)).json()) as { draft: StoredDraft }).draft;
      expect((await stored()).version).toBe(0);

      const ws = new WorkspacePage(page);
      await ws.open(projectId, foundation.id);
      // Nothing typed yet: nothing to save, and the analysis waits for the inputs.
      await ws.waitForState("error");
      expect(await ws.saveStatus()).toBe("clean");
      const issues = await textOf(page.getByTestId("calc-issues"));
      expect(issues).toContain("machines[0].mass: is required");
      expect(issues).not.toContain("finite number");

      // Only a name for the machine: the form is incomplete, and it saves itself anyway.
      const machine = page.getByTestId("machine-0");
      const name = machine.getByLabel("Machine", { exact: true });
      await name.fill("Feed pump");
      await name.blur();
      await page.getByTestId("draft-incomplete").waitFor({ state: "visible" });
      await ws.waitForSaveStatus("saved");
      const first = await stored();
      expect(first).toMatchObject({ version: 1, input: null, incomplete: true });
      expect(first.document?.machines.map((m) => [m.name, m.mass])).toEqual([["Feed pump", null]]);
      await ws.waitForState("error");
      await screenshot(page, "designer-incomplete-saved");

      // Remove machine is there and works, even on the only, incomplete machine.
      const remove = machine.getByRole("button", { name: "Remove machine" });
      expect(await remove.isEnabled()).toBe(true);
      await remove.click();
      await page.getByTestId("no-machines").waitFor({ state: "visible" });
      expect(await page.getByTestId("machine-0").count()).toBe(0);
      await ws.waitForSaveStatus("saved");
      await expect.poll(async () => (await stored()).version, { timeout: 20_000 }).toBe(2);
      expect((await stored()).document?.machines).toEqual([]);

      // A wrong value is still not saved on its own.
      await page.getByRole("button", { name: "Add machine" }).click();
      await ws.setNumber(page.getByTestId("machine-0").getByLabel("Mass (kg)", { exact: true }), "-5");
      await ws.waitForSaveStatus("invalid");
      await page.waitForTimeout(3000); // longer than the autosave pause
      expect((await stored()).version).toBe(2);
    });
  });
});
