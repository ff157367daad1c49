import { readFileSync } from "node:fs";
import path from "node:path";
import type { APIRequestContext, Locator, Page } from "playwright-core";
import { parseAnalysisInput, type AnalysisInput } from "@/modules/calc";
import { textOf } from "./desk";

// Page object and API helpers for the foundation workspace
// (/projects/<projectId>/foundations/<foundationId>).

const uuid = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";
/** A foundation workspace: /projects/<uuid>/foundations/<uuid>. */
export const workspaceUrl = new RegExp(`^/projects/${uuid}/foundations/(${uuid})$`);

export type CalcState = "fresh" | "stale" | "error";
export type Axis = "x" | "y" | "z";
export type End = "from" | "to";

/**
 * The text of the checks summary: "all N checks pass", "K of N checks fail" or "K of N checks
 * fail, A of them accepted with justification" (failed band checks the designer accepted).
 */
export interface ChecksSummary {
  failing: number;
  total: number;
  accepted?: number;
}

export function parseSummary(text: string): ChecksSummary {
  const all = /^all (\d+) checks pass$/.exec(text);
  if (all) return { failing: 0, total: Number(all[1]) };
  const some = /^(\d+) of (\d+) checks fail(?:, (\d+) of them accepted with justification)?$/.exec(text);
  if (some) return { failing: Number(some[1]), total: Number(some[2]), ...(some[3] ? { accepted: Number(some[3]) } : {}) };
  throw new Error(`not a checks summary: "${text}"`);
}

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}

export class WorkspacePage {
  constructor(readonly page: Page) {}

  async open(projectId: string, foundationId: string): Promise<void> {
    await this.page.goto(`/projects/${projectId}/foundations/${foundationId}`);
    await this.heading.waitFor({ state: "visible" });
  }

  /** From a project's foundations page: follows the tag's link in the foundations table. */
  async openFromTable(tag: string): Promise<string> {
    await this.page.getByTestId("foundation-table").getByRole("link", { name: tag, exact: true }).click();
    await this.page.waitForURL((u) => workspaceUrl.test(u.pathname), { timeout: 20_000 });
    await this.heading.waitFor({ state: "visible" });
    const id = workspaceUrl.exec(new URL(this.page.url()).pathname)?.[1];
    if (!id) throw new Error(`no foundation id in ${this.page.url()}`);
    return id;
  }

  get heading(): Locator {
    return this.page.getByRole("heading", { level: 1, name: /^Foundation / });
  }
  get readOnlyTag(): Locator {
    return this.heading.getByText("read-only", { exact: true });
  }
  get calcState(): Locator {
    return this.page.getByTestId("calc-state");
  }
  async state(): Promise<CalcState> {
    return (await this.calcState.getAttribute("data-state")) as CalcState;
  }
  /** Waits until the results badge says `state` (the live calculation is debounced). */
  async waitForState(state: CalcState, timeout = 20_000): Promise<void> {
    await this.page.locator(`[data-testid="calc-state"][data-state="${state}"]`).waitFor({ state: "visible", timeout });
  }
  get summary(): Locator {
    return this.page.getByTestId("checks-summary");
  }
  async checks(): Promise<ChecksSummary> {
    return parseSummary(await textOf(this.summary));
  }
  get checksTable(): Locator {
    return this.page.getByTestId("checks-table");
  }
  checkRows(verdict?: "pass" | "fail" | "accepted"): Locator {
    return this.checksTable.locator(verdict ? `tbody tr[data-verdict="${verdict}"]` : "tbody tr");
  }
  panel(id: string): Locator {
    return this.page.getByTestId(`panel-${id}`);
  }
  get cautions(): Locator {
    return this.page.getByTestId("cautions");
  }

  /** A box coordinate of the block table, e.g. box(1, "x", "to"); `unit` pins the label's unit. */
  box(n: number, axis: Axis, end: End, unit?: string): Locator {
    return this.numberField(`Box ${n} ${axis} ${end}`, unit);
  }
  /** A number input by its label; without `unit` any "(unit)" suffix matches. */
  numberField(label: string, unit?: string): Locator {
    if (unit !== undefined) return this.page.getByLabel(`${label} (${unit})`, { exact: true });
    return this.page.getByLabel(new RegExp(`^\\s*${escapeRegExp(label)}(\\s+\\([^)]*\\))?\\s*$`));
  }
  async setNumber(field: Locator, value: string): Promise<void> {
    await field.fill(value);
    await field.blur();
  }

  get saveButton(): Locator {
    return this.page.getByRole("button", { name: "Save draft" });
  }
  get saveState(): Locator {
    return this.page.getByTestId("save-state");
  }
  /** The version the save-state shows while nothing is pending ("v12"). */
  async shownVersion(): Promise<number> {
    const text = await textOf(this.saveState);
    const m = /^v(\d+)$/.exec(text);
    if (!m) throw new Error(`save-state is "${text}", not a bare version`);
    return Number(m[1]);
  }
  /** What the save line says: clean, unsaved, invalid, saving, saved, conflict or error. */
  async saveStatus(): Promise<string | null> {
    return this.saveState.getAttribute("data-state");
  }
  /** Waits until the save line is in `status` (autosave runs about 2 s after the last change). */
  async waitForSaveStatus(status: string, timeout = 20_000): Promise<void> {
    await this.page.locator(`[data-testid="save-state"][data-state="${status}"]`).waitFor({ state: "visible", timeout });
  }
  /**
   * Saves now and waits until nothing is left to save; returns the stored version N. The draft
   * also saves itself after a pause, so when autosave got there first ("saved … · vN") or the
   * form is back to what is stored ("vN": an edit undone before the pause ran out) there is
   * nothing to click.
   */
  async save(): Promise<number> {
    if (await this.saveButton.isEnabled()) await this.saveButton.click({ timeout: 3000 }).catch(() => undefined);
    await this.page
      .locator('[data-testid="save-state"][data-state="saved"], [data-testid="save-state"][data-state="clean"]')
      .filter({ hasText: /(^saved .* · v\d+$)|(^v\d+$)/ })
      .waitFor({ state: "visible", timeout: 20_000 });
    const m = /v(\d+)$/.exec(await textOf(this.saveState));
    if (!m) throw new Error("no version in the save-state");
    return Number(m[1]);
  }
  get conflict(): Locator {
    return this.page.getByRole("alertdialog", { name: "Save conflict" });
  }

  unitSwitch(name: "SI" | "US customary"): Locator {
    return this.page.getByRole("radiogroup", { name: "Display units" }).getByRole("radio", { name, exact: true });
  }

  /** A nivo line plot has drawn at least one curve with real geometry. */
  async plotPaths(testId: string): Promise<string[]> {
    const plot = this.page.getByTestId(testId);
    await plot.locator("svg").first().waitFor({ state: "visible" });
    return plot.locator("svg path").evaluateAll((paths) =>
      paths
        .map((p) => p.getAttribute("d") ?? "")
        // A drawn curve: a move and many line segments, not a grid or axis tick.
        .filter((d) => /^M[\d.\-e]+,[\d.\-e]+(L[\d.\-e]+,[\d.\-e]+){20,}/.test(d.replace(/\s+/g, ""))),
    );
  }
}

// ---- the draft and foundation API with a signed-in context's cookie ----

export interface DraftBody {
  draft: { foundationId: string; version: number; input: AnalysisInput | null };
}

export async function getDraft(request: APIRequestContext, projectId: string, foundationId: string): Promise<DraftBody["draft"]> {
  const res = await request.get(`/api/v1/projects/${projectId}/foundations/${foundationId}/draft`);
  if (res.status() !== 200) throw new Error(`GET draft answered ${res.status()}: ${await res.text()}`);
  return ((await res.json()) as DraftBody).draft;
}

export async function putDraft(request: APIRequestContext, projectId: string, foundationId: string, version: number, input: unknown): Promise<DraftBody["draft"]> {
  const res = await request.put(`/api/v1/projects/${projectId}/foundations/${foundationId}/draft`, { data: { version, input } });
  if (res.status() !== 200) throw new Error(`PUT draft answered ${res.status()}: ${await res.text()}`);
  return ((await res.json()) as DraftBody).draft;
}

export async function foundationIdByTag(request: APIRequestContext, projectId: string, tag: string): Promise<string> {
  const res = await request.get(`/api/v1/projects/${projectId}/foundations`);
  if (res.status() !== 200) throw new Error(`GET foundations answered ${res.status()}`);
  const { foundations } = (await res.json()) as { foundations: { id: string; tag: string }[] };
  const found = foundations.find((f) => f.tag === tag);
  if (!found) throw new Error(`no foundation ${tag} in project ${projectId}`);
  return found.id;
}

/**
 * A throwaway foundation with a unique tag whose draft (version 1) is `input`, so a
 * journey that saves does not touch the demo's foundations.
 */
export async function seededFoundation(request: APIRequestContext, projectId: string, tagPrefix: string, input: unknown): Promise<{ id: string; tag: string }> {
  const tag = `${tagPrefix}-${Date.now()}`;
  const res = await request.post(`/api/v1/projects/${projectId}/foundations`, { data: { tag, machineTrain: "browser-test copy of the raw-water pump train" } });
  if (res.status() !== 201) throw new Error(`POST foundation answered ${res.status()}: ${await res.text()}`);
  const { foundation } = (await res.json()) as { foundation: { id: string } };
  const draft = await putDraft(request, projectId, foundation.id, 0, input);
  if (draft.version !== 1) throw new Error(`the new draft is version ${draft.version}, not 1`);
  return { id: foundation.id, tag };
}

/** An example input from examples/, as the contract's parser reads it (the seed stores it that way). */
export function example(file: string): AnalysisInput {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", file), "utf8")));
  if (!parsed.ok) throw new Error(`examples/${file} does not parse`);
  return parsed.input;
}
