import "server-only";
import { REQUIRED_MESSAGE } from "@/modules/calc";
import { AppError } from "@/modules/platform/errors";
import { revisionPurposeLabels, revisionStatusLabels, type RevisionPurpose } from "@/modules/revisions";
import { getFoundation } from "@/db/queries/foundations";
import {
  createRevisionComment,
  decideRevision,
  getUserContact,
  issueRevision,
  listMemberEmailsByRole,
  setRevisionCommentResolved,
  setRevisionShared,
  type RevisionComment,
  type RevisionSummary,
} from "@/db/queries/revisions";
import type { Actor } from "@/db/queries/projects";
import { appUrl, sendEmail } from "@/app/_lib/mailer";
import { analyseInPool } from "@/app/_lib/analysis-pool";

// The revision commands shared by the server actions and the route handlers: the
// query does the transition and its audit event in one transaction; this turns its
// outcome into the product's errors and tells the people concerned by e-mail.

export function revisionPath(projectId: string, foundationId: string, revisionId?: string): string {
  const base = `/projects/${projectId}/foundations/${foundationId}/revisions`;
  return revisionId ? `${base}/${revisionId}` : base;
}

async function tagOf(actor: Actor, projectId: string, foundationId: string): Promise<string> {
  return (await getFoundation(actor, projectId, foundationId))?.tag ?? "a foundation";
}

// Mail is queued in PostgreSQL by sendEmail; a mail server that is down delays the
// message, it never undoes the transition that already committed.
async function notify(recipients: { email: string }[], subject: string, text: string): Promise<void> {
  const seen = new Set<string>();
  for (const r of recipients) {
    if (seen.has(r.email)) continue;
    seen.add(r.email);
    await sendEmail({ to: r.email, subject, text });
  }
}

export async function issueForCheck(actor: Actor, input: { projectId: string; foundationId: string; draftVersion?: number; note: string; purpose?: RevisionPurpose }): Promise<RevisionSummary> {
  const out = await issueRevision(actor, input.projectId, input.foundationId, { expectedDraftVersion: input.draftVersion, purpose: input.purpose, analyse: analyseInPool, note: input.note });
  if (!out.ok) {
    switch (out.reason) {
      case "forbidden":
        throw new AppError("forbidden");
      case "not-found":
        throw new AppError("not_found", "That foundation is not on this project.");
      case "no-draft":
        throw new AppError("invalid_input", "Save the draft before issuing it for check.", [{ path: "draftVersion", message: "There is no saved draft yet" }]);
      case "stale-draft":
        throw new AppError("conflict", `The draft was saved again since you opened it (now version ${out.currentVersion}). Reload, look it over and issue again.`);
      case "invalid-draft": {
        // A draft may be saved incomplete (issue 18): the message names what is still missing,
        // so the issue form's one line says what to fill in.
        const missing = out.issues.filter((i) => i.message === REQUIRED_MESSAGE).map((i) => i.path);
        const shown = missing.slice(0, 12).join(", ") + (missing.length > 12 ? ` and ${missing.length - 12} more` : "");
        const message = missing.length
          ? `The saved draft is incomplete; fill in the workspace first: ${shown} (required).`
          : "The saved draft is not a complete, valid input; fix it in the workspace first.";
        throw new AppError("invalid_input", message, out.issues.map((i) => ({ path: `input.${i.path}`, message: i.message })));
      }
      case "identical":
        throw new AppError("conflict", `The saved draft is identical to revision ${out.label} (same input fingerprint); change something before issuing again.`);
    }
  }
  const rev = out.revision;
  const tag = await tagOf(actor, input.projectId, input.foundationId);
  const checkers = await listMemberEmailsByRole(input.projectId, ["checker", "manager"]);
  await notify(
    checkers.filter((c) => c.userId !== actor.userId),
    `[Plinthwise] ${tag} revision ${rev.label} issued for check`,
    `${rev.issuedByName} issued revision ${rev.label} of foundation ${tag} for check (purpose: ${revisionPurposeLabels[rev.purpose]}).\n\nRevision note: ${rev.note}\n\nOpen it: ${appUrl(revisionPath(input.projectId, input.foundationId, rev.id))}\n\nInput fingerprint (SHA-256): ${rev.inputHash}\nEngine version: ${rev.engineVersion}\n`,
  );
  return rev;
}

export async function decideOnRevision(
  actor: Actor,
  input: { projectId: string; foundationId: string; revisionId: string; outcome: "checked" | "returned" | "approved"; note: string },
): Promise<RevisionSummary> {
  if (input.outcome === "returned" && !input.note) {
    throw new AppError("invalid_input", undefined, [{ path: "note", message: "Say what needs to change when returning a revision" }]);
  }
  const out = await decideRevision(actor, input.projectId, input.foundationId, input.revisionId, { outcome: input.outcome, note: input.note });
  if (!out.ok) {
    switch (out.reason) {
      case "forbidden":
        throw new AppError("forbidden");
      case "not-found":
        throw new AppError("not_found", "That revision is not on this foundation.");
      case "own-revision":
        throw new AppError("forbidden", "You issued this revision; someone else must return or approve it.");
      case "draft-editor":
        throw new AppError("forbidden", "You edited the draft of this revision, so you are one of its authors; four eyes: someone who did not write it must return or approve it.");
      case "superseded":
        throw new AppError("conflict", "A later revision has been issued; decide on that one instead.");
      case "one-step":
        throw new AppError("invalid_input", "This project signs revisions off in one step: approve or return it.", [{ path: "outcome", message: "\"checked\" is only used when the project's sign-off has two steps" }]);
      case "not-checked":
        throw new AppError("conflict", "This project signs revisions off in two steps: a checker must mark it checked before it is approved.");
      case "own-check":
        throw new AppError("forbidden", "You checked this revision; a different person (a manager or another checker) must approve it.");
      case "already-checked":
        throw new AppError("conflict", "This revision has already been checked; it now awaits approval.");
      case "already-decided":
        throw new AppError("conflict", `This revision has already been ${out.outcome === "approved" ? "approved" : "returned"}.`);
    }
  }
  const rev = out.revision;
  const decision = rev.decision;
  const tag = await tagOf(actor, input.projectId, input.foundationId);
  const issuer = await getUserContact(rev.issuedById);
  if (input.outcome === "checked" && rev.check) {
    // The second signature is someone else's: tell the approvers (and the issuer).
    const approvers = (await listMemberEmailsByRole(input.projectId, ["checker", "manager"])).filter((m) => m.userId !== actor.userId && m.userId !== rev.issuedById);
    await notify(
      [...approvers, ...(issuer ? [issuer] : [])],
      `[Plinthwise] ${tag} revision ${rev.label} checked, awaiting approval`,
      `${rev.check.checkedByName} checked revision ${rev.label} of foundation ${tag}; it now awaits approval by a manager or another checker.\n${rev.check.note ? `\nNote: ${rev.check.note}\n` : ""}\nOpen it: ${appUrl(revisionPath(input.projectId, input.foundationId, rev.id))}\n`,
    );
    return rev;
  }
  if (issuer && decision) {
    const verb = decision.outcome === "approved" ? "approved" : "returned with comments";
    await notify(
      [issuer],
      `[Plinthwise] ${tag} revision ${rev.label} ${verb}`,
      `${decision.decidedByName} ${verb} revision ${rev.label} of foundation ${tag}.\n${decision.note ? `\nNote: ${decision.note}\n` : ""}\nStatus: ${revisionStatusLabels[rev.status]}. Open comments: ${rev.openComments}.\nOpen it: ${appUrl(revisionPath(input.projectId, input.foundationId, rev.id))}\n`,
    );
  }
  return rev;
}

export async function commentOnRevision(
  actor: Actor,
  input: { projectId: string; foundationId: string; revisionId: string; body: string; fieldPath: string | null; parentId: string | null },
): Promise<RevisionComment> {
  const out = await createRevisionComment(actor, input.projectId, input.foundationId, input.revisionId, input);
  if (!out.ok) {
    switch (out.reason) {
      case "forbidden":
        throw new AppError("forbidden");
      case "not-found":
        throw new AppError("not_found", "That revision is not on this foundation.");
      case "parent-not-found":
        throw new AppError("invalid_input", undefined, [{ path: "parentId", message: "The comment you answer is not on this revision" }]);
      case "unknown-field":
        throw new AppError("invalid_input", undefined, [{ path: "fieldPath", message: "This revision has no such field" }]);
    }
  }
  return out.comment;
}

export async function resolveRevisionComment(actor: Actor, input: { projectId: string; foundationId: string; commentId: string; resolved: boolean }) {
  const out = await setRevisionCommentResolved(actor, input.projectId, input.foundationId, input.commentId, input.resolved);
  if (!out.ok) {
    switch (out.reason) {
      case "forbidden":
        throw new AppError("forbidden");
      case "not-found":
        throw new AppError("not_found", "That comment is not on this foundation.");
      case "is-answer":
        throw new AppError("invalid_input", undefined, [{ path: "commentId", message: "Resolve the comment itself, not an answer to it" }]);
    }
  }
  return out.comment;
}

/** Shares a revision's package with the client (viewer role) or withdraws the share. */
export async function shareRevisionWithClient(actor: Actor, input: { projectId: string; foundationId: string; revisionId: string; shared: boolean }): Promise<RevisionSummary> {
  const out = await setRevisionShared(actor, input.projectId, input.foundationId, input.revisionId, input.shared);
  if (!out.ok) {
    if (out.reason === "forbidden") throw new AppError("forbidden");
    throw new AppError("not_found", "That revision is not on this foundation.");
  }
  return out.revision;
}
