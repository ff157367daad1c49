"use client";

import { useFormikContext } from "formik";
import { createContext, useContext, useMemo, useState, type ReactNode } from "react";
import { fieldLabel } from "@/modules/revisions/field-labels";
import { placeComments, samePlacement, type OpenFieldComment } from "@/modules/desk/review-markers";

/** An open review comment as the workspace receives it from the page. */
export type WorkspaceComment = OpenFieldComment;

const ByField = createContext<Map<string, WorkspaceComment[]>>(new Map());

/** Scrolls to the form field and focuses it. */
function showField(name: string) {
  const el = document.querySelector<HTMLElement>(`[name="${CSS.escape(name)}"]`);
  if (!el) return;
  el.scrollIntoView({ block: "center", behavior: "smooth" });
  el.focus({ preventScroll: true });
}

/**
 * The designer's view of the open review comments: a marker beside each field a comment
 * concerns (through context, read by the fields) and a list above the form whose entries
 * scroll to their field; comments on results or the whole revision link to their revision.
 */
export function ReviewCommentsProvider({ comments, revisionHref, children }: { comments: WorkspaceComment[]; revisionHref: (revisionId: string) => string; children: ReactNode }) {
  const { values } = useFormikContext<unknown>();
  // Placed again on every change of the form; the earlier placement (and so the markers' context)
  // is kept while nothing moved (React's "information from previous renders" pattern).
  const next = useMemo(() => placeComments(comments, values), [comments, values]);
  const [kept, setKept] = useState(next);
  const same = samePlacement(kept, next);
  if (!same) setKept(next);
  const { placed, byField } = same ? kept : next;
  return (
    <ByField.Provider value={byField}>
      {comments.length ? (
        <section className="slab border-ochre-500 p-4" aria-labelledby="open-comments-h" data-testid="open-review-comments">
          <h2 id="open-comments-h" className="text-base">
            Open review comments ({comments.length})
          </h2>
          <ul className="mt-2 space-y-2 text-sm">
            {placed.map(({ comment: c, fieldName }) => (
              <li key={c.id} data-testid="open-review-comment">
                <span className="font-semibold">{c.fieldPath ? fieldLabel(c.fieldPath) : "Whole revision"}</span>{" "}
                <span className="text-xs text-basalt-500">
                  ({c.authorName}, on revision {c.revisionLabel})
                </span>
                <p className="whitespace-pre-wrap text-xs text-basalt-700">{c.body}</p>
                <p className="text-xs">
                  {fieldName ? (
                    <a
                      href={`#${fieldName}`}
                      onClick={(e) => {
                        e.preventDefault();
                        showField(fieldName);
                      }}
                    >
                      Go to the field
                    </a>
                  ) : null}
                  {fieldName ? " · " : null}
                  <a href={revisionHref(c.revisionId)}>Open revision {c.revisionLabel}</a>
                </p>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {children}
    </ByField.Provider>
  );
}

/** Beside a field: how many open comments concern it, their text on hover or focus. */
export function FieldCommentMarker({ name }: { name: string }) {
  const comments = useContext(ByField).get(name);
  if (!comments?.length) return null;
  const text = comments.map((c) => `${c.authorName} (revision ${c.revisionLabel}): ${c.body}`).join("\n\n");
  return (
    <span className="group relative ml-1 inline-block align-middle normal-case tracking-normal">
      <span
        tabIndex={0}
        className="tag cursor-help bg-ochre-100 text-ochre-700 focus-visible:outline focus-visible:outline-2"
        aria-label={`${comments.length} open review ${comments.length === 1 ? "comment" : "comments"}: ${text}`}
        data-testid="field-comment-marker"
      >
        {comments.length} {comments.length === 1 ? "comment" : "comments"}
      </span>
      <span
        role="tooltip"
        className="invisible absolute left-0 top-full z-30 mt-1 w-72 whitespace-pre-wrap rounded-plinth border border-grout-200 bg-white p-2 text-2xs font-normal text-basalt-700 shadow-slab group-focus-within:visible group-hover:visible"
      >
        {text}
      </span>
    </span>
  );
}
