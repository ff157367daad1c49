"use client";

import { useCallback, useEffect, useLayoutEffect, useRef, useState } from "react";
import type { AnalysisInputDocument } from "@/modules/calc";
import type { MachinePlacement } from "@/modules/desk/machine-placements";
import { AUTOSAVE_PAUSE_MS, draftSaveStatus, KEEPALIVE_BODY_LIMIT, mayAutosave, type DraftSaveStatus } from "@/modules/desk/draft-autosave";
import { fieldLabel } from "@/modules/revisions/field-labels";
import type { CalcIssue } from "./use-calculation";

export interface DraftConflict {
  currentVersion: number;
  current: AnalysisInputDocument | null;
  /** The stored draft's machine placements (datums, vendor figures). */
  placements: MachinePlacement[];
  /** "Keep mine for now": the dialog is closed, nothing saves until the next explicit save. */
  dismissed: boolean;
}

interface SaveAnswer {
  draft?: { version: number };
  error?: { message?: string; currentVersion?: number; issues?: CalcIssue[] };
  current?: { version: number; input: AnalysisInputDocument | null; document?: AnalysisInputDocument | null; placements?: MachinePlacement[] };
}

/**
 * Saving the draft: by hand (Save draft) or on its own once typing pauses, when the page is
 * hidden and when the window loses focus. Every save sends the version it started from
 * (PUT .../draft, optimistic concurrency): a stale one answers 409 and the conflict stops
 * autosave until the designer chooses. An incomplete form (blanks only) saves like any other;
 * one with a wrong value (`valid` false) is never sent on its own: it stays "unsaved" and says so. One save is in flight at a time.
 */
/** The server's refusal with the fields it names, so a field the form does not mark is still found. */
function failureMessage(message: string, issues: CalcIssue[] | undefined): string {
  if (!issues?.length) return message;
  const named = issues.slice(0, 3).map((i) => `${fieldLabel(i.path)}: ${i.message}`);
  const more = issues.length > 3 ? ` (and ${issues.length - 3} more)` : "";
  return `${message} ${named.join("; ")}${more}.`;
}

/**
 * What a save sends after the version: the input and, when given, the machine placements
 * (datum on the block, vendor figures). Compared as text to tell whether anything is unsaved.
 */
export function draftSaveBody(document: unknown, placements?: unknown): string {
  return `"input":${JSON.stringify(document)}${placements === undefined ? "" : `,"placements":${JSON.stringify(placements)}`}`;
}

export function useDraftSave(opts: {
  url: string;
  document: unknown;
  /** The machine placements saved with the input (PUT .../draft `placements`). */
  placements?: unknown;
  initialSavedBody: string;
  version: number;
  setVersion: (v: number) => void;
  valid: boolean;
  readOnly: boolean;
  onIssues: (issues: CalcIssue[]) => void;
}) {
  const { url, document, placements, version, setVersion, valid, readOnly, onIssues } = opts;
  const body = draftSaveBody(document, placements);
  const [savedBody, setSavedBody] = useState(opts.initialSavedBody);
  const [saving, setSaving] = useState(false);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const [conflict, setConflict] = useState<DraftConflict | null>(null);
  const [failure, setFailure] = useState<{ body: string; message: string } | null>(null);

  const latest = useRef({ body, version, savedBody, valid });
  useLayoutEffect(() => {
    latest.current = { body, version, savedBody, valid };
  });
  const inFlight = useRef(false);

  const dirty = body !== savedBody;
  const status: DraftSaveStatus = draftSaveStatus({ dirty, valid, saving, conflict: conflict !== null, failed: failure?.body === body, savedOnce: savedAt !== null });

  const save = useCallback(
    async (how: "manual" | "auto"): Promise<void> => {
      if (readOnly || inFlight.current) return;
      const { body: sending, version: from, savedBody: stored, valid: ok } = latest.current;
      if (sending === stored) return;
      // Autosave never sends a form with fields in error; an explicit save may, so the
      // server names what is wrong.
      if (how === "auto" && !ok) return;
      inFlight.current = true;
      setSaving(true);
      const payload = `{"version":${from},${sending}}`;
      try {
        const res = await fetch(url, {
          method: "PUT",
          headers: { "content-type": "application/json" },
          body: payload,
          // Lets a save started as the tab closes finish.
          keepalive: payload.length < KEEPALIVE_BODY_LIMIT,
        });
        const answer = (await res.json().catch(() => ({}))) as SaveAnswer;
        if (res.ok && answer.draft) {
          setVersion(answer.draft.version);
          latest.current.version = answer.draft.version;
          latest.current.savedBody = sending;
          setSavedBody(sending);
          setSavedAt(new Date().toLocaleTimeString());
          setFailure(null);
          setConflict(null);
        } else if (res.status === 409) {
          setConflict({ currentVersion: answer.error?.currentVersion ?? answer.current?.version ?? 0, current: answer.current?.document ?? answer.current?.input ?? null, placements: answer.current?.placements ?? [], dismissed: false });
        } else {
          if (answer.error?.issues) onIssues(answer.error.issues);
          setFailure({ body: sending, message: failureMessage(answer.error?.message ?? `Saving failed (${res.status})`, answer.error?.issues) });
        }
      } catch {
        setFailure({ body: sending, message: "The server could not be reached; your changes are kept here and saved with the next change." });
      } finally {
        inFlight.current = false;
        setSaving(false);
      }
    },
    [url, readOnly, setVersion, onIssues],
  );

  // After a pause in typing (the timer restarts with every change and after every save, so
  // edits made while a save was in flight are saved next).
  const autosave = mayAutosave(status, readOnly);
  useEffect(() => {
    if (!autosave) return;
    const t = setTimeout(() => void save("auto"), AUTOSAVE_PAUSE_MS);
    return () => clearTimeout(t);
  }, [autosave, body, save]);

  // Leaving the tab or the window: save at once rather than after the pause.
  const autosaveRef = useRef(autosave);
  useLayoutEffect(() => {
    autosaveRef.current = autosave;
  });
  useEffect(() => {
    const now = () => {
      if (autosaveRef.current) void save("auto");
    };
    const onVisibility = () => {
      if (globalThis.document.visibilityState === "hidden") now();
    };
    globalThis.document.addEventListener("visibilitychange", onVisibility);
    window.addEventListener("blur", now);
    window.addEventListener("pagehide", now);
    return () => {
      globalThis.document.removeEventListener("visibilitychange", onVisibility);
      window.removeEventListener("blur", now);
      window.removeEventListener("pagehide", now);
    };
  }, [save]);

  /** "Load the stored version": the form becomes what is stored, at its version. */
  const acceptStored = useCallback(
    (storedBody: string | null) => {
      if (!conflict) return;
      if (storedBody !== null) {
        latest.current.savedBody = storedBody;
        setSavedBody(storedBody);
      }
      latest.current.version = conflict.currentVersion;
      setVersion(conflict.currentVersion);
      setConflict(null);
      setFailure(null);
    },
    [conflict, setVersion],
  );

  return {
    status,
    dirty,
    savedAt,
    conflict,
    failure: failure?.body === body ? failure.message : null,
    saveNow: () => save("manual"),
    /** Saves at once if autosave would (used when the person chooses to stay on the page). */
    flush: () => {
      if (autosaveRef.current) void save("auto");
    },
    acceptStored,
    dismissConflict: () => setConflict((c) => (c ? { ...c, dismissed: true } : c)),
  };
}
