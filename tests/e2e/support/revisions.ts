import type { APIRequestContext, Locator, Page } from "playwright-core";
import { textOf } from "./desk";

// Page objects and API helpers for a foundation's revisions
// (/projects/<p>/foundations/<f>/revisions, one revision, and the side-by-side view).

const uuid = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";
export const revisionUrl = new RegExp(`^/projects/${uuid}/foundations/${uuid}/revisions/(${uuid})$`);

/** The id of the foundation with this tag, through the API with the page's own session. */
export async function foundationIdByTag(request: APIRequestContext, projectId: string, tag: string): Promise<string> {
  const res = await request.get(`/api/v1/projects/${projectId}/foundations`);
  const body = (await res.json()) as { foundations: { id: string; tag: string }[] };
  const id = body.foundations.find((f) => f.tag === tag)?.id;
  if (!id) throw new Error(`no foundation ${tag}`);
  return id;
}

/** Saves the draft with one change (as the workspace would), through the API with the page's session. */
export async function changeDraft(request: APIRequestContext, projectId: string, foundationId: string, edit: (input: { soil: Record<string, number> }) => void): Promise<void> {
  const url = `/api/v1/projects/${projectId}/foundations/${foundationId}/draft`;
  const current = (await (await request.get(url)).json()) as { draft: { version: number; input: { soil: Record<string, number> } } };
  edit(current.draft.input);
  const res = await request.put(url, { data: { version: current.draft.version, input: current.draft.input } });
  if (res.status() !== 200) throw new Error(`draft save answered ${res.status()}: ${await res.text()}`);
}

export class RevisionPages {
  constructor(readonly page: Page) {}

  async openList(projectId: string, foundationId: string): Promise<void> {
    await this.page.goto(`/projects/${projectId}/foundations/${foundationId}/revisions`);
    await this.heading.waitFor({ state: "visible" });
  }

  async open(projectId: string, foundationId: string, revisionId: string): Promise<void> {
    await this.page.goto(`/projects/${projectId}/foundations/${foundationId}/revisions/${revisionId}`);
    await this.heading.waitFor({ state: "visible" });
  }

  get heading(): Locator {
    return this.page.getByRole("heading", { level: 1 });
  }

  get status(): Locator {
    return this.page.getByTestId("revision-status").first();
  }

  /**
   * On the list page: issues the saved draft with a revision note and waits for the new
   * revision's page; returns its id. When the draft's checks fail, the confirmation that
   * lists them (rendered only then) is answered with "Issue anyway".
   */
  async issue(note = "Changed as the checker asked; see the side-by-side view."): Promise<string> {
    await this.page.getByLabel("Revision note: what changed and why").fill(note);
    const confirm = this.page.getByTestId("issue-failing-dialog");
    const failing = (await confirm.count()) > 0;
    await this.page.getByRole("button", { name: "Issue for check" }).click();
    if (failing) await confirm.getByRole("button", { name: "Issue anyway" }).click();
    await this.page.waitForURL((u) => revisionUrl.test(u.pathname), { timeout: 30_000 });
    await this.heading.waitFor({ state: "visible" });
    const id = revisionUrl.exec(new URL(this.page.url()).pathname)?.[1];
    if (!id) throw new Error(`no revision id in ${this.page.url()}`);
    return id;
  }

  /** The label in the revision page's heading ("PH1-P101 revision C" -> "C"). */
  async label(): Promise<string> {
    const m = /revision (\S+)$/.exec(await textOf(this.heading));
    if (!m?.[1]) throw new Error("no revision label in the heading");
    return m[1];
  }

  /** On the list page: picks the two revisions by label and opens the side-by-side view. */
  async compare(olderLabel: string, newerLabel: string): Promise<void> {
    await this.page.getByLabel("Older").selectOption({ label: olderLabel });
    await this.page.getByLabel("Newer").selectOption({ label: newerLabel });
    await this.page.getByRole("button", { name: "Show differences" }).click();
    await this.page.waitForURL((u) => u.pathname.endsWith("/revisions/compare"), { timeout: 20_000 });
    await this.page.getByTestId("diff-input").waitFor({ state: "visible" });
  }

  /** On a revision page: chooses the value labelled `fieldLabel` (e.g. "Soil · Poisson's ratio") and comments on it. */
  async comment(fieldLabel: string, body: string): Promise<void> {
    await this.page.getByTitle(`Comment on ${fieldLabel}`, { exact: true }).click();
    const box = this.commentBox;
    await box.waitFor({ state: "visible" });
    await box.getByLabel("Comment", { exact: true }).fill(body);
    await box.getByRole("button", { name: "Post comment" }).click();
    await box.getByText("Comment posted.").waitFor({ state: "visible", timeout: 20_000 });
  }

  /** The comment box that choosing a value opens. */
  get commentBox(): Locator {
    return this.page.getByTestId("field-comment-box");
  }

  async decide(outcome: "Return with comments" | "Approve revision", note = ""): Promise<void> {
    if (note) await this.page.getByLabel("Note to the designer (needed to return)").fill(note);
    await this.page.getByRole("button", { name: outcome }).click();
    // The page re-renders with the new status (and without the verdict form).
    const status = outcome === "Approve revision" ? "approved" : "returned with comments";
    await this.page.getByTestId("revision-status").first().filter({ hasText: status }).waitFor({ state: "visible", timeout: 20_000 });
  }
}
