// The workspace's autosave rules, kept pure so they can be tested without a browser: when a
// draft may be saved on its own, what the save line says, and which link clicks leave the page.

/**
 * Pause after the last change before the draft saves itself. Long enough that a designer
 * typing a number does not save every keystroke, short enough that little is at risk
 * (a usability choice, not a published figure).
 */
export const AUTOSAVE_PAUSE_MS = 2000;

/** keepalive requests are limited to 64 KiB of body by the Fetch standard; stay under it. */
export const KEEPALIVE_BODY_LIMIT = 60_000;

export type DraftSaveStatus =
  /** Nothing to save: the form is what is stored. */
  | "clean"
  /** Changes that will save themselves after the pause. */
  | "unsaved"
  /** Changes that cannot be saved: the form has fields marked in red. */
  | "invalid"
  | "saving"
  /** The last save succeeded and nothing has changed since. */
  | "saved"
  /** Someone else saved first: nothing is saved until the designer decides. */
  | "conflict"
  /** The server refused or could not be reached: kept unsaved, retried on the next change. */
  | "error";

export interface DraftSaveFacts {
  dirty: boolean;
  valid: boolean;
  saving: boolean;
  conflict: boolean;
  /** The last attempt failed (not a conflict) and the form has not changed since. */
  failed: boolean;
  /** A save succeeded in this visit. */
  savedOnce: boolean;
}

export function draftSaveStatus(f: DraftSaveFacts): DraftSaveStatus {
  if (f.saving) return "saving";
  if (f.conflict) return "conflict";
  if (!f.dirty) return f.savedOnce ? "saved" : "clean";
  if (f.failed) return "error";
  return f.valid ? "unsaved" : "invalid";
}

/** Only changes that can be saved, and only when no one has to decide anything first. */
export function mayAutosave(status: DraftSaveStatus, readOnly: boolean): boolean {
  return !readOnly && status === "unsaved";
}

/** Leaving now would lose what is typed (a save on its way may still fail). */
export function hasUnsavedWork(status: DraftSaveStatus): boolean {
  return status === "unsaved" || status === "invalid" || status === "saving" || status === "conflict" || status === "error";
}

/** The words of the save line (the version is shown while nothing is pending). */
export function draftSaveLabel(status: DraftSaveStatus, version: number, savedAt: string | null): string {
  switch (status) {
    case "clean":
      return `v${version}`;
    case "saved":
      return `saved ${savedAt ?? ""} · v${version}`.replace("  ", " ");
    case "saving":
      return "saving…";
    case "unsaved":
      return "unsaved changes";
    case "invalid":
      return "unsaved changes: fix the fields marked in red to save";
    case "conflict":
      return "conflict: not saved";
    case "error":
      return "unsaved changes: saving failed";
  }
}

/**
 * Whether following `href` from the page at `current` replaces this page inside the app (a
 * client-side navigation the browser's beforeunload would not catch). Same-page anchors
 * (only the hash differs) stay; another origin is a full page load, which beforeunload covers.
 */
export function isInAppLeave(href: string, current: string): boolean {
  let to: URL;
  let from: URL;
  try {
    from = new URL(current);
    to = new URL(href, from);
  } catch {
    return false;
  }
  if (to.protocol !== "http:" && to.protocol !== "https:") return false;
  if (to.origin !== from.origin) return false;
  return to.pathname !== from.pathname || to.search !== from.search;
}
