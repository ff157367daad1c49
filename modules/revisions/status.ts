// The state of a revision, derived (the revision row itself never changes): a
// decision row makes it returned or approved; a later revision of the same
// foundation supersedes it.
// In a two-step project a check row (the first signature) makes it "checked" until the
// approval or a return.
export type RevisionStatus = "in-check" | "checked" | "returned" | "approved" | "superseded";

export const revisionStatusLabels: Record<RevisionStatus, string> = {
  "in-check": "in check",
  checked: "checked, awaiting approval",
  returned: "returned with comments",
  approved: "approved",
  superseded: "superseded",
};

/**
 * An approved revision stays approved, the one of record for construction, while a later
 * revision is only in check or returned: it is superseded once a later one is approved
 * (`hasLaterApproval`; when not given, any later revision supersedes it, as before).
 * `checked`: the first signature of a two-step sign-off is given.
 */
export function revisionStatus(
  decision: "returned" | "approved" | null | undefined,
  hasLaterRevision: boolean,
  opts: { checked?: boolean; hasLaterApproval?: boolean } = {},
): RevisionStatus {
  const checked = opts.checked ?? false;
  const hasLaterApproval = opts.hasLaterApproval ?? hasLaterRevision;
  if (decision === "approved" && hasLaterRevision && !hasLaterApproval) return "approved";
  if (hasLaterRevision) return "superseded";
  return decision ?? (checked ? "checked" : "in-check");
}

/** How a project signs a revision off: one step (approved), or two (checked, then approved by someone else). */
export type SignOffSteps = "one" | "two";

export const signOffStepsLabels: Record<SignOffSteps, string> = {
  one: "one step: a checker or manager approves",
  two: "two steps: checked by a checker, then approved by a manager or another checker",
};

/** What a revision is issued for (our own fixed list), chosen when issuing. */
export const REVISION_PURPOSES = ["issued-for-check", "issued-for-information", "issued-for-approval", "issued-for-construction", "as-built"] as const;
export type RevisionPurpose = (typeof REVISION_PURPOSES)[number];

export const revisionPurposeLabels: Record<RevisionPurpose, string> = {
  "issued-for-check": "issued for check",
  "issued-for-information": "issued for information",
  "issued-for-approval": "issued for approval",
  "issued-for-construction": "issued for construction",
  "as-built": "as built",
};

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
