// The workspace's autosave rules: what the save line says, when a draft may save itself,
// when leaving must ask, and which link clicks leave the page inside the app.
import { describe, expect, it } from "vitest";
import { draftSaveLabel, draftSaveStatus, hasUnsavedWork, isInAppLeave, mayAutosave, type DraftSaveFacts } from "@/modules/desk/draft-autosave";

const facts = (f: Partial<DraftSaveFacts>): DraftSaveFacts => ({ dirty: false, valid: true, saving: false, conflict: false, failed: false, savedOnce: false, ...f });

describe("save status", () => {
  it("is clean on arrival and saved after a save with nothing changed since", () => {
    expect(draftSaveStatus(facts({}))).toBe("clean");
    expect(draftSaveStatus(facts({ savedOnce: true }))).toBe("saved");
  });

  it("says unsaved once edited, even after an earlier save", () => {
    expect(draftSaveStatus(facts({ dirty: true, savedOnce: true }))).toBe("unsaved");
  });

  it("keeps a form with fields in error unsaved and never autosaves it", () => {
    const s = draftSaveStatus(facts({ dirty: true, valid: false }));
    expect(s).toBe("invalid");
    expect(mayAutosave(s, false)).toBe(false);
    expect(hasUnsavedWork(s)).toBe(true);
    expect(draftSaveLabel(s, 3, null)).toBe("unsaved changes: fix the fields marked in red to save");
  });

  it("stops autosaving on a conflict and after a refused save until the form changes", () => {
    expect(draftSaveStatus(facts({ dirty: true, conflict: true }))).toBe("conflict");
    expect(mayAutosave("conflict", false)).toBe(false);
    expect(draftSaveStatus(facts({ dirty: true, failed: true }))).toBe("error");
    expect(mayAutosave("error", false)).toBe(false);
    expect(hasUnsavedWork("conflict")).toBe(true);
    expect(hasUnsavedWork("error")).toBe(true);
  });

  it("autosaves only saveable changes, and never for a read-only member", () => {
    expect(mayAutosave("unsaved", false)).toBe(true);
    expect(mayAutosave("unsaved", true)).toBe(false);
    for (const s of ["clean", "saved", "saving"] as const) expect(mayAutosave(s, false)).toBe(false);
  });

  it("asks before leaving only when something is not stored", () => {
    expect(hasUnsavedWork("clean")).toBe(false);
    expect(hasUnsavedWork("saved")).toBe(false);
    expect(hasUnsavedWork("saving")).toBe(true);
    expect(hasUnsavedWork("unsaved")).toBe(true);
  });

  it("shows the bare version while nothing is pending and the time and version after a save", () => {
    expect(draftSaveLabel("clean", 7, null)).toBe("v7");
    expect(draftSaveLabel("saved", 8, "10:02:03")).toBe("saved 10:02:03 · v8");
    expect(draftSaveLabel("conflict", 8, null)).toBe("conflict: not saved");
  });
});

describe("which link clicks leave the page inside the app", () => {
  const here = "http://127.0.0.1:3000/projects/p/foundations/f";
  it("another path or query of the app leaves", () => {
    expect(isInAppLeave("/projects/p", here)).toBe(true);
    expect(isInAppLeave("/projects/p/foundations/f?tab=2", here)).toBe(true);
    expect(isInAppLeave("http://127.0.0.1:3000/projects/p/members", here)).toBe(true);
  });
  it("an anchor on this page, another origin (beforeunload covers it) and mailto do not", () => {
    expect(isInAppLeave("#soil", here)).toBe(false);
    expect(isInAppLeave(`${here}#soil`, here)).toBe(false);
    expect(isInAppLeave("https://example.com/x", here)).toBe(false);
    expect(isInAppLeave("mailto:someone@example.com", here)).toBe(false);
  });
});
