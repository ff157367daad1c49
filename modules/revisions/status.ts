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

export function revisionStatus(decision: "returned" | "approved" | null | undefined, hasLaterRevision: boolean): RevisionStatus {
  if (hasLaterRevision) return "superseded";
  return decision ?? "in-check";
}

/**
 * An approved foundation whose draft now uses another vendor submission than the one
 * the approval was based on: the vendor data behind the approval has been replaced,
 * so the foundation is flagged until a new revision is issued.
 */
export function isApprovalStale(latest: { status: RevisionStatus; vendorSubmissionId: string | null }, draftVendorSubmissionId: string | null): boolean {
  return latest.status === "approved" && (draftVendorSubmissionId ?? null) !== (latest.vendorSubmissionId ?? null);
}
