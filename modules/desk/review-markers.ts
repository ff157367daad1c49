// Where a revision's review comment belongs in the workspace form. Comments name fields by
// their revision path (`machines["Motor RWM-101"].rotors["rotor"].mass`); the form names the
// same field by position (`machines[0].rotors[0].mass`). Items are matched by name in the
// form as it stands, so a comment follows its machine when machines are reordered.
// Not the module index, which re-exports the input hash (node:crypto): this file runs in the browser.
import { parseFieldPath } from "@/modules/revisions/field-labels";

/** An open review comment as the workspace shows it beside its field (db/queries adds the date). */
export interface OpenFieldComment {
  id: string;
  revisionId: string;
  revisionLabel: string;
  fieldPath: string | null;
  body: string;
  authorName: string;
}

/** The form field name of a revision path, or null when the form has no such field (a result, a removed machine). */
export function formFieldNameOf(path: string, form: unknown): string | null {
  const segs = parseFieldPath(path);
  if (!segs || !segs.length) return null;
  let cur: unknown = form;
  let out = "";
  for (const s of segs) {
    if (s.kind === "name") {
      if (typeof cur !== "object" || cur === null || Array.isArray(cur) || !(s.name in cur)) return null;
      out += out ? `.${s.name}` : s.name;
      cur = (cur as Record<string, unknown>)[s.name];
    } else if (s.kind === "key") {
      if (!Array.isArray(cur)) return null;
      const i = cur.findIndex((item: unknown) => typeof item === "object" && item !== null && (item as { name?: unknown }).name === s.key);
      if (i < 0) return null;
      out += `[${i}]`;
      cur = cur[i];
    } else {
      if (!Array.isArray(cur) || s.index >= cur.length) return null;
      out += `[${s.index}]`;
      cur = cur[s.index];
    }
  }
  // a field is a value, not a whole group (a comment on `soil` alone has no one input)
  return typeof cur === "object" && cur !== null ? null : out;
}

export interface PlacedComment<C extends { fieldPath: string | null }> {
  comment: C;
  /** The form field it sits next to; null when it concerns a result or the whole revision. */
  fieldName: string | null;
}

/** Each comment with the form field it belongs to, and the comments per field. */
export function placeComments<C extends { fieldPath: string | null }>(comments: readonly C[], form: unknown): { placed: PlacedComment<C>[]; byField: Map<string, C[]> } {
  const placed = comments.map((comment) => ({ comment, fieldName: comment.fieldPath ? formFieldNameOf(comment.fieldPath, form) : null }));
  const byField = new Map<string, C[]>();
  for (const p of placed) if (p.fieldName) byField.set(p.fieldName, [...(byField.get(p.fieldName) ?? []), p.comment]);
  return { placed, byField };
}

/**
 * Whether two placements put the same comments (by identity) beside the same fields, in the
 * same order. The workspace places comments again on every change of the form; when nothing
 * moved it keeps the earlier placement, so the markers beside the fields are not rendered again.
 */
export function samePlacement<C extends { fieldPath: string | null }>(a: { placed: PlacedComment<C>[] }, b: { placed: PlacedComment<C>[] }): boolean {
  return a.placed.length === b.placed.length && a.placed.every((p, i) => p.comment === b.placed[i]?.comment && p.fieldName === b.placed[i]?.fieldName);
}
