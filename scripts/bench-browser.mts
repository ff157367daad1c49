// Browser part of `npm run bench`: headless Debian chromium (playwright-core, the e2e suite's
// flags) on the demo pump train's workspace, signed in as the demo designer. It types into a
// block dimension and into the soil's stiffness input, one keystroke at a time, and reads back
// the measures the page records about itself (app/_components/workspace/input-timing.ts):
// from each input event to the frame that shows the results computed from it (on screen), and
// to the frame in which the deferred parts (plots, panels out of view) show them too.
import type { Page } from "playwright-core";
import type { BenchServer } from "./bench-http.mts";

export interface BrowserTiming {
  field: string;
  keystrokes: number;
  /** Input event to the painted results on screen (plinth:input-to-paint), ms. */
  measures: number[];
  /** Input event to the frame after the deferred render (plots, panels out of view; plinth:input-to-settled), ms. */
  settled: number[];
}

const INPUT_TO_PAINT = "plinth:input-to-paint";
const INPUT_TO_SETTLED = "plinth:input-to-settled";

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return Number.NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i] as number;
}

export function summarise(ms: number[]): { p50: number; p95: number; max: number; n: number } {
  const s = [...ms].sort((a, b) => a - b);
  return { p50: percentile(s, 50), p95: percentile(s, 95), max: s[s.length - 1] ?? Number.NaN, n: s.length };
}

/**
 * `keystrokes` keys into one field: its last digit replaced by the next digit, then back, and
 * so on (each key one input event; every value stays a valid input near the original, so the
 * analysis runs on each; the field is back at its value at the end). Each key waits for the
 * previous one's measure, then 50 ms, so every keystroke is timed on its own, as a designer
 * typing sees it (keystrokes of one frame would coalesce into one run).
 */
async function typeInto(page: Page, label: string, fieldName: string, keystrokes: number): Promise<BrowserTiming> {
  const field = page.locator(`input[name="${fieldName}"]`).first();
  await field.click();
  const original = await field.inputValue();
  const last = original.at(-1) ?? "";
  if (!/\d/.test(last)) throw new Error(`${label}: the value ${JSON.stringify(original)} does not end in a digit`);
  const other = String((Number(last) + 1) % 10);
  await page.evaluate((names) => names.forEach((n) => performance.clearMeasures(n)), [INPUT_TO_PAINT, INPUT_TO_SETTLED]);
  for (let i = 0; i < keystrokes; i++) {
    await field.press("End");
    await field.press("Shift+ArrowLeft");
    await field.press(i % 2 === 0 ? other : last);
    try {
      await page.waitForFunction(([name, n]) => performance.getEntriesByName(name as string).length >= (n as number), [INPUT_TO_PAINT, i + 1] as const, { timeout: 15_000 });
    } catch {
      throw new Error(`${label}: no input-to-paint measure for keystroke ${i + 1} (the field shows ${JSON.stringify(await field.inputValue())})`);
    }
    await page.waitForTimeout(50);
  }
  // the last keystroke's deferred render (one measure per keystroke once the page has settled)
  try {
    await page.waitForFunction(([name, n]) => performance.getEntriesByName(name as string).length >= (n as number), [INPUT_TO_SETTLED, keystrokes] as const, { timeout: 15_000 });
  } catch {
    throw new Error(`${label}: fewer input-to-settled measures than keystrokes`);
  }
  await field.blur();
  const read = (name: string) => page.evaluate((n) => performance.getEntriesByName(n).map((e) => e.duration), name);
  const measures = await read(INPUT_TO_PAINT);
  const settled = await read(INPUT_TO_SETTLED);
  if (measures.length < keystrokes) throw new Error(`${label}: ${measures.length} measures for ${keystrokes} keystrokes`);
  if ((await field.inputValue()) !== original) throw new Error(`${label}: left at ${await field.inputValue()}, not ${original}`);
  return { field: label, keystrokes, measures, settled };
}

/** Types into the demo pump train's workspace; resolves with the measures per field. */
export async function benchWorkspaceTyping(server: BenchServer, keystrokes = 50): Promise<{ timings: BrowserTiming[]; soilBand: boolean }> {
  const { chromium } = await import("playwright-core");
  const { DEMO_PROJECT_CODE } = await import("../modules/platform/demo");
  const { getProjectByCode, listFoundations } = await import("../db/queries/projects");
  const project = await getProjectByCode(DEMO_PROJECT_CODE);
  if (!project) throw new Error("the demo project is missing: run `npm start` once first");
  const designer = await server.cookieFor("designer@plinthwise.test");
  const { getUserByEmail } = await import("../db/queries/accounts");
  const designerUser = await getUserByEmail("designer@plinthwise.test");
  if (!designerUser) throw new Error("no demo designer: seed the demo first");
  const actor = { userId: designerUser.id, isAdmin: false };
  const foundation = (await listFoundations(actor, project.id)).find((f) => f.tag === "PH1-P101");
  if (!foundation) throw new Error("the demo pump train PH1-P101 is missing");
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    // the e2e suite's flags (tests/e2e/support/browser.ts)
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-dev-shm-usage"],
  });
  try {
    const ctx = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1360, height: 900 } });
    const [name, ...value] = designer.split("=");
    await ctx.addCookies([{ name: name ?? "", value: decodeURIComponent(value.join("=")), url: server.baseUrl }]);
    const page = await ctx.newPage();
    await page.goto(`/projects/${project.id}/foundations/${foundation.id}`);
    await page.getByTestId("plot-displacement").locator("svg path").first().waitFor({ timeout: 60_000 });
    // The soil band is on by default (G / 1.5 and 1.5 G): the results summary says its verdict.
    const soilBand = (await page.getByText("Soil band:", { exact: false }).count()) > 0;
    const timings = [await typeInto(page, "block: box 1 x to", "block.solids[0].x[1]", keystrokes)];
    // The demo gives the soil's stiffness as shear-wave velocity (G = ρ Vs²); G when it is given as G.
    const byG = (await page.locator('input[name="soil.shearModulus"]').count()) > 0;
    timings.push(await typeInto(page, byG ? "soil: shear modulus G" : "soil: shear-wave velocity Vs", byG ? "soil.shearModulus" : "soil.shearWaveVelocity", keystrokes));
    // let the last autosave finish before the page closes
    await page.waitForTimeout(1500);
    await ctx.close();
    return { timings, soilBand };
  } finally {
    await browser.close();
  }
}

export function formatBrowserTable(timings: BrowserTiming[]): string {
  const rows = [...timings, { field: "both fields", keystrokes: timings.reduce((a, t) => a + t.keystrokes, 0), measures: timings.flatMap((t) => t.measures), settled: timings.flatMap((t) => t.settled) }];
  const head = ["field", "keystrokes", "p50 ms", "p95 ms", "max ms", "settled p50 ms", "settled p95 ms"];
  const body = rows.map((t) => {
    const s = summarise(t.measures);
    const d = summarise(t.settled);
    return [t.field, String(t.keystrokes), s.p50.toFixed(1), s.p95.toFixed(1), s.max.toFixed(1), d.p50.toFixed(1), d.p95.toFixed(1)];
  });
  const widths = head.map((h, c) => Math.max(h.length, ...body.map((b) => (b[c] ?? "").length)));
  const line = (cells: string[]) => cells.map((cell, c) => (c === 0 ? cell.padEnd(widths[c] ?? 0) : cell.padStart(widths[c] ?? 0))).join("  ");
  return [line(head), ...body.map(line)].join("\n");
}
