import { createHash } from "node:crypto";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { getDb } from "../client";
import {
  foundationDrafts,
  storedFiles,
  vendorRequests,
  vendorSubmissionDrawings,
  vendorSubmissionReviews,
  vendorSubmissions,
  type StoredFileRow,
  type VendorRequestRow,
  type VendorSubmissionRow,
} from "../schema";
import { parseDraftInput, type AnalysisInputDocument } from "@/modules/calc";
import { emptyDraftForm, toInputDocument } from "@/modules/desk/draft-form";
import type { MachineInput } from "@/modules/calc/schema";
import { readPlacements, takeVendorMachines } from "@/modules/desk/machine-placements";
import type { RotorRampTimes } from "@/modules/vendor-data/layout";
import { AppError } from "@/modules/platform/errors";
import { roleAllows } from "@/modules/platform/permissions";
import { recordAuditEvent } from "./audit";
import { draftEditorsWith } from "./drafts";
import { isUniqueViolation } from "./errors";
import { storeFile } from "./files";
import { getMembership, type Actor } from "./projects";
import { getRequestScope } from "./vendor-requests";

/** SHA-256 of machines sent through the web form: of their canonical JSON. */
export function machinesSha256(machines: MachineInput[]): string {
  return createHash("sha256").update(JSON.stringify(machines)).digest("hex");
}

export interface NewSubmission {
  source: VendorSubmissionRow["source"];
  machines: MachineInput[];
  /** Positions from the machine datum (template version 2, web form) or block coordinates (version 1, the default). */
  frame?: VendorSubmissionRow["frame"];
  rampTimes?: RotorRampTimes[];
  file: { fileName: string; contentType: string; bytes: Buffer } | null;
  drawingIds: string[];
  note: string;
}

/**
 * Stores a new version of the vendor's answer, with its original file and drawings, in one
 * transaction (nothing half-written). Versions are numbered under a lock on the request, so
 * two uploads at once get consecutive versions. Only a vendor of the request's company.
 */
export async function createVendorSubmission(actor: Actor, projectId: string, requestId: string, input: NewSubmission): Promise<{ submission: VendorSubmissionRow; request: VendorRequestRow }> {
  const scope = await getRequestScope(actor, projectId, requestId, "vendorRequest.answer");
  if (!scope) throw new AppError("not_found", "No such data request for your company.");
  const drawingIds = [...new Set(input.drawingIds)];
  return getDb().transaction(async (tx) => {
    await tx.select({ id: vendorRequests.id }).from(vendorRequests).where(eq(vendorRequests.id, requestId)).for("update");
    let drawings: StoredFileRow[] = [];
    if (drawingIds.length) {
      drawings = await tx
        .select()
        .from(storedFiles)
        .where(and(eq(storedFiles.requestId, requestId), eq(storedFiles.purpose, "drawing"), inArray(storedFiles.id, drawingIds)));
      if (drawings.length !== drawingIds.length) {
        throw new AppError("invalid_input", "A drawing to attach is not one uploaded to this request.", [{ path: "drawingIds", message: "unknown drawing" }]);
      }
    }
    const last = await tx
      .select({ version: vendorSubmissions.version })
      .from(vendorSubmissions)
      .where(eq(vendorSubmissions.requestId, requestId))
      .orderBy(desc(vendorSubmissions.version))
      .limit(1);
    const version = (last[0]?.version ?? 0) + 1;
    const file = input.file
      ? await storeFile(tx, { projectId, requestId, purpose: "machine-data", fileName: input.file.fileName, contentType: input.file.contentType, bytes: input.file.bytes, uploadedById: actor.userId })
      : null;
    const rows = await tx
      .insert(vendorSubmissions)
      .values({
        requestId,
        projectId,
        version,
        source: input.source,
        machines: input.machines,
        frame: input.frame ?? "block",
        rampTimes: input.rampTimes ?? [],
        fileId: file?.id ?? null,
        sha256: file?.sha256 ?? machinesSha256(input.machines),
        note: input.note,
        submittedById: actor.userId,
      })
      .returning();
    const submission = rows[0];
    if (!submission) throw new Error("submission insert returned nothing");
    if (drawings.length) await tx.insert(vendorSubmissionDrawings).values(drawings.map((d) => ({ submissionId: submission.id, fileId: d.id })));
    await tx.update(vendorRequests).set({ updatedAt: new Date() }).where(eq(vendorRequests.id, requestId));
    return { submission, request: scope.request };
  });
}

/** A drawing (already checked to be a PDF) uploaded to a request, to attach to a version. */
export async function createRequestDrawing(actor: Actor, projectId: string, requestId: string, file: { fileName: string; bytes: Buffer }): Promise<StoredFileRow> {
  const scope = await getRequestScope(actor, projectId, requestId, "vendorRequest.answer");
  if (!scope) throw new AppError("not_found", "No such data request for your company.");
  return getDb().transaction((tx) =>
    storeFile(tx, { projectId, requestId, purpose: "drawing", fileName: file.fileName, contentType: "application/pdf", bytes: file.bytes, uploadedById: actor.userId }),
  );
}

interface ReviewTarget {
  submission: VendorSubmissionRow;
  request: VendorRequestRow;
}

async function reviewTarget(actor: Actor, projectId: string, submissionId: string): Promise<ReviewTarget> {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, "vendorSubmission.review")) throw new AppError("forbidden");
  const rows = await getDb()
    .select({ submission: vendorSubmissions, request: vendorRequests })
    .from(vendorSubmissions)
    .innerJoin(vendorRequests, eq(vendorRequests.id, vendorSubmissions.requestId))
    .where(and(eq(vendorSubmissions.id, submissionId), eq(vendorSubmissions.projectId, projectId)))
    .limit(1);
  const row = rows[0];
  if (!row) throw new AppError("not_found", "No such submission in this project.");
  return row;
}

/** A review is given once, on the newest version only (an older one is already superseded). */
async function assertReviewable(tx: Parameters<Parameters<ReturnType<typeof getDb>["transaction"]>[0]>[0], t: ReviewTarget): Promise<void> {
  await tx.select({ id: vendorRequests.id }).from(vendorRequests).where(eq(vendorRequests.id, t.request.id)).for("update");
  const newest = await tx
    .select({ version: vendorSubmissions.version })
    .from(vendorSubmissions)
    .where(eq(vendorSubmissions.requestId, t.request.id))
    .orderBy(desc(vendorSubmissions.version))
    .limit(1);
  if ((newest[0]?.version ?? 0) > t.submission.version) {
    throw new AppError("conflict", `Version ${t.submission.version} has been superseded by version ${newest[0]?.version}; review that one.`);
  }
  const reviewed = await tx.select({ decision: vendorSubmissionReviews.decision }).from(vendorSubmissionReviews).where(eq(vendorSubmissionReviews.submissionId, t.submission.id)).limit(1);
  if (reviewed[0]) throw new AppError("conflict", `This version was already ${reviewed[0].decision === "accepted" ? "taken into the draft" : "returned"}.`);
}

export type AcceptResult = { submission: VendorSubmissionRow; request: VendorRequestRow; draftVersion: number };

/**
 * Takes a submission's machines into the foundation's draft: the draft's machines are
 * replaced (a foundation without a draft gets one, from the empty form), the input is checked
 * as a draft (it may be incomplete, never invalid), and the save only happens if the draft is
 * still at the version the designer reviewed against (409 otherwise, nothing changed). The review row and the draft change commit together.
 */
export async function acceptVendorSubmission(actor: Actor, projectId: string, submissionId: string, expectedDraftVersion: number): Promise<AcceptResult> {
  const target = await reviewTarget(actor, projectId, submissionId);
  let result: AcceptResult;
  try {
    result = await getDb().transaction(async (tx) => {
      await assertReviewable(tx, target);
      const drafts = await tx.select().from(foundationDrafts).where(eq(foundationDrafts.foundationId, target.request.foundationId)).for("update");
      const draft = drafts[0];
      const current = draft?.version ?? 0;
      if (current !== expectedDraftVersion) {
        throw new AppError("conflict", `The draft changed since you opened this page (it is now at version ${current}). Reload to review against the current draft.`);
      }
      // A foundation with no saved draft starts from the workspace's empty form (one mat,
      // blank soil): the vendor's data need not wait for a save (issue 18).
      const base = (draft?.input ?? toInputDocument(emptyDraftForm())) as AnalysisInputDocument;
      // Positions from the machine datum go through the datum the designer placed (nothing is
      // guessed: without one the take-in is refused, naming the machine); the vendor's own
      // values and the datum are kept beside the input (machine_placements).
      const requested = (target.request.machines as { name: string }[]).map((m) => m.name);
      const taken = takeVendorMachines({
        submission: {
          id: target.submission.id,
          version: target.submission.version,
          frame: target.submission.frame,
          machines: target.submission.machines as MachineInput[],
          rampTimes: target.submission.rampTimes as RotorRampTimes[],
        },
        requestedNames: requested,
        placements: readPlacements(draft?.machinePlacements),
        transient: base.transient,
      });
      if (!taken.ok) throw new AppError("invalid_input", taken.issues[0]?.message ?? "The machine datum is not placed.", taken.issues);
      const next = { ...base, machines: taken.machines, ...(taken.transient ? { transient: taken.transient } : {}) };
      // The draft may stay incomplete (the analysis waits); a value that is wrong is refused.
      const parsed = parseDraftInput(next);
      if (!parsed.ok) {
        throw new AppError("invalid_input", "With these machines the draft would not be a valid analysis input.", parsed.issues.map((i) => ({ path: i.path, message: i.message })));
      }
      const input = parsed.complete ? parsed.input : next;
      const change = {
        input,
        machinePlacements: taken.placements,
        vendorSubmissionId: target.submission.id,
        updatedById: actor.userId,
        // Taking vendor data in writes the draft: the one who did it is among its editors.
        editorIds: draftEditorsWith(actor.userId),
        updatedAt: new Date(),
      };
      const saved = draft
        ? await tx
            .update(foundationDrafts)
            .set({ ...change, version: sql`${foundationDrafts.version} + 1` })
            .where(and(eq(foundationDrafts.id, draft.id), eq(foundationDrafts.version, expectedDraftVersion)))
            .returning({ version: foundationDrafts.version })
        : await tx
            .insert(foundationDrafts)
            .values({ ...change, foundationId: target.request.foundationId, version: 1, editorIds: [actor.userId] })
            // Someone saved the first draft meanwhile: a conflict, not an overwrite.
            .onConflictDoNothing({ target: foundationDrafts.foundationId })
            .returning({ version: foundationDrafts.version });
      const draftVersion = saved[0]?.version;
      if (draftVersion === undefined) throw new AppError("conflict");
      await tx.insert(vendorSubmissionReviews).values({ submissionId: target.submission.id, decision: "accepted", draftVersion, reviewedById: actor.userId });
      return { submission: target.submission, request: target.request, draftVersion };
    });
  } catch (e) {
    if (isUniqueViolation(e, "vendor_submission_reviews_submission_uq")) throw new AppError("conflict", "Someone reviewed this version first.");
    throw e;
  }
  await recordAuditEvent({
    projectId,
    actorId: actor.userId,
    action: "vendor-submission.accepted",
    detail: { submissionId, version: result.submission.version, foundationId: result.request.foundationId, draftVersion: result.draftVersion },
  });
  return result;
}

/** Returns a submission to the vendor with the designer's comment. */
export async function returnVendorSubmission(actor: Actor, projectId: string, submissionId: string, comment: string): Promise<ReviewTarget> {
  const target = await reviewTarget(actor, projectId, submissionId);
  try {
    await getDb().transaction(async (tx) => {
      await assertReviewable(tx, target);
      await tx.insert(vendorSubmissionReviews).values({ submissionId: target.submission.id, decision: "returned", comment, reviewedById: actor.userId });
    });
  } catch (e) {
    if (isUniqueViolation(e, "vendor_submission_reviews_submission_uq")) throw new AppError("conflict", "Someone reviewed this version first.");
    throw e;
  }
  await recordAuditEvent({ projectId, actorId: actor.userId, action: "vendor-submission.returned", detail: { submissionId, version: target.submission.version } });
  return target;
}
