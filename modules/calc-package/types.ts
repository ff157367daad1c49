// What the builders take: plain data the route handlers read from the database, so the
// builders stay pure (no next, react or db) and tests can feed them directly.
import type { AnalysisInput, AnalysisResult } from "@/modules/calc";
import type { RevisionPurpose, RevisionStatus } from "@/modules/revisions";
import type { UnitSystemKey } from "@/modules/units";

export interface PackageProject {
  code: string;
  name: string;
  client: string;
  site: string;
  units: UnitSystemKey;
  /** Paper of the printed package (projects.paper_size); A4 when absent. */
  paperSize?: PaperSize;
}

export type PaperSize = "a4" | "letter";

/** A review comment of the revision, with its resolution, for the trail sheet. */
export interface PackageComment {
  id: string;
  parentId: string | null;
  fieldPath: string | null;
  body: string;
  authorName: string;
  createdAt: Date;
  resolved: boolean;
  resolvedByName: string | null;
  resolvedAt: Date | null;
}

/** The vendor submission a revision used, named as a reader can find it. */
export interface PackageVendorSubmission {
  /** e.g. "request to Acme Pumps of 2026-03-02" */
  request: string;
  version: number;
  fileName: string | null;
  sha256: string;
  submittedAt: Date;
}

/** One line of the cover's sign-off block: who did what and when. */
export interface PackageSignOff {
  role: string;
  name: string;
  date: Date | null;
}

export interface PackageFoundation {
  tag: string;
  machineTrain: string;
  location: string;
}

export interface PackageRevisionSummary {
  label: string;
  sequence: number;
  status: RevisionStatus;
  /** What it was issued for; "issued for check" when absent. */
  purpose?: RevisionPurpose;
  issuedAt: Date;
  issuedByName: string;
  /** The first signature of a two-step sign-off. */
  check?: { note: string; checkedByName: string; checkedByRole: string; checkedAt: Date } | null;
  decision: { outcome: "returned" | "approved"; note: string; decidedByName: string; decidedByRole?: string | null; decidedAt: Date } | null;
  /** Null in the client's copy: review comments are the design team's. */
  openComments: number | null;
  inputHash: string;
  engineVersion: string;
  vendorSubmissionId: string | null;
  /** The designer's revision note (what changed and why); absent or '' on revisions issued before notes. */
  note?: string;
}

export interface PackageTrailEntry {
  action: string;
  actorName: string | null;
  label: string | null;
  createdAt: Date;
}

/** One reading of a site measurement as the package lists it (stored SI values). */
export interface PackageMeasurementReading {
  location: string;
  direction: string;
  /** "velocity" (mm/s, in/s) or "displacement" (um, mil): the kind of the design check it is compared with. */
  kind: "velocity" | "displacement" | "frequency";
  /** As measured, and the basis stated (rms, peak, peak-to-peak). */
  asMeasured: string;
  /** In the design check's basis (stored SI value) and that basis. */
  value: number;
  basis: string;
  predicted: number | null;
  ratio: number | null;
  limit: number | null;
  zone: string | null;
  verdict: string;
}

/** A site measurement record (commissioning) of the revision, for the package's sheet. */
export interface PackageMeasurement {
  measuredOn: string;
  measuredBy: string;
  instrument: string;
  instrumentCalibratedOn: string;
  speedRpm: number;
  load: string;
  kind: string;
  fileName: string;
  sha256: string;
  createdByName: string;
  correctedBy: boolean;
  verdict: string;
  readings: PackageMeasurementReading[];
  /** Measured resonance speeds (rpm) of a run-up trace. */
  resonancesRpm: number[];
  calibration: { fittedShearModulus: number; bandLower: number; bandUpper: number; position: string; atOperating: { label: string; kind: "frequency" | "velocity" | "displacement" | "ratio"; designed: number | null; fitted: number | null }[] } | null;
  engineVersion: string;
}

export interface RevisionPackageData {
  project: PackageProject;
  foundation: PackageFoundation;
  revision: PackageRevisionSummary;
  input: AnalysisInput;
  result: AnalysisResult;
  /** Every revision of the foundation, oldest first. */
  history: PackageRevisionSummary[];
  /** The foundation's revision events, newest first. */
  trail: PackageTrailEntry[];
  /** The revision's review comments and answers, oldest first. */
  comments?: PackageComment[];
  /** The revision's site measurement records, newest first (absent or empty: no sheet). */
  measurements?: PackageMeasurement[];
  /** The vendor submission the revision used (null: none; absent: not read). */
  vendorSubmission?: PackageVendorSubmission | null;
  generatedAt: Date;
  generatedByName: string;
  /**
   * The cover's sign-off block; when absent it is filled from what the revision records
   * (issuer, the checker's decision). A later two-step sign-off passes its own list.
   */
  signOffs?: PackageSignOff[];
  /** The status printed in every page header; from the revision's status when absent. */
  statusText?: string;
  /** The document number in every page header; from project code and foundation tag when absent. */
  documentNumber?: string;
}

export interface RegisterRow {
  tag: string;
  machineTrain: string;
  location: string;
  /** Draft state when no revision has been issued ("draft v3", "not started"). */
  draftState: string;
  latest: (PackageRevisionSummary & { result: AnalysisResult }) | null;
  /** The latest approved revision's label: it stays of record while a later one is in check or returned. */
  latestApproved?: { label: string; approvedAt: Date | null } | null;
  revisionCount: number;
  flags: string[];
  /** The latest site measurement (commissioning), uncorrected: its date, record verdict and fitted soil G (Pa). */
  site?: { measuredOn: string; revisionLabel: string; verdict: string; fittedShearModulus: number | null } | null;
}

export interface RegisterData {
  project: PackageProject;
  rows: RegisterRow[];
  generatedAt: Date;
  generatedByName: string;
}
