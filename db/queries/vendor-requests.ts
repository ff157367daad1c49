import { and, asc, desc, eq, inArray, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb } from "../client";
import {
  companies,
  foundationDrafts,
  foundations,
  projectMembers,
  storedFiles,
  users,
  vendorRequests,
  vendorSubmissionDrawings,
  vendorSubmissionReviews,
  vendorSubmissions,
  type VendorRequestRow,
} from "../schema";
import type { MachineInput } from "@/modules/calc/schema";
import { AppError } from "@/modules/platform/errors";
import { roleAllows, type ProjectPermission } from "@/modules/platform/permissions";
import { readPlacements } from "@/modules/desk/machine-placements";
import type { MachineDatum } from "@/modules/vendor-data/datum";
import { MAX_BEARINGS, MAX_ROTORS, type RotorRampTimes } from "@/modules/vendor-data/layout";
import { assertFoundationActive, getFoundation } from "./foundations";
import { getMembership, type Actor, type Membership } from "./projects";
import { recordAuditEvent } from "./audit";

/** A machine asked for, with the figures the desk held when the request was sent. */
export interface RequestedMachine {
  name: string;
  values: MachineInput | null;
}

/** Where a request stands, from its latest submission and that one's review. */
export type RequestStatus = "awaiting-data" | "awaiting-review" | "returned" | "accepted";

export const requestStatusLabels: Record<RequestStatus, string> = {
  "awaiting-data": "Awaiting data",
  "awaiting-review": "Awaiting review",
  returned: "Returned to vendor",
  accepted: "Taken into draft",
};

export interface VendorRequestSummary {
  id: string;
  projectId: string;
  foundationId: string;
  foundationTag: string;
  machineTrain: string;
  companyId: string;
  companyName: string;
  contactName: string;
  contactEmail: string;
  requestedById: string | null;
  requestedByName: string | null;
  requestedByEmail: string | null;
  message: string;
  dueOn: string | null;
  createdAt: Date;
  machineNames: string[];
  latestVersion: number | null;
  status: RequestStatus;
}

export interface FileMeta {
  id: string;
  fileName: string;
  byteSize: number;
  sha256: string;
  contentType: string;
  createdAt: Date;
}

export interface SubmissionView {
  id: string;
  version: number;
  source: "workbook" | "csv" | "form";
  machines: MachineInput[];
  /** "machine-datum": positions from each machine's own datum; "block": version 1 template (block coordinates). */
  frame: "machine-datum" | "block";
  rampTimes: RotorRampTimes[];
  sha256: string;
  note: string;
  createdAt: Date;
  submittedById: string;
  submittedByName: string;
  submittedByEmail: string;
  file: FileMeta | null;
  drawings: FileMeta[];
  review: { decision: "accepted" | "returned"; comment: string; draftVersion: number | null; reviewedByName: string; createdAt: Date } | null;
}

export interface VendorRequestDetail extends VendorRequestSummary {
  machines: RequestedMachine[];
  /** Newest first. */
  submissions: SubmissionView[];
  /** Every drawing uploaded to the request, attached or not yet. */
  drawings: FileMeta[];
  /**
   * The datum the designer placed on the block for each machine of the foundation's draft
   * (by machine name): the workbook is prefilled in the machine's terms through it.
   */
  datums: { machine: string; datum: MachineDatum }[];
}

export interface RequestScope {
  membership: Membership;
  request: VendorRequestRow;
}

/** Which requests a member sees: all of the project, or only their company's (vendors). */
function companyCondition(membership: Membership): SQL | undefined | "none" {
  if (membership.role !== "vendor") return undefined;
  return membership.companyId ? eq(vendorRequests.companyId, membership.companyId) : "none";
}

/**
 * The request, when the actor's role allows the permission and, for a vendor, the request
 * is addressed to their own company. Undefined otherwise, exactly as for a request that
 * does not exist, so a request id of another company reveals nothing.
 */
export async function getRequestScope(actor: Actor, projectId: string, requestId: string, permission: ProjectPermission): Promise<RequestScope | undefined> {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, permission)) return undefined;
  const company = companyCondition(membership);
  if (company === "none") return undefined;
  const rows = await getDb()
    .select()
    .from(vendorRequests)
    .where(and(eq(vendorRequests.id, requestId), eq(vendorRequests.projectId, projectId), company))
    .limit(1);
  const request = rows[0];
  return request ? { membership, request } : undefined;
}

const contact = alias(users, "contact");
const requester = alias(users, "requester");

function statusOf(latest: { reviewDecision: "accepted" | "returned" | null } | undefined): RequestStatus {
  if (!latest) return "awaiting-data";
  if (latest.reviewDecision === "accepted") return "accepted";
  if (latest.reviewDecision === "returned") return "returned";
  return "awaiting-review";
}

async function summaries(projectId: string, where: SQL | undefined): Promise<VendorRequestSummary[]> {
  const db = getDb();
  const rows = await db
    .select({
      request: vendorRequests,
      foundationTag: foundations.tag,
      machineTrain: foundations.machineTrain,
      companyName: companies.name,
      contactName: contact.name,
      contactEmail: contact.email,
      requestedByName: requester.name,
      requestedByEmail: requester.email,
    })
    .from(vendorRequests)
    .innerJoin(foundations, eq(foundations.id, vendorRequests.foundationId))
    .innerJoin(companies, eq(companies.id, vendorRequests.companyId))
    .innerJoin(contact, eq(contact.id, vendorRequests.contactUserId))
    .leftJoin(requester, eq(requester.id, vendorRequests.requestedById))
    .where(and(eq(vendorRequests.projectId, projectId), where))
    .orderBy(desc(vendorRequests.createdAt));
  const ids = rows.map((r) => r.request.id);
  const subs = ids.length
    ? await db
        .select({ requestId: vendorSubmissions.requestId, version: vendorSubmissions.version, reviewDecision: vendorSubmissionReviews.decision })
        .from(vendorSubmissions)
        .leftJoin(vendorSubmissionReviews, eq(vendorSubmissionReviews.submissionId, vendorSubmissions.id))
        .where(inArray(vendorSubmissions.requestId, ids))
        .orderBy(desc(vendorSubmissions.version))
    : [];
  return rows.map((r) => {
    const latest = subs.find((s) => s.requestId === r.request.id);
    const machines = r.request.machines as RequestedMachine[];
    return {
      id: r.request.id,
      projectId: r.request.projectId,
      foundationId: r.request.foundationId,
      foundationTag: r.foundationTag,
      machineTrain: r.machineTrain,
      companyId: r.request.companyId,
      companyName: r.companyName,
      contactName: r.contactName,
      contactEmail: r.contactEmail,
      requestedById: r.request.requestedById,
      requestedByName: r.requestedByName,
      requestedByEmail: r.requestedByEmail,
      message: r.request.message,
      dueOn: r.request.dueOn,
      createdAt: r.request.createdAt,
      machineNames: machines.map((m) => m.name),
      latestVersion: latest?.version ?? null,
      status: statusOf(latest),
    };
  });
}

/** The requests the actor may see: a vendor only their company's; designers and managers all. */
export async function listVendorRequests(actor: Actor, projectId: string): Promise<VendorRequestSummary[]> {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, "vendorRequest.readOwn")) return [];
  const company = companyCondition(membership);
  if (company === "none") return [];
  return summaries(projectId, company);
}

function fileMeta(f: typeof storedFiles.$inferSelect): FileMeta {
  return { id: f.id, fileName: f.fileName, byteSize: f.byteSize, sha256: f.sha256, contentType: f.contentType, createdAt: f.createdAt };
}

export async function getVendorRequest(actor: Actor, projectId: string, requestId: string): Promise<VendorRequestDetail | undefined> {
  const scope = await getRequestScope(actor, projectId, requestId, "vendorRequest.readOwn");
  if (!scope) return undefined;
  const summary = (await summaries(projectId, eq(vendorRequests.id, requestId)))[0];
  if (!summary) return undefined;
  const db = getDb();
  const submitter = alias(users, "submitter");
  const reviewer = alias(users, "reviewer");
  const subs = await db
    .select({ s: vendorSubmissions, submitterName: submitter.name, submitterEmail: submitter.email, review: vendorSubmissionReviews, reviewerName: reviewer.name })
    .from(vendorSubmissions)
    .innerJoin(submitter, eq(submitter.id, vendorSubmissions.submittedById))
    .leftJoin(vendorSubmissionReviews, eq(vendorSubmissionReviews.submissionId, vendorSubmissions.id))
    .leftJoin(reviewer, eq(reviewer.id, vendorSubmissionReviews.reviewedById))
    .where(eq(vendorSubmissions.requestId, requestId))
    .orderBy(desc(vendorSubmissions.version));
  const files = await db.select().from(storedFiles).where(eq(storedFiles.requestId, requestId)).orderBy(asc(storedFiles.createdAt));
  const links = subs.length
    ? await db.select().from(vendorSubmissionDrawings).where(inArray(vendorSubmissionDrawings.submissionId, subs.map((s) => s.s.id)))
    : [];
  const byId = new Map(files.map((f) => [f.id, f]));
  // Read under the request's scope (a vendor of the company may read the request), not the
  // draft's: only where each machine's datum sits, nothing else of the draft.
  const draftRows = await db.select({ placements: foundationDrafts.machinePlacements }).from(foundationDrafts).where(eq(foundationDrafts.foundationId, scope.request.foundationId)).limit(1);
  const datums = readPlacements(draftRows[0]?.placements).flatMap((p) => (p.datum ? [{ machine: p.machine, datum: p.datum }] : []));
  return {
    ...summary,
    datums,
    machines: scope.request.machines as RequestedMachine[],
    drawings: files.filter((f) => f.purpose === "drawing").map(fileMeta),
    submissions: subs.map(({ s, submitterName, submitterEmail, review, reviewerName }) => {
      const file = s.fileId ? byId.get(s.fileId) : undefined;
      return {
        id: s.id,
        version: s.version,
        source: s.source,
        machines: s.machines as MachineInput[],
        frame: s.frame,
        rampTimes: s.rampTimes as RotorRampTimes[],
        sha256: s.sha256,
        note: s.note,
        createdAt: s.createdAt,
        submittedById: s.submittedById,
        submittedByName: submitterName,
        submittedByEmail: submitterEmail,
        file: file ? fileMeta(file) : null,
        drawings: links
          .filter((l) => l.submissionId === s.id)
          .map((l) => byId.get(l.fileId))
          .filter((f): f is NonNullable<typeof f> => !!f)
          .map(fileMeta),
        review: review
          ? { decision: review.decision, comment: review.comment, draftVersion: review.draftVersion, reviewedByName: reviewerName ?? "", createdAt: review.createdAt }
          : null,
      };
    }),
  };
}

export interface VendorContact {
  memberId: string;
  userId: string;
  name: string;
  email: string;
  companyId: string;
  companyName: string;
}

/** Vendor members of the project with their company, for addressing a request. */
export async function listVendorContacts(actor: Actor, projectId: string): Promise<VendorContact[]> {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, "vendorRequest.create")) return [];
  const rows = await getDb()
    .select({ memberId: projectMembers.id, userId: users.id, name: users.name, email: users.email, companyId: companies.id, companyName: companies.name })
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .innerJoin(companies, eq(companies.id, projectMembers.companyId))
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.role, "vendor")))
    .orderBy(asc(companies.name), asc(users.name));
  return rows;
}

export interface NewVendorRequest {
  foundationId: string;
  contactUserId: string;
  message: string;
  dueOn: string | null;
  machines: RequestedMachine[];
}

/** Creates a request to a vendor member's company; the contact must be a vendor of the project. */
export async function createVendorRequest(actor: Actor, projectId: string, input: NewVendorRequest): Promise<VendorRequestRow> {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, "vendorRequest.create")) throw new AppError("forbidden");
  const foundation = await getFoundation(actor, projectId, input.foundationId);
  if (!foundation) throw new AppError("invalid_input", "That foundation is not in this project.", [{ path: "foundationId", message: "not a foundation of this project" }]);
  assertFoundationActive(foundation);
  const contactRows = await getDb()
    .select({ companyId: projectMembers.companyId, role: projectMembers.role })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, input.contactUserId)))
    .limit(1);
  const c = contactRows[0];
  if (!c || c.role !== "vendor" || !c.companyId) {
    throw new AppError("invalid_input", "The contact must be a vendor member of this project with a company.", [{ path: "contactUserId", message: "not a vendor of this project" }]);
  }
  input.machines.forEach((m, i) => {
    if (m.values && (m.values.rotors.length > MAX_ROTORS || m.values.rotors.some((r) => r.bearings.length > MAX_BEARINGS))) {
      throw new AppError("invalid_input", `Machine ${m.name} has more rotors or bearings than the data sheet holds (${MAX_ROTORS} rotors, ${MAX_BEARINGS} bearings each).`, [
        { path: `machines[${i}]`, message: "too many rotors or bearings for the data sheet" },
      ]);
    }
  });
  const rows = await getDb()
    .insert(vendorRequests)
    .values({
      projectId,
      foundationId: foundation.id,
      companyId: c.companyId,
      contactUserId: input.contactUserId,
      requestedById: actor.userId,
      message: input.message,
      dueOn: input.dueOn,
      machines: input.machines,
    })
    .returning();
  const row = rows[0];
  if (!row) throw new Error("vendor request insert returned nothing");
  await recordAuditEvent({ projectId, actorId: actor.userId, action: "vendor-request.sent", detail: { requestId: row.id, foundation: foundation.tag, companyId: c.companyId } });
  return row;
}
