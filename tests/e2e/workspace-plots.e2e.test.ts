import { describe, expect, it } from "vitest";
import { analyse } from "@/modules/calc";
import { asDemo, asVisitor, sharedBrowser } from "./support/fixtures";
import { artifactsDir } from "./support/browser";
import { projectIdOf, textOf } from "./support/desk";
import { WorkspacePage, example, seededFoundation } from "./support/workspace";

const browser = sharedBrowser();

describe("frequency-response plots that read", () => {
  it("name every curve, merge the motor's and the pump's coinciding speed labels, and mark the natural frequencies", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const input = example("raw-water-pump-train.json");
      const { id } = await seededFoundation(context.request, projectId, "E2E-PLOTS", input);
      const ws = new WorkspacePage(page);
      await ws.open(projectId, id);
      await ws.waitForState("fresh");
      const plot = page.getByTestId("plot-displacement");
      await plot.locator("svg").first().waitFor({ state: "visible" });

      // The legend names each curve by its point, in the curve's order.
      const result = analyse(input);
      const first = result.sweep.series[0]!;
      const points = result.sweep.series.filter((s) => s.machine === first.machine && s.rotor === first.rotor && s.case === first.case && s.unbalanceMode === first.unbalanceMode).map((s) => s.point);
      expect(points.length).toBeGreaterThan(1);
      const legend = await page.getByTestId("plot-displacement-legend").locator("li").allTextContents();
      expect(legend.map((t) => t.trim())).toEqual(points);

      // Motor and pump run at 1785 rpm: one label carries both names, and no two labels overlap.
      const labels = plot.getByTestId("operating-label");
      expect(await labels.count()).toBe(1);
      const merged = await textOf(labels.first());
      expect(merged).toContain("Motor RWM-101 rotor");
      expect(merged).toContain("Raw-water pump RWP-101 impeller");
      expect(merged).toContain(" · ");
      const boxes = await plot.locator('[data-testid="operating-label"], [data-testid="mode-label"]').evaluateAll((els) =>
        els.map((e) => {
          const r = e.getBoundingClientRect();
          return { l: r.left, r: r.right, t: r.top, b: r.bottom };
        }),
      );
      for (let i = 0; i < boxes.length; i++)
        for (let j = i + 1; j < boxes.length; j++) {
          const [a, b] = [boxes[i]!, boxes[j]!];
          const overlap = a.l < b.r && b.l < a.r && a.t < b.b && b.t < a.b;
          expect(overlap).toBe(false);
        }

      // Each natural frequency inside the sweep is a dashed line with its label.
      const sweep = result.sweep.frequencyHz;
      const inSweep = result.modes.filter((m) => m.frequencyHz >= sweep[0]! && m.frequencyHz <= sweep[sweep.length - 1]!).length;
      expect(inSweep).toBeGreaterThan(0);
      expect(await plot.getByTestId("mode-line").count()).toBe(inSweep);
      expect(await plot.getByTestId("mode-line").first().getAttribute("stroke-dasharray")).toBe("3 3");
      // The shading stays light: no band is more than a faint wash over the curves.
      for (const band of await plot.locator('[data-testid="soil-band"], [data-testid="operating-band"] rect').evaluateAll((els) => els.map((e) => Number(e.getAttribute("opacity"))))) {
        expect(band).toBeLessThanOrEqual(0.15);
      }
      await page.getByTestId("panel-plots").screenshot({ path: `${artifactsDir}/designer-plots-legend.png` });
    });
  });

  it("ships an icon of its own", async () => {
    await asVisitor(browser(), async ({ page }) => {
      await page.goto("/sign-in");
      const href = await page.locator('link[rel="icon"]').first().getAttribute("href");
      expect(href).toMatch(/^\/icon\.svg/);
      const res = await page.request.get(href!);
      expect(res.status()).toBe(200);
      expect(res.headers()["content-type"]).toContain("image/svg+xml");
      expect(await res.text()).toContain("Plinthwise");
    });
  });
});
