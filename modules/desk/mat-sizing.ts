// The desk's side of the block-sizing assistant (modules/sizing): the limits the HTTP API puts
// on a search, the request envelope both ends share, the bounds the panel starts from, and how
// a proposal is loaded into the design form.
import { z } from "zod";
import { applySizingProposal, DEFAULT_STEP_M, type ProposalToApply, type SizingIssue, type SizingLimits } from "@/modules/sizing";
import { toInputDocument, type DraftForm, type Num, type RangeForm } from "./draft-form";

/**
 * Analyses one POST /api/v1/sizing may spend. A search runs its analyses one after another on
 * the request's core (a few ms each), so 600 keeps a request to a few seconds; the module
 * itself would allow more (scripts, batch use).
 */
export const SIZING_API_MAX_ANALYSES = 600;
export const SIZING_API_DEFAULT_ANALYSES = 400;
/** The same, as the assistant's option schema takes them. */
export const SIZING_API_LIMITS: SizingLimits = { maxAnalyses: SIZING_API_MAX_ANALYSES, defaultAnalyses: SIZING_API_DEFAULT_ANALYSES };

/** The body of POST /api/v1/sizing. The route validates the two documents with their own parsers. */
export const sizingRequestSchema = z.strictObject(
  {
    input: z.unknown().refine((v) => v !== undefined, { error: "is required: the analysis input document" }),
    options: z.unknown().refine((v) => v !== undefined, { error: "is required: the sizing options" }),
  },
  {
    error: (issue) =>
      issue.code === "unrecognized_keys" ? `unknown field ${issue.keys.map((k) => `"${k}"`).join(", ")}: send only "input" and "options"` : 'must be an object { "input": ..., "options": ... }',
  },
);

export type SizingDimension = "length" | "width" | "thickness";
export const SIZING_DIMENSIONS: readonly SizingDimension[] = ["length", "width", "thickness"];

export interface MatBounds {
  min: number;
  max: number;
  step: number;
}

const span = (r: RangeForm): number | null => (r[0] !== null && r[1] !== null && r[1] > r[0] ? r[1] - r[0] : null);
const lowest = (r: RangeForm): Num => r[0];

/** Rounds down or up to a multiple of the step (metres), at least one step. */
function onGrid(value: number, step: number, direction: "down" | "up"): number {
  // the 1e-9 keeps a value already on the grid where it is despite floating-point noise
  const k = direction === "down" ? Math.floor(value / step + 1e-9) : Math.ceil(value / step - 1e-9);
  return Math.max(step, Math.round(k * step * 1e9) / 1e9);
}

/**
 * The mat as the form holds it: the solid (not a void) with the lowest underside, as the
 * assistant reads it; null while its coordinates are incomplete.
 */
export function matDimensionsOfForm(form: DraftForm): Record<SizingDimension, number> | null {
  let best: { z: number; dims: Record<SizingDimension, number> } | null = null;
  for (const s of form.block.solids) {
    const [length, width, thickness, z0] = [span(s.x), span(s.y), span(s.z), lowest(s.z)];
    if (s.void || length === null || width === null || thickness === null || z0 === null) continue;
    if (!best || z0 < best.z) best = { z: z0, dims: { length, width, thickness } };
  }
  return best?.dims ?? null;
}

/**
 * Starting bounds for the panel: the search starts from the present mat and grows from it,
 * up to 130 % of the present plan size and 0.5 m more thickness, on the default step (a rule
 * of thumb for a first search, not a design rule: the designer sets the bounds). The lower
 * bound is the present size rounded down to the step, so the bounds always contain the present
 * mat and, when it is on the grid, the present mat is the first candidate of its volume.
 */
export function suggestedMatBounds(form: DraftForm): Record<SizingDimension, MatBounds> | null {
  const d = matDimensionsOfForm(form);
  if (!d) return null;
  const step = DEFAULT_STEP_M;
  const grow = (present: number, upTo: number): MatBounds => ({ min: onGrid(present, step, "down"), max: Math.max(onGrid(upTo, step, "up"), onGrid(present, step, "up")), step });
  return {
    length: grow(d.length, 1.3 * d.length),
    width: grow(d.width, 1.3 * d.width),
    thickness: grow(d.thickness, d.thickness + 0.5),
  };
}

export type LoadProposalOutcome = { ok: true; form: DraftForm } | { ok: false; issues: SizingIssue[] };

const pair = (v: readonly number[]): RangeForm => [v[0] ?? null, v[1] ?? null];
const triple = (v: readonly number[]): [Num, Num, Num] => [v[0] ?? null, v[1] ?? null, v[2] ?? null];

/**
 * The form with a proposal loaded: applySizingProposal resizes the input document made from
 * this form, and the coordinates it moves (solids, machine centres of gravity and boxes,
 * bearings, check points) are written into the matching fields. Nothing else is touched, so
 * blank criteria stay blank (the project's defaults) and every other input stays as typed.
 */
export function loadProposalIntoForm(form: DraftForm, proposal: ProposalToApply): LoadProposalOutcome {
  const applied = applySizingProposal(toInputDocument(form), proposal);
  if (!applied.ok) return applied;
  const doc = applied.document;
  const next = structuredClone(form);
  // toInputDocument keeps every list in the form's order, so the indices match one to one.
  doc.block.solids.forEach((s, i) => {
    const f = next.block.solids[i];
    if (f) Object.assign(f, { x: pair(s.x), y: pair(s.y), z: pair(s.z) });
  });
  doc.machines.forEach((m, i) => {
    const f = next.machines[i];
    if (!f) return;
    f.cg = triple(m.cg);
    if (m.box && f.box.enabled) Object.assign(f.box, { x: pair(m.box.x), y: pair(m.box.y), z: pair(m.box.z) });
    (m.rotors ?? []).forEach((r, j) => {
      const fr = f.rotors[j];
      if (fr) fr.bearings = r.bearings.map(triple);
    });
  });
  (doc.checkPoints ?? []).forEach((c, i) => {
    const f = next.checkPoints[i];
    if (f) f.position = triple(c.position);
  });
  return { ok: true, form: next };
}
