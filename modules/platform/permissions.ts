// The one permission map: which project role may do what. Every route handler
// and server action names one of these permissions and the guard enforces it.
export const projectRoles = ["manager", "designer", "checker", "vendor", "viewer"] as const;
export type ProjectRole = (typeof projectRoles)[number];

export const permissionMap = {
  "project.read": ["manager", "designer", "checker", "viewer"],
  "project.update": ["manager"],
  "members.read": ["manager", "designer", "checker"],
  "members.manage": ["manager"],
  // The foundation list and its tags; the draft behind them is "draft.read".
  "foundation.read": ["manager", "designer", "checker", "viewer"],
  // The live, unissued draft (the workspace, GET .../draft, the project table's live
  // governing check): the design team only. The client (viewer) sees issued revisions.
  "draft.read": ["manager", "designer", "checker"],
  "foundation.create": ["manager", "designer"],
  // Withdrawing a foundation created by mistake (and restoring it); a withdrawn one is read by managers only.
  "foundation.withdraw": ["manager"],
  "draft.edit": ["manager", "designer"],
  "calc.run": ["manager", "designer", "checker", "viewer"],
  // Revisions: issued ones are read by everyone but vendors; a checker or manager
  // decides (returns or approves), never on a revision they issued themselves
  // (that rule needs the revision, so the revision code checks it as well).
  "revision.read": ["manager", "designer", "checker", "viewer"],
  "revision.issue": ["manager", "designer"],
  // Review comments are internal to the design team: reading them is commenting's permission.
  "revision.comment": ["manager", "designer", "checker"],
  "revision.commentsRead": ["manager", "designer", "checker"],
  "revision.decide": ["manager", "checker"],
  // Vendor data: designers and managers ask and review; a vendor sees and answers
  // only the requests addressed to their own company (checked on the request).
  "vendorRequest.create": ["manager", "designer"],
  "vendorRequest.readOwn": ["vendor", "manager", "designer"],
  "vendorRequest.answer": ["vendor"],
  "vendorSubmission.review": ["manager", "designer"],
  // A viewer downloads only approved revisions' packages, or one a manager shared with
  // the client (checked on the revision by db/queries/revisions.ts getPackageRevision).
  "package.export": ["manager", "designer", "checker", "viewer"],
  // Sharing an earlier (unapproved) revision's package with the client.
  "revision.share": ["manager"],
  "register.export": ["manager"],
  // Commissioning (site measurements on an approved revision): the design team and the client
  // read them; a vendor reads only its own company's records, on foundations whose data
  // request went to that company (checked on the foundation by db/queries/commissioning.ts),
  // and sees the readings and their verdicts, not the design's prediction or calibration.
  "measurement.read": ["manager", "designer", "checker", "viewer", "vendor"],
  // Adding one: designers, managers and the vendor's field staff (own company, as above).
  "measurement.create": ["manager", "designer", "vendor"],
} as const satisfies Record<string, readonly ProjectRole[]>;

export type ProjectPermission = keyof typeof permissionMap;

export function roleAllows(role: ProjectRole | null | undefined, permission: ProjectPermission): boolean {
  if (!role) return false;
  return (permissionMap[permission] as readonly ProjectRole[]).includes(role);
}

export function isProjectRole(value: unknown): value is ProjectRole {
  return typeof value === "string" && (projectRoles as readonly string[]).includes(value);
}

/** Where each role lands inside a project. */
export function roleHomePath(projectId: string, role: ProjectRole): string {
  return role === "vendor" ? `/projects/${projectId}/requests` : `/projects/${projectId}`;
}

export const roleLabels: Record<ProjectRole, string> = {
  manager: "Manager",
  designer: "Designer",
  checker: "Checker",
  vendor: "Vendor",
  viewer: "Viewer",
};
