import { describe, expect, it } from "vitest";
import { sharedBrowser } from "./support/fixtures";
import { screenshot } from "./support/browser";
import { demo, homeOf, projectIdOf, signInAs, textOf } from "./support/desk";
import { WorkspacePage, example, getDraft, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("two designers on one draft", () => {
  it("the later, stale save gets the conflict dialog, overwrites nothing, and loads the stored version", async () => {
    const first = await signInAs(browser(), demo.designer.email, homeOf.designer);
    const second = await signInAs(browser(), demo.designer.email, homeOf.designer);
    try {
      // A copy of the pump train on its own foundation, so the demo's drafts stay as they are.
      const projectId = projectIdOf(first.page.url());
      const { id: foundationId } = await seededFoundation(first.context.request, projectId, "E2E-CONFLICT", example("raw-water-pump-train.json"));
      const a = new WorkspacePage(first.page);
      const b = new WorkspacePage(second.page);
      await a.open(projectId, foundationId);
      await b.open(projectId, foundationId);
      await a.waitForState("fresh");
      await b.waitForState("fresh");
      expect(await a.shownVersion()).toBe(1);
      expect(await b.shownVersion()).toBe(1);

      // The first widens the mat along y and saves: version 2 (3 when the draft saved itself
      // between the two fields on a slow machine; what matters is that b is behind).
      await a.setNumber(a.box(1, "y", "from", "m"), "-2.2");
      await a.setNumber(a.box(1, "y", "to", "m"), "2.2");
      const v = await a.save();
      expect([2, 3]).toContain(v);

      // The second, still on version 1, lengthens the mat and saves: refused (autosave may
      // have been refused already; the explicit save is refused the same way).
      await b.setNumber(b.box(1, "x", "from", "m"), "-4.4");
      await b.setNumber(b.box(1, "x", "to", "m"), "4.4");
      await b.saveButton.click();
      await b.conflict.waitFor({ state: "visible", timeout: 20_000 });
      expect(await textOf(b.conflict)).toContain(`now version ${v}`);
      expect(await textOf(b.conflict)).toContain("Nothing was overwritten");
      // "See the difference" names the fields that differ, with both values.
      await b.conflict.getByText("See the difference").click();
      const diff = await textOf(b.conflict.locator("ul"));
      expect(diff).toContain("block.solids[0].y[0]: yours -1.6 · stored -2.2");
      expect(diff).toContain("block.solids[0].x[1]: yours 4.4 · stored 3.8");
      await screenshot(second.page, "designer-conflict");

      // The stored draft is the first designer's, untouched by the refused save.
      const stored = await getDraft(first.context.request, projectId, foundationId);
      expect(stored.version).toBe(v);
      expect(stored.input!.block.solids[0]).toMatchObject({ x: [-3.8, 3.8], y: [-2.2, 2.2] });

      await b.conflict.getByRole("button", { name: "Load the stored version" }).click();
      await b.conflict.waitFor({ state: "detached" });
      expect(await b.box(1, "y", "from", "m").inputValue()).toBe("-2.2");
      expect(await b.box(1, "y", "to", "m").inputValue()).toBe("2.2");
      expect(await b.box(1, "x", "from", "m").inputValue()).toBe("-3.8");
      expect(await b.box(1, "x", "to", "m").inputValue()).toBe("3.8");
      expect(await b.shownVersion()).toBe(v);
      await b.waitForState("fresh");

      // Now on the stored version, the second designer's next change saves as the next version.
      await b.setNumber(b.box(1, "x", "to", "m"), "4.4");
      expect(await b.save()).toBe(v + 1);
      const last = await getDraft(second.context.request, projectId, foundationId);
      expect(last.input!.block.solids[0]).toMatchObject({ x: [-3.8, 4.4], y: [-2.2, 2.2] });
    } finally {
      await first.context.close();
      await second.context.close();
    }
  });
});
