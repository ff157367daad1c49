import "server-only";
// The vendor data steps that both the pages' actions and the HTTP API take: each calls
// the scoped queries, then e-mails the people concerned. Mail goes out after the data
// committed, so a message never announces something that was rolled back.
import { AppError } from "@/modules/platform/errors";
import { getPublicUser, getUserByEmail } from "@/db/queries/accounts";
import { getDraft } from "@/db/queries/drafts";
import { getMembership, getProjectForMember, type Actor } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { createVendorRequest, getVendorRequest, listVendorContacts, type RequestedMachine, type VendorRequestDetail } from "@/db/queries/vendor-requests";
import { prefillInVendorTerms, type PrefillMachine } from "@/modules/desk/machine-placements";
import { acceptVendorSubmission, createVendorSubmission, returnVendorSubmission, type NewSubmission } from "@/db/queries/vendor-submissions";
import { inviteMember } from "@/app/_lib/accounts-service";
import { appUrl, sendEmail } from "@/app/_lib/mailer";

export function requestPath(projectId: string, requestId: string): string {
  return `/projects/${projectId}/requests/${requestId}`;
}

async function projectLabel(actor: Actor, projectId: string): Promise<string> {
  const p = await getProjectForMember(actor, projectId);
  return p ? `${p.code}` : "your project";
}

export type ContactChoice = { kind: "member"; userId: string } | { kind: "new"; email: string; name: string; company: string };

export interface SendRequestInput {
  foundationId: string;
  contact: ContactChoice;
  machineNames: string[];
  message: string;
  dueOn: string | null;
}

/**
 * The vendor contact's user id. A vendor member of the project is picked as is. A new
 * contact is a new member, so it goes through the manager's invitation (inviteMember, the
 * one path that adds members, with its one members.manage check): a designer may only
 * address vendors already on the project, and a data request never grants access itself.
 */
async function resolveContact(actor: Actor, projectId: string, contact: ContactChoice): Promise<string> {
  const contacts = await listVendorContacts(actor, projectId);
  if (contact.kind === "member") {
    if (!contacts.some((c) => c.userId === contact.userId)) {
      throw new AppError("invalid_input", "Choose a vendor contact of this project.", [{ path: "contact", message: "not a vendor of this project" }]);
    }
    return contact.userId;
  }
  const existing = await getUserByEmail(contact.email);
  if (existing) {
    const membership = await getMembership({ userId: existing.id, isAdmin: false }, projectId);
    if (membership && membership.role !== "vendor") {
      throw new AppError("invalid_input", `${contact.email} is already on this project as ${membership.role}; a data request goes to a vendor.`, [{ path: "newEmail", message: "already a member with another role" }]);
    }
    if (membership) {
      // Already a vendor member: the same as picking them, provided the company typed is theirs.
      const same = contacts.find((c) => c.userId === existing.id && c.companyName.trim().toLowerCase() === contact.company.trim().toLowerCase());
      if (!same) throw new AppError("invalid_input", `${contact.email} is a vendor of another company on this project.`, [{ path: "newCompany", message: "the contact belongs to another company" }]);
      return existing.id;
    }
  }
  // Not a member yet: the manager's invitation (refused for everyone but managers), with an
  // invitation e-mail and one-time link when the account has no password yet.
  const invited = await inviteMember(actor, { projectId, email: contact.email, name: contact.name, role: "vendor", company: contact.company });
  return invited.userId;
}

export async function sendDataRequest(actor: Actor, projectId: string, input: SendRequestInput): Promise<{ requestId: string }> {
  // The figures the desk holds for each machine asked for (by name), to prefill the sheets.
  const draft = await getDraft(actor, projectId, input.foundationId);
  if (!draft) throw new AppError("invalid_input", "That foundation is not in this project.", [{ path: "foundationId", message: "not a foundation of this project" }]);
  const held = draft.input?.machines ?? [];
  const machines: RequestedMachine[] = input.machineNames.map((name) => ({ name, values: held.find((m) => m.name === name) ?? null }));
  const contactUserId = await resolveContact(actor, projectId, input.contact);
  const row = await createVendorRequest(actor, projectId, { foundationId: input.foundationId, contactUserId, message: input.message, dueOn: input.dueOn, machines });
  const detail = await getVendorRequest(actor, projectId, row.id);
  if (detail) {
    const project = await projectLabel(actor, projectId);
    await sendEmail({
      to: detail.contactEmail,
      subject: `Plinthwise: machine data requested for ${detail.foundationTag} (${project})`,
      text: [
        `Hello ${detail.contactName},`,
        "",
        `${detail.requestedByName ?? "The foundation designer"} asks ${detail.companyName} for the machine data of foundation ${detail.foundationTag} (${detail.machineTrain}) on project ${project}.`,
        `Machines: ${detail.machineNames.join("; ")}.`,
        detail.dueOn ? `Wanted by ${detail.dueOn}.` : "",
        detail.message ? `Note: ${detail.message}` : "",
        "",
        "Download the data workbook, fill it in and upload it (or type the figures into the web form), with the certified drawings as PDF:",
        appUrl(requestPath(projectId, row.id)),
      ]
        .filter((l, i, all) => l !== "" || all[i - 1] !== "")
        .join("\n"),
    });
  }
  return { requestId: row.id };
}

export async function submitMachineData(actor: Actor, projectId: string, requestId: string, input: NewSubmission): Promise<{ submissionId: string; version: number }> {
  const { submission } = await createVendorSubmission(actor, projectId, requestId, input);
  await recordAuditEvent({ projectId, actorId: actor.userId, action: "vendor-submission.received", detail: { requestId, submissionId: submission.id, version: submission.version, source: submission.source, sha256: submission.sha256 } });
  // The designer who asked is told; read with the submitter's own scope (their company's request).
  const detail = await getVendorRequest(actor, projectId, requestId);
  if (detail?.requestedByEmail) {
    const project = await projectLabel(actor, projectId);
    await sendEmail({
      to: detail.requestedByEmail,
      subject: `Plinthwise: machine data version ${submission.version} received for ${detail.foundationTag} (${project})`,
      text: [
        `Hello ${detail.requestedByName ?? ""},`,
        "",
        `${detail.companyName} submitted version ${submission.version} of the machine data for ${detail.foundationTag} (${submission.source === "form" ? "web form" : submission.source}).`,
        "Review the changes and take it into the draft, or return it with a comment:",
        appUrl(requestPath(projectId, requestId)),
      ].join("\n"),
    });
  }
  return { submissionId: submission.id, version: submission.version };
}

// The submitter is e-mailed even if they have since left the project: it is their data.
async function submitterAddress(submittedById: string): Promise<{ email: string; name: string } | undefined> {
  const u = await getPublicUser(submittedById);
  return u ? { email: u.email, name: u.name } : undefined;
}

export async function acceptSubmission(actor: Actor, projectId: string, submissionId: string, draftVersion: number): Promise<{ draftVersion: number; requestId: string }> {
  const result = await acceptVendorSubmission(actor, projectId, submissionId, draftVersion);
  const to = await submitterAddress(result.submission.submittedById);
  const detail = await getVendorRequest(actor, projectId, result.request.id);
  if (to && detail) {
    await sendEmail({
      to: to.email,
      subject: `Plinthwise: your machine data for ${detail.foundationTag} (version ${result.submission.version}) was accepted`,
      text: [
        `Hello ${to.name},`,
        "",
        `Version ${result.submission.version} of your machine data for ${detail.foundationTag} was accepted and taken into the foundation design.`,
        "If the figures change (certified drawings, a revised rotor), submit a new version on the request:",
        appUrl(requestPath(projectId, result.request.id)),
      ].join("\n"),
    });
  }
  return { draftVersion: result.draftVersion, requestId: result.request.id };
}

export async function returnSubmission(actor: Actor, projectId: string, submissionId: string, comment: string): Promise<{ requestId: string }> {
  const target = await returnVendorSubmission(actor, projectId, submissionId, comment);
  const to = await submitterAddress(target.submission.submittedById);
  const detail = await getVendorRequest(actor, projectId, target.request.id);
  if (to && detail) {
    await sendEmail({
      to: to.email,
      subject: `Plinthwise: your machine data for ${detail.foundationTag} (version ${target.submission.version}) was returned`,
      text: [
        `Hello ${to.name},`,
        "",
        `Version ${target.submission.version} of your machine data for ${detail.foundationTag} was returned with this comment:`,
        "",
        comment,
        "",
        "Please submit a corrected version on the request:",
        appUrl(requestPath(projectId, target.request.id)),
      ].join("\n"),
    });
  }
  return { requestId: target.request.id };
}

/** What the workbook and CSV are prefilled with: the newest version, else what the desk held. */
/** The template's prefill, in the vendor's terms (modules/desk/machine-placements.ts). */
export function prefillMachines(request: Pick<VendorRequestDetail, "machines" | "submissions" | "datums">): PrefillMachine[] {
  return prefillInVendorTerms(request.machines, request.submissions[0], request.datums);
}
