// Results at the speed of typing: the workspace computes in a Web Worker with the engine bundled
// for the browser, so typing a block dimension updates the results without any request to
// POST /api/v1/calculate; what it shows is the engine's answer for the typed inputs. The API's own
// answers are compressed on the wire.
import { describe, expect, it } from "vitest";
import { analyse } from "@/modules/calc";
import { formatSignificant } from "@/modules/units";
import { asDemo, sharedBrowser } from "./support/fixtures";
import { DEMO_FOUNDATION_TAGS, projectIdOf } from "./support/desk";
import { WorkspacePage, example, getDraft } from "./support/workspace";

const browser = sharedBrowser();

// The demo's second foundation (examples/aeration-blower.json); other journeys only look at it.
const B201 = DEMO_FOUNDATION_TAGS[1];

describe("live results in the browser", () => {
  it("typing the mat's height updates the modes and checks with no calculate request, and the numbers are the engine's", async () => {
    await asDemo(browser(), "designer", async ({ context, page }) => {
      const projectId = projectIdOf(page.url());
      const calculatePosts: string[] = [];
      page.on("request", (r) => {
        if (r.method() === "POST" && new URL(r.url()).pathname === "/api/v1/calculate") calculatePosts.push(r.url());
      });
      const workers: string[] = [];
      page.on("worker", (w) => workers.push(w.url()));

      const ws = new WorkspacePage(page);
      const foundationId = await ws.openFromTable(B201);
      await ws.waitForState("fresh", 30_000);
      // the engine worker is the app's own bundled chunk
      expect(workers.some((u) => new URL(u).pathname.startsWith("/_next/static/"))).toBe(true);
      expect(await page.getByTestId("engine-notice").count()).toBe(0);

      const before = await getDraft(context.request, projectId, foundationId);
      expect(before.input).not.toBeNull();
      const original = before.input!.block.solids[0]!.z[1];
      const firstMode = page.getByTestId("modes-table").locator("tbody tr").first().locator("td").nth(1);
      const shownBefore = ((await firstMode.textContent()) ?? "").trim();
      expect(shownBefore).toBe(formatSignificant(analyse(before.input!).modes[0]!.frequencyHz));

      // Type a taller mat key by key (each keystroke is a new input to analyse).
      const taller = Number((original + 0.35).toFixed(3));
      const top = ws.box(1, "z", "to", "m");
      await top.click();
      await top.fill("");
      await top.pressSequentially(String(taller), { delay: 40 });
      await ws.waitForState("fresh");
      const shownAfter = ((await firstMode.textContent()) ?? "").trim();
      expect(shownAfter).not.toBe(shownBefore);
      const typed = structuredClone(before.input!);
      typed.block.solids[0]!.z[1] = taller;
      const expected = analyse(typed);
      expect(shownAfter).toBe(formatSignificant(expected.modes[0]!.frequencyHz));
      expect((await ws.checks()).total).toBe(expected.checks.length);
      expect((await ws.checks()).failing).toBe(expected.checks.filter((c) => !c.pass).length);
      expect(calculatePosts).toEqual([]);

      // Back to the stored height, and the draft saved as it was (other journeys look at this foundation).
      await top.fill(String(original));
      await top.blur();
      await ws.waitForState("fresh");
      expect(((await firstMode.textContent()) ?? "").trim()).toBe(shownBefore);
      await ws.save();
      expect((await getDraft(context.request, projectId, foundationId)).input?.block).toEqual(before.input!.block);
      expect(calculatePosts).toEqual([]);
    });
  });

  it("the calculate API answers compressed, a plot's worth of sweep by default", async () => {
    await asDemo(browser(), "designer", async ({ context }) => {
      const res = await context.request.post("/api/v1/calculate", { data: example("aeration-blower.json"), headers: { "accept-encoding": "gzip" } });
      expect(res.status()).toBe(200);
      expect(res.headers()["content-encoding"]).toBe("gzip");
      const body = (await res.json()) as { sweep: { frequencyHz: number[]; sampling?: { mode: string; fullPoints: number } } };
      expect(body.sweep.sampling?.mode).toBe("plot");
      expect(body.sweep.frequencyHz.length).toBeLessThan(body.sweep.sampling!.fullPoints);
    });
  });
});
