// The state of a revision, derived (the revision row itself never changes): a
// decision row makes it returned or approved; a later revision of the same
// foundation supersedes it.
export type RevisionStatus = "in-check" | "returned" | "approved" | "superseded";

export const revisionStatusLabels: Record<RevisionStatus, string> = {
  "in-check": "in check",
  returned: "returned with comments",
  approved: "approved",
  superseded: "superseded",
};

/**
 * An approved revision stays approved, the one of record for construction, while a later
 * revision is only in check or returned: it is superseded once a later one is approved
 * (`hasLaterApproval`; when not given, any later revision supersedes it, as before).
 */
export function revisionStatus(decision: "returned" | "approved" | null | undefined, hasLaterRevision: boolean, hasLaterApproval: boolean = hasLaterRevision): RevisionStatus {
  if (decision === "approved" && hasLaterRevision && !hasLaterApproval) return "approved";
  if (hasLaterRevision) return "superseded";
  return decision ?? "in-check";
}

/**
 * An approved foundation whose vendor data has moved on: the draft now uses another
 * vendor submission than the one the approval was based on, or the vendor has sent a
 * newer version of that submission (taken into the draft or not). Flagged until a
 * new revision is issued.
 */
export function isApprovalStale(
  latest: { status: RevisionStatus; vendorSubmissionId: string | null; supersededByNewerVersion?: boolean },
  draftVendorSubmissionId: string | null,
): boolean {
  if (latest.status !== "approved") return false;
  return Boolean(latest.supersededByNewerVersion) || (draftVendorSubmissionId ?? null) !== (latest.vendorSubmissionId ?? null);
}
