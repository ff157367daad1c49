"use client";

import { useCallback, useRef, useState, type ReactNode } from "react";
import { fieldLabel } from "@/modules/revisions/field-labels";
import type { LeafValue } from "@/modules/revisions/diff";
import { FieldPick, FieldPickProvider } from "@/app/_components/workspace/field-pick";
import { CommentForm } from "../revision-forms";

/**
 * The part of a revision page where values can be chosen for a comment: choosing one (click,
 * Enter or Space on it) opens a comment box on that field, named in words.
 */
export function FieldCommentArea({ projectId, foundationId, revisionId, mayComment, children }: { projectId: string; foundationId: string; revisionId: string; mayComment: boolean; children: ReactNode }) {
  const [field, setField] = useState<string | null>(null);
  const box = useRef<HTMLElement>(null);
  const pick = useCallback((path: string) => {
    setField(path);
    // after the box has rendered with the new field
    requestAnimationFrame(() => box.current?.querySelector("textarea")?.focus());
  }, []);
  return (
    <FieldPickProvider value={mayComment ? pick : null}>
      {mayComment ? <p className="text-xs text-basalt-500">Choose a value or a check below to comment on it.</p> : null}
      {children}
      {field !== null ? (
        <section
          ref={box}
          role="dialog"
          aria-labelledby="field-comment-heading"
          className="slab fixed bottom-4 right-4 z-20 w-[28rem] max-w-[calc(100vw-2rem)] space-y-2 p-4 shadow-lg"
          data-testid="field-comment-box"
          onKeyDown={(e) => {
            if (e.key === "Escape") setField(null);
          }}
        >
          <div className="flex items-start justify-between gap-2">
            <h3 id="field-comment-heading" className="text-sm">
              Comment on <span data-testid="field-comment-label">{fieldLabel(field)}</span>
            </h3>
            <button type="button" className="btn-quiet px-2 py-0.5 text-xs" onClick={() => setField(null)}>
              Close
            </button>
          </div>
          <CommentForm key={field} projectId={projectId} foundationId={foundationId} revisionId={revisionId} fieldPath={field} idPrefix="field-comment" />
        </section>
      ) : null}
    </FieldPickProvider>
  );
}

function shown(v: LeafValue): string {
  if (v === null) return "—";
  return typeof v === "string" ? v : String(v);
}

/** The input as issued, one row a field, each value choosable for a comment. */
export function InputValues({ rows }: { rows: { path: string; value: LeafValue }[] }) {
  return (
    <div className="max-h-[480px] overflow-auto rounded-plinth border border-grout-200" tabIndex={0} role="region" aria-label="Input as issued, scrollable">
      <table data-testid="revision-input-values">
        <thead className="sticky top-0">
          <tr>
            <th>Field</th>
            <th className="text-right">Value (SI)</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.path}>
              <td className="text-xs">{fieldLabel(r.path)}</td>
              <td className="text-right font-mono text-xs">
                <FieldPick path={r.path}>{shown(r.value)}</FieldPick>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
