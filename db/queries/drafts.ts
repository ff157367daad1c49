import { and, asc, eq, isNull, sql, type SQL } from "drizzle-orm";
import { getDb } from "../client";
import { foundationDrafts, foundations, type FoundationDraftRow } from "../schema";
import { parseDraftInput, type AnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { readPlacements, withStoredTrails, type MachinePlacement } from "@/modules/desk/machine-placements";
import { roleAllows, type ProjectPermission } from "@/modules/platform/permissions";
import { assertFoundationActive, getFoundation } from "./foundations";
import { getMembership, type Actor } from "./projects";

/**
 * A foundation's draft as the API shows it. `version` 0 with `input` null means nothing
 * has been saved yet; the first save must then expect version 0. A draft may be stored
 * incomplete (issue 18): then `input` is null, `incomplete` true, and `document` holds what
 * was saved (the contract's shape with blanks); readers show "incomplete" for it.
 */
export interface Draft {
  foundationId: string;
  version: number;
  /** The valid analysis input; null when nothing is saved or the draft is incomplete. */
  input: AnalysisInput | null;
  /** What is stored, complete or not (null when nothing is saved). */
  document: AnalysisInputDocument | null;
  incomplete: boolean;
  /** Per machine: its datum on the block and the vendor's own figures (empty for older drafts). */
  placements: MachinePlacement[];
  vendorSubmissionId: string | null;
  updatedById: string | null;
  updatedAt: Date | null;
}

export type SaveDraftResult = { ok: true; draft: Draft } | { ok: false; current: Draft };

/** A stored draft's input: complete (a valid AnalysisInput) or incomplete (a draft document). */
export function storedDraftInput(stored: unknown): { input: AnalysisInput | null; document: AnalysisInputDocument | null; incomplete: boolean } {
  if (stored === null || stored === undefined) return { input: null, document: null, incomplete: false };
  // Every writer checks with parseDraftInput first, so what is stored is complete or only incomplete.
  const parsed = parseDraftInput(stored);
  if (parsed.ok && parsed.complete) return { input: parsed.input, document: stored as AnalysisInputDocument, incomplete: false };
  return { input: null, document: stored as AnalysisInputDocument, incomplete: true };
}

function toDraft(row: FoundationDraftRow): Draft {
  return {
    foundationId: row.foundationId,
    version: row.version,
    ...storedDraftInput(row.input),
    placements: readPlacements(row.machinePlacements),
    vendorSubmissionId: row.vendorSubmissionId,
    updatedById: row.updatedById,
    updatedAt: row.updatedAt,
  };
}

function emptyDraft(foundationId: string): Draft {
  return { foundationId, version: 0, input: null, document: null, incomplete: false, placements: [], vendorSubmissionId: null, updatedById: null, updatedAt: null };
}

/**
 * The draft's editor set with `userId` added (once): every write to a draft's input sets
 * `editorIds` to this, so the next revision knows everyone who wrote it (four eyes).
 */
export function draftEditorsWith(userId: string): SQL<string[]> {
  return sql<string[]>`CASE WHEN ${userId}::uuid = ANY(${foundationDrafts.editorIds}) THEN ${foundationDrafts.editorIds} ELSE array_append(${foundationDrafts.editorIds}, ${userId}::uuid) END`;
}

/** The foundation, when the actor's project role allows the permission and it belongs to the project. */
async function findFoundationFor(actor: Actor, projectId: string, foundationId: string, permission: ProjectPermission) {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, permission)) return undefined;
  return getFoundation(actor, projectId, foundationId);
}

async function readDraft(foundationId: string): Promise<Draft> {
  const rows = await getDb().select().from(foundationDrafts).where(eq(foundationDrafts.foundationId, foundationId)).limit(1);
  return rows[0] ? toDraft(rows[0]) : emptyDraft(foundationId);
}

/**
 * The draft of a foundation of the project; undefined when the actor may not read the
 * project's foundations or the foundation is not in that project.
 */
export async function getDraft(actor: Actor, projectId: string, foundationId: string): Promise<Draft | undefined> {
  // The live draft is the design team's; the client (viewer) reads issued revisions only.
  const foundation = await findFoundationFor(actor, projectId, foundationId, "draft.read");
  return foundation ? readDraft(foundation.id) : undefined;
}

/**
 * Saves the input only when the stored version is still `expectedVersion`, in one
 * statement, so of two concurrent saves from the same version exactly one wins; the
 * loser gets the current draft back and nothing is overwritten. Expecting version 0
 * creates the draft. Undefined when the actor may not edit or the foundation is not
 * in the project.
 */
export async function saveDraft(
  actor: Actor,
  projectId: string,
  foundationId: string,
  /**
   * A valid input, or an incomplete draft document that parseDraftInput accepted; the machine
   * placements when the caller sends them (absent: the stored ones are kept).
   */
  change: { input: AnalysisInput | AnalysisInputDocument; expectedVersion: number; placements?: MachinePlacement[] },
): Promise<SaveDraftResult | undefined> {
  const foundation = await findFoundationFor(actor, projectId, foundationId, "draft.edit");
  if (!foundation) return undefined;
  assertFoundationActive(foundation);
  const db = getDb();
  // Datums come from the caller; vendor figures only as stored (the server writes them on take-in).
  let placementsChange = {};
  if (change.placements) {
    const stored = await db.select({ placements: foundationDrafts.machinePlacements }).from(foundationDrafts).where(eq(foundationDrafts.foundationId, foundation.id)).limit(1);
    placementsChange = { machinePlacements: withStoredTrails(change.placements, readPlacements(stored[0]?.placements)) };
  }
  const rows =
    change.expectedVersion === 0
      ? await db
          .insert(foundationDrafts)
          .values({ foundationId: foundation.id, input: change.input, ...placementsChange, version: 1, updatedById: actor.userId, editorIds: [actor.userId] })
          // An existing row means someone saved first: a conflict, not an overwrite.
          .onConflictDoNothing({ target: foundationDrafts.foundationId })
          .returning()
      : await db
          .update(foundationDrafts)
          .set({ input: change.input, ...placementsChange, version: sql`${foundationDrafts.version} + 1`, updatedById: actor.userId, editorIds: draftEditorsWith(actor.userId), updatedAt: new Date() })
          .where(and(eq(foundationDrafts.foundationId, foundation.id), eq(foundationDrafts.version, change.expectedVersion)))
          .returning();
  const saved = rows[0];
  return saved ? { ok: true, draft: toDraft(saved) } : { ok: false, current: await readDraft(foundation.id) };
}

/**
 * For the demo seed (trusted, no actor): gives a foundation a draft from an example
 * input that has already passed parseAnalysisInput, unless it has one.
 */
export async function createDraftFromExample(foundationId: string, input: AnalysisInput, updatedById: string | null = null): Promise<Draft> {
  await getDb().insert(foundationDrafts).values({ foundationId, input, version: 1, updatedById }).onConflictDoNothing({ target: foundationDrafts.foundationId });
  return readDraft(foundationId);
}

export interface FoundationWithDraft {
  id: string;
  tag: string;
  machineTrain: string;
  location: string;
  updatedAt: Date;
  draftVersion: number;
  draftUpdatedAt: Date | null;
  /** The draft's valid input; null when there is none or it is incomplete. */
  input: AnalysisInput | null;
  /** A draft is stored but incomplete: no verdict until it is complete. */
  incomplete: boolean;
  /** The draft's machine names, complete or not (a data request asks for them by name). */
  machineNames: string[];
}

/**
 * Every foundation of the project with its draft, for members who may read foundations;
 * a member without "draft.read" (the client) gets the foundations with no draft in them.
 */
export async function listFoundationsWithDrafts(actor: Actor, projectId: string): Promise<FoundationWithDraft[]> {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, "foundation.read")) return [];
  const mayReadDraft = roleAllows(membership.role, "draft.read");
  const rows = await getDb()
    .select({
      id: foundations.id,
      tag: foundations.tag,
      machineTrain: foundations.machineTrain,
      location: foundations.location,
      updatedAt: foundations.updatedAt,
      draftVersion: foundationDrafts.version,
      draftUpdatedAt: foundationDrafts.updatedAt,
      input: foundationDrafts.input,
    })
    .from(foundations)
    .leftJoin(foundationDrafts, eq(foundationDrafts.foundationId, foundations.id))
    .where(and(eq(foundations.projectId, projectId), isNull(foundations.withdrawnAt)))
    .orderBy(asc(foundations.tag));
  if (!mayReadDraft) return rows.map((r) => ({ ...r, draftVersion: 0, draftUpdatedAt: null, input: null, incomplete: false, machineNames: [] as string[] }));
  return rows.map((r) => {
    const { input, document, incomplete } = storedDraftInput(r.input);
    const machines: unknown[] = Array.isArray(document?.machines) ? document.machines : [];
    const machineNames = machines.map((m) => (m as { name?: unknown } | null)?.name).filter((n): n is string => typeof n === "string" && n.trim() !== "");
    return { ...r, draftVersion: r.draftVersion ?? 0, input, incomplete, machineNames };
  });
}
