import { and, asc, count, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb } from "../client";
import { auditEvents, companies, foundationDrafts, foundations, projectMembers, projects, revisionChecks, revisionClientShares, revisionComments, revisionDecisions, revisions, storedFiles, users, vendorRequests, vendorSubmissions, type RevisionRow } from "../schema";
import { analyse, ENGINE_VERSION, parseAnalysisInput, type AnalysisInput, type AnalysisResult, type InputIssue } from "@/modules/calc";
import { canonicalInputHash, listLeafPaths, nextRevisionLabel, revisionStatus, withoutLongSeries, type RevisionPurpose, type RevisionStatus } from "@/modules/revisions";
import { roleAllows, type ProjectPermission, type ProjectRole } from "@/modules/platform/permissions";
import { isAppError } from "@/modules/platform/errors";
import type { GoverningSource } from "@/modules/desk/foundation-summary";
import type { OpenFieldComment as OpenFieldCommentShown } from "@/modules/desk/review-markers";
import { readPlacements, type MachinePlacement } from "@/modules/desk/machine-placements";
import { getMembership, type Actor } from "./projects";
import { assertFoundationActive } from "./foundations";

type Tx = Parameters<Parameters<ReturnType<typeof getDb>["transaction"]>[0]>[0];

export interface RevisionSummary {
  id: string;
  foundationId: string;
  projectId: string;
  sequence: number;
  label: string;
  engineVersion: string;
  inputHash: string;
  vendorSubmissionId: string | null;
  issuedById: string;
  issuedByName: string;
  issuedAt: Date;
  /** Who edited the draft since the previous revision (besides or including the issuer): with the issuer, its authors. */
  editors: { id: string; name: string }[];
  /** The designer's revision note (what changed and why); '' on revisions issued before notes existed. */
  note: string;
  purpose: RevisionPurpose;
  status: RevisionStatus;
  /** The first signature of a two-step sign-off ("checked"), when given. */
  check: { note: string; checkedById: string; checkedByName: string; checkedByRole: string; checkedAt: Date } | null;
  decision: { outcome: "returned" | "approved"; note: string; decidedById: string; decidedByName: string; decidedByRole: string | null; decidedAt: Date } | null;
  /** Open review comments; null for a reader who may not see review comments (the client). */
  openComments: number | null;
  /** The foundation's latest approved revision: it stays the one of record while a later one is in check or returned. */
  latestApproved: boolean;
  /** A manager shared this revision's package with the client before (or without) its approval. */
  sharedWithClient: { sharedByName: string; sharedAt: Date } | null;
}

export interface RevisionDetail extends RevisionSummary {
  // Only inputs that passed the contract's schema and results of the engine are ever
  // written (issueRevision parses and analyses), so the stored JSON has these types.
  input: AnalysisInput;
  result: AnalysisResult;
  /** The machines' datums and vendor figures at issue ([] before they were kept). */
  placements: MachinePlacement[];
}

export interface RevisionComment {
  id: string;
  revisionId: string;
  parentId: string | null;
  fieldPath: string | null;
  body: string;
  resolved: boolean;
  authorId: string;
  authorName: string;
  createdAt: Date;
}

async function allowed(actor: Actor, projectId: string, permission: ProjectPermission): Promise<boolean> {
  const m = await getMembership(actor, projectId);
  return !!m && roleAllows(m.role, permission);
}

/**
 * How much of a revision's record the reader sees. The design team sees everything; a
 * reader without "revision.commentsRead" (the client, role viewer) sees no review comments
 * nor their count, and of the decision notes only the approval's (the note addressed to the
 * client; a return note is review talk). README, "The client's view".
 */
interface ReaderScope {
  internal: boolean;
}

async function readerScope(actor: Actor, projectId: string, permission: ProjectPermission): Promise<{ role: ProjectRole; scope: ReaderScope } | undefined> {
  const m = await getMembership(actor, projectId);
  if (!m || !roleAllows(m.role, permission)) return undefined;
  return { role: m.role, scope: { internal: roleAllows(m.role, "revision.commentsRead") } };
}

const FULL_SCOPE: ReaderScope = { internal: true };

/** May this reader download the revision's package: the team always, the client when approved or shared. */
function packageReleased(scope: ReaderScope, summary: Pick<RevisionSummary, "decision" | "sharedWithClient">): boolean {
  return scope.internal || summary.decision?.outcome === "approved" || summary.sharedWithClient !== null;
}

const issuer = alias(users, "issuer");
const decider = alias(users, "decider");
const checker = alias(users, "checker");

/** Summaries of the given foundation's revisions (or of one), oldest first. */
// The summary columns only: input and result (the result holds the sweep series, about a
// megabyte) are read for the one revision that needs them, never for a whole list.
const summaryColumns = {
  id: revisions.id,
  foundationId: revisions.foundationId,
  projectId: revisions.projectId,
  sequence: revisions.sequence,
  label: revisions.label,
  engineVersion: revisions.engineVersion,
  inputHash: revisions.inputHash,
  vendorSubmissionId: revisions.vendorSubmissionId,
  issuedById: revisions.issuedById,
  issuedAt: revisions.issuedAt,
  editorIds: revisions.editorIds,
  note: revisions.note,
  purpose: revisions.purpose,
};

const sharer = alias(users, "sharer");

async function selectSummaries(
  db: ReturnType<typeof getDb> | Tx,
  where: { projectId: string; foundationId: string; revisionId?: string },
  scope: ReaderScope = FULL_SCOPE,
): Promise<RevisionSummary[]> {
  const rows = await db
    .select({ r: summaryColumns, issuerName: issuer.name, d: revisionDecisions, deciderName: decider.name, c: revisionChecks, checkerName: checker.name, share: revisionClientShares, sharerName: sharer.name })
    .from(revisions)
    .innerJoin(issuer, eq(issuer.id, revisions.issuedById))
    .leftJoin(revisionDecisions, eq(revisionDecisions.revisionId, revisions.id))
    .leftJoin(decider, eq(decider.id, revisionDecisions.decidedById))
    .leftJoin(revisionChecks, eq(revisionChecks.revisionId, revisions.id))
    .leftJoin(checker, eq(checker.id, revisionChecks.checkedById))
    .leftJoin(revisionClientShares, eq(revisionClientShares.revisionId, revisions.id))
    .leftJoin(sharer, eq(sharer.id, revisionClientShares.sharedById))
    .where(and(eq(revisions.projectId, where.projectId), eq(revisions.foundationId, where.foundationId)))
    .orderBy(asc(revisions.sequence));
  const ids = rows.map((x) => x.r.id);
  const open = ids.length
    ? await db
        .select({ revisionId: revisionComments.revisionId, n: count() })
        .from(revisionComments)
        .where(and(inArray(revisionComments.revisionId, ids), isNull(revisionComments.parentId), eq(revisionComments.resolved, false)))
        .groupBy(revisionComments.revisionId)
    : [];
  const openBy = new Map(open.map((o) => [o.revisionId, o.n]));
  const editorIds = [...new Set(rows.flatMap((x) => x.r.editorIds))];
  const editorNames = new Map(
    editorIds.length ? (await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, editorIds))).map((u) => [u.id, u.name]) : [],
  );
  const maxSequence = rows.reduce((m, x) => Math.max(m, x.r.sequence), 0);
  const maxApproved = rows.reduce((m, x) => (x.d?.outcome === "approved" ? Math.max(m, x.r.sequence) : m), 0);
  return rows
    .filter((x) => !where.revisionId || x.r.id === where.revisionId)
    .map(({ r, issuerName, d, deciderName, c, checkerName, share, sharerName }) => ({
      id: r.id,
      foundationId: r.foundationId,
      projectId: r.projectId,
      sequence: r.sequence,
      label: r.label,
      engineVersion: r.engineVersion,
      inputHash: r.inputHash,
      vendorSubmissionId: r.vendorSubmissionId,
      issuedById: r.issuedById,
      issuedByName: issuerName,
      issuedAt: r.issuedAt,
      editors: r.editorIds.map((id) => ({ id, name: editorNames.get(id) ?? "(former account)" })),
      note: r.note,
      purpose: r.purpose,
      status: revisionStatus(d?.outcome ?? null, r.sequence < maxSequence, { checked: !!c, hasLaterApproval: r.sequence < maxApproved }),
      check: c ? { note: scope.internal ? c.note : "", checkedById: c.checkedById, checkedByName: checkerName ?? "", checkedByRole: c.checkedByRole, checkedAt: c.checkedAt } : null,
      decision: d
        ? { outcome: d.outcome, note: scope.internal || d.outcome === "approved" ? d.note : "", decidedById: d.decidedById, decidedByName: deciderName ?? "", decidedByRole: d.decidedByRole, decidedAt: d.decidedAt }
        : null,
      openComments: scope.internal ? (openBy.get(r.id) ?? 0) : null,
      latestApproved: r.sequence === maxApproved,
      sharedWithClient: share ? { sharedByName: sharerName ?? "", sharedAt: share.sharedAt } : null,
    }));
}

/** The stored input and result of one revision. */
async function selectRevisionBody(db: ReturnType<typeof getDb> | Tx, revisionId: string): Promise<Pick<RevisionRow, "input" | "result" | "machinePlacements"> | undefined> {
  const [row] = await db.select({ input: revisions.input, result: revisions.result, machinePlacements: revisions.machinePlacements }).from(revisions).where(eq(revisions.id, revisionId));
  return row;
}

/** The foundation's revisions, oldest first; [] when the actor may not read revisions. */
export async function listRevisions(actor: Actor, projectId: string, foundationId: string): Promise<RevisionSummary[]> {
  const reader = await readerScope(actor, projectId, "revision.read");
  if (!reader) return [];
  return selectSummaries(getDb(), { projectId, foundationId }, reader.scope);
}

/** One revision with its input and result; undefined when absent or not readable by the actor. */
export async function getRevision(actor: Actor, projectId: string, foundationId: string, revisionId: string): Promise<RevisionDetail | undefined> {
  const reader = await readerScope(actor, projectId, "revision.read");
  if (!reader) return undefined;
  const [hit] = await selectSummaries(getDb(), { projectId, foundationId, revisionId }, reader.scope);
  if (!hit) return undefined;
  const body = await selectRevisionBody(getDb(), hit.id);
  if (!body) return undefined;
  return { ...hit, input: body.input as AnalysisInput, result: body.result as AnalysisResult, placements: readPlacements(body.machinePlacements) };
}

/**
 * A revision for the comparison route: its result without the frequency sweep (hundreds of
 * numbers per curve that the comparison does not list), read as `result - 'sweep'` in SQL so
 * the long series never leave the database. The page, which plots the sweep, uses getRevision.
 */
export async function getRevisionForComparison(actor: Actor, projectId: string, foundationId: string, revisionId: string): Promise<(RevisionSummary & { input: AnalysisInput; result: Omit<AnalysisResult, "sweep"> }) | undefined> {
  if (!(await allowed(actor, projectId, "revision.read"))) return undefined;
  const [hit] = await selectSummaries(getDb(), { projectId, foundationId, revisionId });
  if (!hit) return undefined;
  const [body] = await getDb()
    .select({ input: revisions.input, result: sql<Omit<AnalysisResult, "sweep">>`${revisions.result} - 'sweep'` })
    .from(revisions)
    .where(eq(revisions.id, hit.id));
  if (!body) return undefined;
  return { ...hit, input: body.input as AnalysisInput, result: body.result };
}

export interface FoundationRevisionState {
  foundationId: string;
  latest: { id: string; label: string; status: RevisionStatus; vendorSubmissionId: string | null; supersededByNewerVersion: boolean; issuedAt: Date } | null;
  /** The latest approved revision, which stays the one of record while a later one is in check or returned. */
  latestApproved: { id: string; label: string; issuedAt: Date } | null;
  revisionCount: number;
  /** Null for a reader who may not see review comments (the client). */
  openComments: number | null;
  /** The draft's vendor submission; null for the client, who does not see the draft. */
  draftVendorSubmissionId: string | null;
}

/** For the project page: per foundation, its latest revision, their count and the open comments. */
export async function listFoundationRevisionStates(actor: Actor, projectId: string): Promise<FoundationRevisionState[]> {
  const reader = await readerScope(actor, projectId, "revision.read");
  if (!reader) return [];
  const db = getDb();
  const fs = await db
    .select({ id: foundations.id, draftVendorSubmissionId: foundationDrafts.vendorSubmissionId })
    .from(foundations)
    .leftJoin(foundationDrafts, eq(foundationDrafts.foundationId, foundations.id))
    .where(and(eq(foundations.projectId, projectId), isNull(foundations.withdrawnAt)));
  const revs = await db
    .select({ id: revisions.id, foundationId: revisions.foundationId, sequence: revisions.sequence, label: revisions.label, vendorSubmissionId: revisions.vendorSubmissionId, issuedAt: revisions.issuedAt, outcome: revisionDecisions.outcome, checkId: revisionChecks.id })
    .from(revisions)
    .leftJoin(revisionDecisions, eq(revisionDecisions.revisionId, revisions.id))
    .leftJoin(revisionChecks, eq(revisionChecks.revisionId, revisions.id))
    .where(eq(revisions.projectId, projectId))
    .orderBy(asc(revisions.foundationId), desc(revisions.sequence));
  const open = await db
    .select({ foundationId: revisions.foundationId, n: count() })
    .from(revisionComments)
    .innerJoin(revisions, eq(revisions.id, revisionComments.revisionId))
    .where(and(eq(revisions.projectId, projectId), isNull(revisionComments.parentId), eq(revisionComments.resolved, false)))
    .groupBy(revisions.foundationId);
  const openBy = new Map(open.map((o) => [o.foundationId, o.n]));
  // Submissions behind revisions for which the vendor has since sent a newer version.
  const used = [...new Set(revs.map((r) => r.vendorSubmissionId).filter((v): v is string => v !== null))];
  const superseded = new Set<string>();
  if (used.length) {
    const newer = alias(vendorSubmissions, "newer");
    const rows = await db
      .selectDistinct({ id: vendorSubmissions.id })
      .from(vendorSubmissions)
      .innerJoin(newer, and(eq(newer.requestId, vendorSubmissions.requestId), sql`${newer.version} > ${vendorSubmissions.version}`))
      .where(inArray(vendorSubmissions.id, used));
    for (const r of rows) superseded.add(r.id);
  }
  return fs.map((f) => {
    const mine = revs.filter((r) => r.foundationId === f.id);
    const top = mine[0];
    const approved = mine.find((r) => r.outcome === "approved");
    return {
      foundationId: f.id,
      latest: top
        ? {
            id: top.id,
            label: top.label,
            status: revisionStatus(top.outcome, false, { checked: top.checkId !== null }),
            vendorSubmissionId: top.vendorSubmissionId,
            supersededByNewerVersion: top.vendorSubmissionId !== null && superseded.has(top.vendorSubmissionId),
            issuedAt: top.issuedAt,
          }
        : null,
      latestApproved: approved ? { id: approved.id, label: approved.label, issuedAt: approved.issuedAt } : null,
      revisionCount: mine.length,
      openComments: reader.scope.internal ? (openBy.get(f.id) ?? 0) : null,
      draftVendorSubmissionId: reader.scope.internal ? (f.draftVendorSubmissionId ?? null) : null,
    };
  });
}

export type IssueOutcome =
  | { ok: true; revision: RevisionSummary }
  | { ok: false; reason: "forbidden" | "not-found" }
  | { ok: false; reason: "no-draft" }
  | { ok: false; reason: "stale-draft"; currentVersion: number }
  | { ok: false; reason: "invalid-draft"; issues: InputIssue[] }
  | { ok: false; reason: "identical"; label: string };

/**
 * Turns the foundation's saved draft into a new revision, in one transaction that
 * locks the draft row, so two racing issues cannot both pass the "same as the latest
 * revision" test or take the same sequence. With `expectedDraftVersion`, a draft saved
 * since the caller looked at it is refused rather than issued unseen.
 */
export async function issueRevision(
  actor: Actor,
  projectId: string,
  foundationId: string,
  // `analyse`: the server passes its analysis pool (off the request thread); the engine in
  // this thread by default (scripts and tests). An AppError from it (busy, time limit) is passed on.
  opts: { expectedDraftVersion?: number; purpose?: RevisionPurpose; analyse?: (input: AnalysisInput) => Promise<AnalysisResult>; note?: string } = {},
): Promise<IssueOutcome> {
  const analyseDraft = opts.analyse ?? (async (input: AnalysisInput) => analyse(input));
  if (!(await allowed(actor, projectId, "revision.issue"))) return { ok: false, reason: "forbidden" };
  return getDb().transaction(async (tx) => {
    const [foundation] = await tx
      .select({ id: foundations.id, tag: foundations.tag, scheme: projects.revisionScheme, withdrawnAt: foundations.withdrawnAt })
      .from(foundations)
      .innerJoin(projects, eq(projects.id, foundations.projectId))
      .where(and(eq(foundations.id, foundationId), eq(foundations.projectId, projectId)))
      .for("update", { of: foundations });
    if (!foundation) return { ok: false, reason: "not-found" } as const;
    assertFoundationActive(foundation);
    const [draft] = await tx.select().from(foundationDrafts).where(eq(foundationDrafts.foundationId, foundationId)).for("update");
    if (!draft) return { ok: false, reason: "no-draft" } as const;
    if (opts.expectedDraftVersion !== undefined && opts.expectedDraftVersion !== draft.version) return { ok: false, reason: "stale-draft", currentVersion: draft.version } as const;
    const parsed = parseAnalysisInput(draft.input);
    if (!parsed.ok) return { ok: false, reason: "invalid-draft", issues: parsed.issues } as const;
    const inputHash = canonicalInputHash(parsed.input);
    const earlier = await tx.select({ label: revisions.label, sequence: revisions.sequence, inputHash: revisions.inputHash }).from(revisions).where(eq(revisions.foundationId, foundationId)).orderBy(desc(revisions.sequence));
    const latest = earlier[0];
    if (latest && latest.inputHash === inputHash) return { ok: false, reason: "identical", label: latest.label } as const;
    let result: AnalysisResult;
    try {
      result = await analyseDraft(parsed.input);
    } catch (e) {
      if (isAppError(e)) throw e;
      // A draft the contract accepts can still be numerically impossible (a density of 1e308):
      // the engine refuses it, and nothing is issued. Logged, so an engine fault is still seen.
      console.error("[issue] the engine refused a draft that passed the contract:", e instanceof Error ? e.message : e);
      return { ok: false, reason: "invalid-draft", issues: [{ path: "(root)", message: "values too large or too small to analyse: check the input's units and magnitudes" }] } as const;
    }
    const [row] = await tx
      .insert(revisions)
      .values({
        foundationId,
        projectId,
        sequence: (latest?.sequence ?? 0) + 1,
        label: nextRevisionLabel(foundation.scheme, earlier.map((e) => e.label)),
        input: parsed.input,
        result,
        engineVersion: result.engineVersion ?? ENGINE_VERSION,
        inputHash,
        vendorSubmissionId: draft.vendorSubmissionId,
        issuedById: actor.userId,
        editorIds: draft.editorIds,
        // The datum and the vendor's own figures behind the machines go on record with the input.
        machinePlacements: draft.machinePlacements,
        note: opts.note ?? "",
        purpose: opts.purpose ?? "issued-for-check",
      })
      .returning();
    if (!row) throw new Error("revision insert returned nothing");
    // The next revision's authors are those who edit the draft from here on.
    await tx.update(foundationDrafts).set({ editorIds: [] }).where(eq(foundationDrafts.id, draft.id));
    await tx.insert(auditEvents).values({
      projectId,
      actorId: actor.userId,
      action: "revision.issued",
      detail: { foundationId, tag: foundation.tag, revisionId: row.id, label: row.label, purpose: row.purpose, inputHash, draftVersion: draft.version, vendorSubmissionId: draft.vendorSubmissionId, editorIds: draft.editorIds, note: opts.note ?? "" },
    });
    const [summary] = await selectSummaries(tx, { projectId, foundationId, revisionId: row.id });
    if (!summary) throw new Error("issued revision not readable");
    return { ok: true, revision: summary } as const;
  });
}

export type DecideOutcome =
  | { ok: true; revision: RevisionSummary }
  | { ok: false; reason: "forbidden" | "not-found" | "own-revision" | "draft-editor" | "superseded" }
  | { ok: false; reason: "one-step" | "not-checked" | "own-check" | "already-checked" }
  | { ok: false; reason: "already-decided"; outcome: "returned" | "approved" };

/**
 * Returns or approves a revision. The insert itself carries the rules, so they hold
 * under concurrency: it selects the revision only when the decider did not issue it
 * nor edited it, and no later revision exists, and the UNIQUE revision id with ON CONFLICT DO
 * NOTHING lets exactly one of two racing decisions write a row. The editors are those
 * who edited the draft since the previous revision (a trigger refuses them as well).
 */
export async function decideRevision(
  actor: Actor,
  projectId: string,
  foundationId: string,
  revisionId: string,
  decision: { outcome: "checked" | "returned" | "approved"; note: string },
): Promise<DecideOutcome> {
  const member = await getMembership(actor, projectId);
  if (!member || !roleAllows(member.role, "revision.decide")) return { ok: false, reason: "forbidden" };
  return getDb().transaction(async (tx) => {
    const [rev] = await tx
      .select({ id: revisions.id, label: revisions.label, issuedById: revisions.issuedById, editorIds: revisions.editorIds, signOffSteps: projects.signOffSteps })
      .from(revisions)
      .innerJoin(projects, eq(projects.id, revisions.projectId))
      .where(and(eq(revisions.id, revisionId), eq(revisions.foundationId, foundationId), eq(revisions.projectId, projectId)));
    if (!rev) return { ok: false, reason: "not-found" } as const;
    if (rev.issuedById === actor.userId) return { ok: false, reason: "own-revision" } as const;
    // Four eyes: nobody who wrote the revision decides on it, whoever pressed "issue".
    if (rev.editorIds.includes(actor.userId)) return { ok: false, reason: "draft-editor" } as const;
    const twoStep = rev.signOffSteps === "two";
    // A check row is immutable once written, so reading it here is enough for the approval's test.
    const [check] = await tx.select({ checkedById: revisionChecks.checkedById }).from(revisionChecks).where(eq(revisionChecks.revisionId, revisionId));
    if (decision.outcome === "checked") {
      if (!twoStep) return { ok: false, reason: "one-step" } as const;
      const [decided] = await tx.select({ outcome: revisionDecisions.outcome }).from(revisionDecisions).where(eq(revisionDecisions.revisionId, revisionId));
      if (decided) return { ok: false, reason: "already-decided", outcome: decided.outcome } as const;
      const checked = await tx.execute<{ id: string }>(sql`
        INSERT INTO ${revisionChecks} (revision_id, note, checked_by_id, checked_by_role)
        SELECT r.id, ${decision.note}, ${actor.userId}::uuid, ${member.role}
        FROM ${revisions} r
        WHERE r.id = ${revisionId}::uuid
          AND r.issued_by_id <> ${actor.userId}::uuid
          AND NOT (${actor.userId}::uuid = ANY(r.editor_ids))
          AND NOT EXISTS (SELECT 1 FROM ${revisions} later WHERE later.foundation_id = r.foundation_id AND later.sequence > r.sequence)
          AND NOT EXISTS (SELECT 1 FROM ${revisionDecisions} d WHERE d.revision_id = r.id)
        ON CONFLICT (revision_id) DO NOTHING
        RETURNING id`);
      if (!checked.rows[0]) return { ok: false, reason: check ? "already-checked" : "superseded" } as const;
    } else {
      // Two steps: the approval needs the check first, by someone else (a trigger refuses the checker too).
      if (twoStep && decision.outcome === "approved" && !check) return { ok: false, reason: "not-checked" } as const;
      // Also after a switch back to one step: a checked revision is approved by someone else.
      if (decision.outcome === "approved" && check?.checkedById === actor.userId) return { ok: false, reason: "own-check" } as const;
      const inserted = await tx.execute<{ id: string }>(sql`
        INSERT INTO ${revisionDecisions} (revision_id, outcome, note, decided_by_id, decided_by_role)
        SELECT r.id, ${decision.outcome}, ${decision.note}, ${actor.userId}::uuid, ${member.role}
        FROM ${revisions} r
        WHERE r.id = ${revisionId}::uuid
          AND r.issued_by_id <> ${actor.userId}::uuid
          AND NOT (${actor.userId}::uuid = ANY(r.editor_ids))
          AND NOT EXISTS (SELECT 1 FROM ${revisions} later WHERE later.foundation_id = r.foundation_id AND later.sequence > r.sequence)
        ON CONFLICT (revision_id) DO NOTHING
        RETURNING id`);
      if (!inserted.rows[0]) {
      const [existing] = await tx.select({ outcome: revisionDecisions.outcome }).from(revisionDecisions).where(eq(revisionDecisions.revisionId, revisionId));
      if (existing) return { ok: false, reason: "already-decided", outcome: existing.outcome } as const;
      return { ok: false, reason: "superseded" } as const;
      }
    }
    await tx.insert(auditEvents).values({
      projectId,
      actorId: actor.userId,
      action: decision.outcome === "approved" ? "revision.approved" : decision.outcome === "checked" ? "revision.checked" : "revision.returned",
      detail: { foundationId, revisionId, label: rev.label, note: decision.note, role: member.role },
    });
    const [summary] = await selectSummaries(tx, { projectId, foundationId, revisionId });
    if (!summary) throw new Error("decided revision not readable");
    return { ok: true, revision: summary } as const;
  });
}

/** A revision's comments, oldest first (answers carry their parent's id). */
export async function listRevisionComments(actor: Actor, projectId: string, foundationId: string, revisionId: string): Promise<RevisionComment[] | undefined> {
  // Review comments are the design team's (manager, designer, checker), never the client's.
  if (!(await allowed(actor, projectId, "revision.commentsRead"))) return undefined;
  const [rev] = await getDb().select({ id: revisions.id }).from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.foundationId, foundationId), eq(revisions.projectId, projectId)));
  if (!rev) return undefined;
  const rows = await getDb()
    .select({ c: revisionComments, authorName: users.name })
    .from(revisionComments)
    .innerJoin(users, eq(users.id, revisionComments.authorId))
    .where(eq(revisionComments.revisionId, revisionId))
    .orderBy(asc(revisionComments.createdAt), asc(revisionComments.id));
  return rows.map(({ c, authorName }) => ({
    id: c.id,
    revisionId: c.revisionId,
    parentId: c.parentId,
    fieldPath: c.fieldPath,
    body: c.body,
    resolved: c.resolved,
    authorId: c.authorId,
    authorName,
    createdAt: c.createdAt,
  }));
}

/** An open review comment of one of a foundation's revisions, for the designer's workspace. */
export interface OpenFieldComment extends OpenFieldCommentShown {
  createdAt: Date;
}

/**
 * The foundation's open (unresolved) top-level review comments on any of its revisions, oldest
 * first; [] for a role that does not take part in the review (revision.comment), since review
 * comments are for manager, designer and checker.
 */
export async function listOpenFoundationComments(actor: Actor, projectId: string, foundationId: string): Promise<OpenFieldComment[]> {
  if (!(await allowed(actor, projectId, "revision.comment"))) return [];
  const rows = await getDb()
    .select({ c: revisionComments, label: revisions.label, authorName: users.name })
    .from(revisionComments)
    .innerJoin(revisions, eq(revisions.id, revisionComments.revisionId))
    .innerJoin(users, eq(users.id, revisionComments.authorId))
    .where(and(eq(revisions.projectId, projectId), eq(revisions.foundationId, foundationId), isNull(revisionComments.parentId), eq(revisionComments.resolved, false)))
    .orderBy(asc(revisionComments.createdAt), asc(revisionComments.id));
  return rows.map(({ c, label, authorName }) => ({ id: c.id, revisionId: c.revisionId, revisionLabel: label, fieldPath: c.fieldPath, body: c.body, authorName, createdAt: c.createdAt }));
}

export type PackageRevisionOutcome =
  | { ok: true; revision: RevisionSummary }
  | { ok: false; reason: "not-found" }
  | { ok: false; reason: "not-released"; revision: RevisionSummary };

/**
 * The revision whose calculation package the actor asks for. The design team gets any
 * issued revision; the client (viewer) only an approved one or one a manager shared
 * ("not-released" otherwise, which the route answers with 403).
 */
export async function getPackageRevision(actor: Actor, projectId: string, foundationId: string, revisionId: string): Promise<PackageRevisionOutcome> {
  const reader = await readerScope(actor, projectId, "package.export");
  if (!reader) return { ok: false, reason: "not-found" };
  const [hit] = await selectSummaries(getDb(), { projectId, foundationId, revisionId }, reader.scope);
  if (!hit) return { ok: false, reason: "not-found" };
  return packageReleased(reader.scope, hit) ? { ok: true, revision: hit } : { ok: false, reason: "not-released", revision: hit };
}

export type ShareOutcome = { ok: true; revision: RevisionSummary; changed: boolean } | { ok: false; reason: "forbidden" | "not-found" };

/**
 * Shares a revision's package with the client (or withdraws the share), with an audit
 * event naming who and when. Sharing twice, or withdrawing a share that is not there,
 * changes nothing and records nothing.
 */
export async function setRevisionShared(actor: Actor, projectId: string, foundationId: string, revisionId: string, shared: boolean): Promise<ShareOutcome> {
  if (!(await allowed(actor, projectId, "revision.share"))) return { ok: false, reason: "forbidden" };
  return getDb().transaction(async (tx) => {
    const [rev] = await tx
      .select({ id: revisions.id, label: revisions.label })
      .from(revisions)
      .where(and(eq(revisions.id, revisionId), eq(revisions.foundationId, foundationId), eq(revisions.projectId, projectId)));
    if (!rev) return { ok: false, reason: "not-found" } as const;
    const changed = shared
      ? (await tx.insert(revisionClientShares).values({ revisionId, sharedById: actor.userId }).onConflictDoNothing().returning({ id: revisionClientShares.revisionId })).length > 0
      : (await tx.delete(revisionClientShares).where(eq(revisionClientShares.revisionId, revisionId)).returning({ id: revisionClientShares.revisionId })).length > 0;
    if (changed) {
      await tx.insert(auditEvents).values({
        projectId,
        actorId: actor.userId,
        action: shared ? "revision.shared-with-client" : "revision.share-withdrawn",
        detail: { foundationId, revisionId, label: rev.label },
      });
    }
    const [summary] = await selectSummaries(tx, { projectId, foundationId, revisionId });
    if (!summary) throw new Error("shared revision not readable");
    return { ok: true, revision: summary, changed } as const;
  });
}

export interface LatestIssuedChecks {
  foundationId: string;
  revisionId: string;
  label: string;
  result: GoverningSource;
}

/**
 * The checks of each foundation's latest issued revision as stored (only the checks and the
 * impedance method are read, not the megabyte of sweep): the client's project table shows
 * the governing check of what was issued, never a live analysis of the draft.
 */
export async function listLatestIssuedChecks(actor: Actor, projectId: string): Promise<LatestIssuedChecks[]> {
  if (!(await allowed(actor, projectId, "revision.read"))) return [];
  const rows = await getDb()
    .selectDistinctOn([revisions.foundationId], {
      foundationId: revisions.foundationId,
      revisionId: revisions.id,
      label: revisions.label,
      checks: sql<AnalysisResult["checks"]>`${revisions.result}->'checks'`,
      impedance: sql<GoverningSource["impedance"]>`jsonb_build_object('method', ${revisions.result}->'impedance'->'method')`,
    })
    .from(revisions)
    .where(eq(revisions.projectId, projectId))
    .orderBy(revisions.foundationId, desc(revisions.sequence));
  return rows.map((r) => ({ foundationId: r.foundationId, revisionId: r.revisionId, label: r.label, result: { checks: r.checks, impedance: r.impedance } }));
}

export type CommentOutcome =
  | { ok: true; comment: RevisionComment; revision: RevisionSummary }
  | { ok: false; reason: "forbidden" | "not-found" | "parent-not-found" | "unknown-field" };

/**
 * A comment on a revision, on the whole or on one of its fields (a path of its input
 * or result, as the revision page lists them); an answer takes its parent's field.
 */
export async function createRevisionComment(
  actor: Actor,
  projectId: string,
  foundationId: string,
  revisionId: string,
  comment: { body: string; fieldPath: string | null; parentId: string | null },
): Promise<CommentOutcome> {
  if (!(await allowed(actor, projectId, "revision.comment"))) return { ok: false, reason: "forbidden" };
  return getDb().transaction(async (tx) => {
    const [hit] = await selectSummaries(tx, { projectId, foundationId, revisionId });
    if (!hit) return { ok: false, reason: "not-found" } as const;
    let fieldPath = comment.fieldPath;
    if (comment.parentId) {
      const [parent] = await tx.select().from(revisionComments).where(and(eq(revisionComments.id, comment.parentId), eq(revisionComments.revisionId, revisionId)));
      if (!parent) return { ok: false, reason: "parent-not-found" } as const;
      fieldPath = parent.fieldPath;
    } else if (fieldPath) {
      const body = await selectRevisionBody(tx, hit.id);
      if (!body || !revisionFieldPaths(body).has(fieldPath)) return { ok: false, reason: "unknown-field" } as const;
    }
    const [row] = await tx
      .insert(revisionComments)
      .values({ revisionId, parentId: comment.parentId, fieldPath, body: comment.body, authorId: actor.userId })
      .returning();
    if (!row) throw new Error("comment insert returned nothing");
    await tx.insert(auditEvents).values({
      projectId,
      actorId: actor.userId,
      action: comment.parentId ? "revision.comment-answered" : "revision.commented",
      detail: { foundationId, revisionId, label: hit.label, commentId: row.id, fieldPath },
    });
    const [author] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
    return {
      ok: true,
      revision: hit,
      comment: { id: row.id, revisionId, parentId: row.parentId, fieldPath: row.fieldPath, body: row.body, resolved: row.resolved, authorId: row.authorId, authorName: author?.name ?? "", createdAt: row.createdAt },
    } as const;
  });
}

/** Every field path of a revision a comment may name: its input's and its result's (sweep aside). */
function revisionFieldPaths(row: Pick<RevisionRow, "input" | "result">): Set<string> {
  // the plotted series (sweep, run envelopes) are not fields one comments on
  const result = withoutLongSeries(row.result as AnalysisResult);
  return new Set([...listLeafPaths(row.input), ...listLeafPaths(result)].map((p) => p.path));
}

/** Marks a top-level comment resolved or open again. */
export async function setRevisionCommentResolved(
  actor: Actor,
  projectId: string,
  foundationId: string,
  commentId: string,
  resolved: boolean,
): Promise<{ ok: true; comment: { id: string; revisionId: string; resolved: boolean } } | { ok: false; reason: "forbidden" | "not-found" | "is-answer" }> {
  if (!(await allowed(actor, projectId, "revision.comment"))) return { ok: false, reason: "forbidden" };
  return getDb().transaction(async (tx) => {
    const [c] = await tx
      .select({ id: revisionComments.id, parentId: revisionComments.parentId, revisionId: revisionComments.revisionId, label: revisions.label })
      .from(revisionComments)
      .innerJoin(revisions, eq(revisions.id, revisionComments.revisionId))
      .where(and(eq(revisionComments.id, commentId), eq(revisions.foundationId, foundationId), eq(revisions.projectId, projectId)))
      .for("update", { of: revisionComments });
    if (!c) return { ok: false, reason: "not-found" } as const;
    if (c.parentId) return { ok: false, reason: "is-answer" } as const;
    await tx
      .update(revisionComments)
      .set({ resolved, resolvedById: resolved ? actor.userId : null, resolvedAt: resolved ? new Date() : null, updatedAt: new Date() })
      .where(eq(revisionComments.id, commentId));
    await tx.insert(auditEvents).values({
      projectId,
      actorId: actor.userId,
      action: resolved ? "revision.comment-resolved" : "revision.comment-reopened",
      detail: { foundationId, revisionId: c.revisionId, label: c.label, commentId },
    });
    return { ok: true, comment: { id: commentId, revisionId: c.revisionId, resolved } } as const;
  });
}

export interface RevisionAuditEntry {
  id: number;
  action: string;
  actorName: string | null;
  label: string | null;
  createdAt: Date;
}

/** The revision transitions of one foundation, newest first (its history panel). */
export async function listRevisionHistory(actor: Actor, projectId: string, foundationId: string): Promise<RevisionAuditEntry[]> {
  const reader = await readerScope(actor, projectId, "revision.read");
  if (!reader) return [];
  // The client's trail names issues, decisions and shares; review comments are the team's.
  const clientActions = ["revision.issued", "revision.approved", "revision.returned", "revision.shared-with-client", "revision.share-withdrawn"];
  const rows = await getDb()
    .select({ id: auditEvents.id, action: auditEvents.action, actorName: users.name, detail: auditEvents.detail, createdAt: auditEvents.createdAt })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(
      and(
        eq(auditEvents.projectId, projectId),
        sql`${auditEvents.detail}->>'foundationId' = ${foundationId}`,
        sql`${auditEvents.action} like 'revision.%'`,
        reader.scope.internal ? undefined : inArray(auditEvents.action, clientActions),
      ),
    )
    .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
    .limit(200);
  return rows.map((r) => ({ id: r.id, action: r.action, actorName: r.actorName, label: typeof (r.detail as Record<string, unknown>).label === "string" ? ((r.detail as Record<string, unknown>).label as string) : null, createdAt: r.createdAt }));
}

/** Who is told about a transition: the project's members with these roles, with their e-mail. */
export async function listMemberEmailsByRole(projectId: string, roles: readonly ("manager" | "designer" | "checker")[]): Promise<{ userId: string; email: string; name: string }[]> {
  return getDb()
    .select({ userId: users.id, email: users.email, name: users.name })
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .where(and(eq(projectMembers.projectId, projectId), inArray(projectMembers.role, [...roles])));
}

/** The e-mail address and name of one user (the issuer to tell about a decision). */
export async function getUserContact(userId: string): Promise<{ email: string; name: string } | undefined> {
  const [u] = await getDb().select({ email: users.email, name: users.name }).from(users).where(eq(users.id, userId));
  return u;
}

/**
 * For the demo seed (trusted, no actor): a revision of a foundation from an input that
 * has already passed parseAnalysisInput, with an optional decision, in one transaction.
 */
export async function createSeedRevision(args: {
  projectId: string;
  foundationId: string;
  input: AnalysisInput;
  issuedById: string;
  issuedAt: Date;
  /** Who edited the draft before this revision (the demo's designer). */
  editorIds?: string[];
  vendorSubmissionId?: string | null;
  note?: string;
  purpose?: RevisionPurpose;
  /** The first signature of a two-step sign-off. */
  check?: { note: string; checkedById: string; checkedByRole: string; checkedAt: Date };
  decision?: { outcome: "returned" | "approved"; note: string; decidedById: string; decidedByRole?: string; decidedAt: Date };
  comments?: { fieldPath: string | null; body: string; authorId: string; resolved?: boolean; answer?: { body: string; authorId: string } }[];
}): Promise<string> {
  return getDb().transaction(async (tx) => {
    const earlier = await tx.select({ label: revisions.label, sequence: revisions.sequence }).from(revisions).where(eq(revisions.foundationId, args.foundationId)).orderBy(desc(revisions.sequence));
    const [project] = await tx.select({ scheme: projects.revisionScheme }).from(projects).where(eq(projects.id, args.projectId));
    const result = analyse(args.input);
    const [row] = await tx
      .insert(revisions)
      .values({
        foundationId: args.foundationId,
        projectId: args.projectId,
        sequence: (earlier[0]?.sequence ?? 0) + 1,
        label: nextRevisionLabel(project?.scheme ?? "letters", earlier.map((e) => e.label)),
        input: args.input,
        result,
        engineVersion: result.engineVersion,
        inputHash: canonicalInputHash(args.input),
        vendorSubmissionId: args.vendorSubmissionId ?? null,
        issuedById: args.issuedById,
        issuedAt: args.issuedAt,
        editorIds: args.editorIds ?? [],
        note: args.note ?? "",
        purpose: args.purpose ?? "issued-for-check",
        createdAt: args.issuedAt,
        updatedAt: args.issuedAt,
      })
      .returning({ id: revisions.id, label: revisions.label });
    if (!row) throw new Error("seed revision insert returned nothing");
    const audit = (action: string, actorId: string, at: Date, extra: Record<string, unknown> = {}) =>
      tx.insert(auditEvents).values({ projectId: args.projectId, actorId, action, detail: { foundationId: args.foundationId, revisionId: row.id, label: row.label, ...extra }, createdAt: at, updatedAt: at });
    await audit("revision.issued", args.issuedById, args.issuedAt);
    let t = args.issuedAt.getTime();
    for (const c of args.comments ?? []) {
      t += 60_000;
      const at = new Date(t);
      const [parent] = await tx
        .insert(revisionComments)
        .values({ revisionId: row.id, fieldPath: c.fieldPath, body: c.body, authorId: c.authorId, resolved: c.resolved ?? false, resolvedById: c.resolved ? c.authorId : null, resolvedAt: c.resolved ? at : null, createdAt: at, updatedAt: at })
        .returning({ id: revisionComments.id });
      await audit("revision.commented", c.authorId, at, { commentId: parent?.id, fieldPath: c.fieldPath });
      if (c.answer && parent) {
        t += 60_000;
        const at2 = new Date(t);
        await tx.insert(revisionComments).values({ revisionId: row.id, parentId: parent.id, fieldPath: c.fieldPath, body: c.answer.body, authorId: c.answer.authorId, createdAt: at2, updatedAt: at2 });
        await audit("revision.comment-answered", c.answer.authorId, at2, { fieldPath: c.fieldPath });
      }
    }
    if (args.check) {
      await tx.insert(revisionChecks).values({ revisionId: row.id, note: args.check.note, checkedById: args.check.checkedById, checkedByRole: args.check.checkedByRole, checkedAt: args.check.checkedAt });
      await audit("revision.checked", args.check.checkedById, args.check.checkedAt, { note: args.check.note, role: args.check.checkedByRole });
    }
    if (args.decision) {
      await tx.insert(revisionDecisions).values({ revisionId: row.id, outcome: args.decision.outcome, note: args.decision.note, decidedById: args.decision.decidedById, decidedByRole: args.decision.decidedByRole ?? null, decidedAt: args.decision.decidedAt });
      await audit(args.decision.outcome === "approved" ? "revision.approved" : "revision.returned", args.decision.decidedById, args.decision.decidedAt, { note: args.decision.note });
    }
    return row.id;
  });
}

/** A vendor submission as a package names it: its request (company and date), version, file and fingerprint. */
export interface RevisionVendorSubmission {
  requestId: string;
  companyName: string;
  requestedAt: Date;
  version: number;
  source: "workbook" | "csv" | "form";
  fileName: string | null;
  sha256: string;
  submittedAt: Date;
}

/** The submission a revision used, or undefined when none or not readable by the actor. */
export async function getRevisionVendorSubmission(actor: Actor, projectId: string, submissionId: string | null): Promise<RevisionVendorSubmission | undefined> {
  if (!submissionId || !(await allowed(actor, projectId, "revision.read"))) return undefined;
  const [row] = await getDb()
    .select({
      requestId: vendorRequests.id,
      companyName: companies.name,
      requestedAt: vendorRequests.createdAt,
      version: vendorSubmissions.version,
      source: vendorSubmissions.source,
      fileName: storedFiles.fileName,
      sha256: vendorSubmissions.sha256,
      submittedAt: vendorSubmissions.createdAt,
    })
    .from(vendorSubmissions)
    .innerJoin(vendorRequests, eq(vendorRequests.id, vendorSubmissions.requestId))
    .innerJoin(companies, eq(companies.id, vendorRequests.companyId))
    .leftJoin(storedFiles, eq(storedFiles.id, vendorSubmissions.fileId))
    .where(and(eq(vendorSubmissions.id, submissionId), eq(vendorSubmissions.projectId, projectId)));
  return row;
}

/** A revision's review comments with their resolution, oldest first, for the package's trail. */
export async function listRevisionCommentsWithResolution(
  actor: Actor,
  projectId: string,
  foundationId: string,
  revisionId: string,
): Promise<(RevisionComment & { resolvedByName: string | null; resolvedAt: Date | null })[]> {
  const comments = await listRevisionComments(actor, projectId, foundationId, revisionId);
  if (!comments?.length) return [];
  const resolver = alias(users, "resolver");
  const rows = await getDb()
    .select({ id: revisionComments.id, resolvedAt: revisionComments.resolvedAt, resolvedByName: resolver.name })
    .from(revisionComments)
    .leftJoin(resolver, eq(resolver.id, revisionComments.resolvedById))
    .where(eq(revisionComments.revisionId, revisionId));
  const by = new Map(rows.map((r) => [r.id, r]));
  return comments.map((c) => ({ ...c, resolvedByName: c.resolved ? (by.get(c.id)?.resolvedByName ?? null) : null, resolvedAt: c.resolved ? (by.get(c.id)?.resolvedAt ?? null) : null }));
}
