// Commissioning: site measurement records on an approved revision, and the soil flag they
// raise on the foundation. Records are only ever inserted (the table refuses UPDATE and
// DELETE): there is no update or delete query here on purpose.
import { and, desc, eq, inArray, isNull } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb } from "../client";
import {
  auditEvents,
  companies,
  foundations,
  measurementRecords,
  revisionDecisions,
  revisions,
  users,
  vendorRequests,
  type FoundationRow,
  type FoundationSoilFlag,
  type MeasurementRecordRow,
} from "../schema";
import type { AnalysisInput, AnalysisResult } from "@/modules/calc";
import { AppError } from "@/modules/platform/errors";
import { verdictsWithoutDesignSide } from "@/modules/desk/measurement-view";
import { roleAllows, type ProjectPermission } from "@/modules/platform/permissions";
import { storeFile } from "./files";
import { getMembership, type Actor, type Membership } from "./projects";

/** The approved revision a record is judged against, with what the design predicted. */
export interface CommissioningRevision {
  id: string;
  label: string;
  sequence: number;
  engineVersion: string;
  input: AnalysisInput;
  result: AnalysisResult;
  approvedAt: Date | null;
  /** Approved, and no later revision of the foundation approved since. */
  ofRecord: boolean;
}

export interface CommissioningScope {
  membership: Membership;
  foundation: FoundationRow;
  revision: CommissioningRevision;
  /**
   * The reader sees the design side (prediction, ratio, calibration, soil band): every role
   * that reads revisions. A vendor sees its readings and their verdicts against the limits only.
   */
  design: boolean;
  /** A vendor's company: its records only. Null for the design team and the client. */
  vendorCompanyId: string | null;
}

/**
 * The foundation and revision, when the actor's role has the permission and, for a vendor,
 * the foundation has a data request addressed to the vendor's own company. Undefined
 * otherwise, exactly as for a revision that does not exist (another company's foundation
 * reveals nothing). The revision need not be approved here: createMeasurementRecord refuses
 * one that is not, with its own message.
 */
export async function getCommissioningScope(actor: Actor, projectId: string, foundationId: string, revisionId: string, permission: ProjectPermission): Promise<CommissioningScope | undefined> {
  const membership = await getMembership(actor, projectId);
  if (!membership || !roleAllows(membership.role, permission)) return undefined;
  const db = getDb();
  const [foundation] = await db
    .select()
    .from(foundations)
    .where(and(eq(foundations.id, foundationId), eq(foundations.projectId, projectId)))
    .limit(1);
  if (!foundation) return undefined;
  if (foundation.withdrawnAt && !roleAllows(membership.role, "foundation.withdraw")) return undefined;
  let vendorCompanyId: string | null = null;
  if (membership.role === "vendor") {
    if (!membership.companyId) return undefined;
    const asked = await db
      .select({ id: vendorRequests.id })
      .from(vendorRequests)
      .where(and(eq(vendorRequests.foundationId, foundationId), eq(vendorRequests.projectId, projectId), eq(vendorRequests.companyId, membership.companyId)))
      .limit(1);
    if (!asked[0]) return undefined;
    vendorCompanyId = membership.companyId;
  }
  const rows = await db
    .select({ r: revisions, outcome: revisionDecisions.outcome, decidedAt: revisionDecisions.decidedAt })
    .from(revisions)
    .leftJoin(revisionDecisions, eq(revisionDecisions.revisionId, revisions.id))
    .where(and(eq(revisions.foundationId, foundationId), eq(revisions.projectId, projectId)));
  const row = rows.find((x) => x.r.id === revisionId);
  if (!row) return undefined;
  const laterApproved = rows.some((x) => x.outcome === "approved" && x.r.sequence > row.r.sequence);
  const approved = row.outcome === "approved";
  return {
    membership,
    foundation,
    vendorCompanyId,
    design: roleAllows(membership.role, "revision.read"),
    revision: {
      id: row.r.id,
      label: row.r.label,
      sequence: row.r.sequence,
      engineVersion: row.r.engineVersion,
      input: row.r.input as AnalysisInput,
      result: row.r.result as AnalysisResult,
      approvedAt: approved ? (row.decidedAt ?? null) : null,
      ofRecord: approved && !laterApproved,
    },
  };
}

/** Refuses a record on a revision that is not the foundation's approved one of record. */
export function assertRevisionOfRecord(scope: CommissioningScope): void {
  if (scope.revision.approvedAt === null) {
    throw new AppError("conflict", `Revision ${scope.revision.label} is not approved: measurements are recorded against an approved revision only.`);
  }
  if (!scope.revision.ofRecord) {
    throw new AppError("conflict", `Revision ${scope.revision.label} has been superseded by a later approved revision: record the measurement against that one.`);
  }
  if (scope.foundation.withdrawnAt) throw new AppError("conflict", `${scope.foundation.tag} is withdrawn: a manager restores it before anything on it changes.`);
}

export interface MeasurementSummary {
  id: string;
  revisionId: string;
  measuredOn: string;
  measuredBy: string;
  instrument: string;
  instrumentCalibratedOn: string;
  speedRpm: number;
  load: string;
  kind: MeasurementRecordRow["kind"];
  fileName: string;
  sha256: string;
  byteSize: number;
  supersedesId: string | null;
  /** The id of a later record that corrects this one, if any. */
  supersededById: string | null;
  companyName: string | null;
  createdByName: string;
  createdAt: Date;
  note: string;
  verdicts: unknown;
  /** Null for a reader without the design side (a vendor). */
  calibration: unknown;
  engineVersion: string;
}

export interface MeasurementDetail extends MeasurementSummary {
  readings: unknown;
  trace: unknown;
}

const creator = alias(users, "creator");

function visibleRecords(scope: CommissioningScope) {
  return and(
    eq(measurementRecords.revisionId, scope.revision.id),
    scope.vendorCompanyId ? eq(measurementRecords.companyId, scope.vendorCompanyId) : undefined,
  );
}

async function selectRecords(scope: CommissioningScope, recordId?: string): Promise<MeasurementDetail[]> {
  const db = getDb();
  const rows = await db
    .select({ m: measurementRecords, companyName: companies.name, createdByName: creator.name })
    .from(measurementRecords)
    .innerJoin(creator, eq(creator.id, measurementRecords.createdById))
    .leftJoin(companies, eq(companies.id, measurementRecords.companyId))
    .where(and(visibleRecords(scope), recordId ? eq(measurementRecords.id, recordId) : undefined))
    .orderBy(desc(measurementRecords.measuredOn), desc(measurementRecords.createdAt));
  const ids = rows.map((r) => r.m.id);
  const corrections = ids.length
    ? await db
        .select({ id: measurementRecords.id, supersedesId: measurementRecords.supersedesId })
        .from(measurementRecords)
        .where(and(visibleRecords(scope), inArray(measurementRecords.supersedesId, ids)))
        .orderBy(desc(measurementRecords.createdAt))
    : [];
  return rows.map(({ m, companyName, createdByName }) => ({
    id: m.id,
    revisionId: m.revisionId,
    measuredOn: m.measuredOn,
    measuredBy: m.measuredBy,
    instrument: m.instrument,
    instrumentCalibratedOn: m.instrumentCalibratedOn,
    speedRpm: m.speedRpm,
    load: m.load,
    kind: m.kind,
    fileName: m.fileName,
    sha256: m.sha256,
    byteSize: m.byteSize,
    supersedesId: m.supersedesId,
    supersededById: corrections.find((c) => c.supersedesId === m.id)?.id ?? null,
    companyName,
    createdByName,
    createdAt: m.createdAt,
    note: m.note,
    // a vendor reads its verdicts against the limits, not the design's prediction
    verdicts: scope.design ? m.verdicts : verdictsWithoutDesignSide(m.verdicts),
    calibration: scope.design ? m.calibration : null,
    engineVersion: m.engineVersion,
    readings: m.readings,
    trace: m.trace,
  }));
}

/** The revision's records the reader may see, newest measurement first (summaries). */
export async function listMeasurementRecords(scope: CommissioningScope): Promise<MeasurementSummary[]> {
  return (await selectRecords(scope)).map((d): MeasurementSummary => {
    // the parsed file stays out of a list; the record's own page reads it
    const summary: MeasurementSummary & Partial<Pick<MeasurementDetail, "readings" | "trace">> = { ...d };
    delete summary.readings;
    delete summary.trace;
    return summary;
  });
}

export async function getMeasurementRecord(scope: CommissioningScope, recordId: string): Promise<MeasurementDetail | undefined> {
  if (!/^[0-9a-f-]{36}$/i.test(recordId)) return undefined;
  return (await selectRecords(scope, recordId))[0];
}

export interface NewMeasurementRecord {
  measuredOn: string;
  measuredBy: string;
  instrument: string;
  instrumentCalibratedOn: string;
  speedRpm: number;
  load: string;
  note: string;
  kind: MeasurementRecordRow["kind"];
  supersedesId: string | null;
  file: { fileName: string; contentType: string; bytes: Buffer };
  readings: unknown;
  trace: unknown;
  verdicts: unknown;
  calibration: unknown;
  engineVersion: string;
  /**
   * The soil flag this record sets on the foundation: a flag when its fitted G is outside the
   * band, null when it is inside (a later record within the band clears an earlier flag),
   * undefined when the record has no calibration (the flag stays as it was).
   */
  soilFlag: Omit<FoundationSoilFlag, "recordId" | "raisedAt"> | null | undefined;
}

export interface CreatedMeasurement {
  record: MeasurementRecordRow;
  /** The flag was raised by this record (it was not raised before, or by an earlier record). */
  flagRaised: FoundationSoilFlag | null;
  flagCleared: boolean;
}

/**
 * Stores a record with its original file in one transaction (nothing half-written), on the
 * foundation's approved revision of record only; sets or clears the foundation's soil flag
 * under a lock on the foundation, and writes the audit entry.
 */
export async function createMeasurementRecord(actor: Actor, scope: CommissioningScope, input: NewMeasurementRecord): Promise<CreatedMeasurement> {
  assertRevisionOfRecord(scope);
  if (!roleAllows(scope.membership.role, "measurement.create")) throw new AppError("forbidden");
  const projectId = scope.membership.projectId;
  const result = await getDb().transaction(async (tx) => {
    const [locked] = await tx.select().from(foundations).where(eq(foundations.id, scope.foundation.id)).for("update");
    if (!locked) throw new AppError("not_found");
    if (input.supersedesId) {
      const [old] = await tx
        .select({ id: measurementRecords.id })
        .from(measurementRecords)
        .where(and(eq(measurementRecords.id, input.supersedesId), visibleRecords(scope)))
        .limit(1);
      if (!old) throw new AppError("invalid_input", "The record to correct is not one of this revision's records.", [{ path: "supersedesId", message: "unknown record" }]);
    }
    const file = await storeFile(tx, { projectId, requestId: null, purpose: "measurement", fileName: input.file.fileName, contentType: input.file.contentType, bytes: input.file.bytes, uploadedById: actor.userId });
    const [record] = await tx
      .insert(measurementRecords)
      .values({
        projectId,
        foundationId: scope.foundation.id,
        revisionId: scope.revision.id,
        companyId: scope.vendorCompanyId,
        measuredOn: input.measuredOn,
        measuredBy: input.measuredBy,
        instrument: input.instrument,
        instrumentCalibratedOn: input.instrumentCalibratedOn,
        speedRpm: input.speedRpm,
        load: input.load,
        kind: input.kind,
        fileId: file.id,
        fileName: file.fileName,
        sha256: file.sha256,
        byteSize: file.byteSize,
        readings: input.readings ?? [],
        trace: input.trace ?? null,
        verdicts: input.verdicts,
        calibration: input.calibration ?? null,
        engineVersion: input.engineVersion,
        supersedesId: input.supersedesId,
        note: input.note,
        createdById: actor.userId,
      })
      .returning();
    if (!record) throw new Error("measurement insert returned nothing");
    let flagRaised: FoundationSoilFlag | null = null;
    let flagCleared = false;
    if (input.soilFlag) {
      const flag: FoundationSoilFlag = { ...input.soilFlag, recordId: record.id, raisedAt: new Date().toISOString() };
      await tx.update(foundations).set({ soilFlag: flag, updatedAt: new Date() }).where(eq(foundations.id, locked.id));
      flagRaised = flag;
    } else if (input.soilFlag === null && locked.soilFlag) {
      await tx.update(foundations).set({ soilFlag: null, updatedAt: new Date() }).where(eq(foundations.id, locked.id));
      flagCleared = true;
    }
    // the audit entries in the same transaction: a stored record always has its entry, and a
    // failed write leaves neither
    const audit = (action: string, detail: Record<string, unknown>) => tx.insert(auditEvents).values({ projectId, actorId: actor.userId, action, detail });
    await audit("measurement.recorded", {
      foundationId: scope.foundation.id,
      revisionId: scope.revision.id,
      label: scope.revision.label,
      recordId: record.id,
      kind: record.kind,
      sha256: record.sha256,
      supersedesId: record.supersedesId,
    });
    if (flagRaised) {
      await audit("foundation.soil-flag-raised", { foundationId: scope.foundation.id, recordId: record.id, fittedShearModulus: flagRaised.fittedShearModulus, side: flagRaised.side });
    }
    if (flagCleared) await audit("foundation.soil-flag-cleared", { foundationId: scope.foundation.id, recordId: record.id });
    return { record, flagRaised, flagCleared };
  });
  return result;
}

/** Latest record (not corrected by a later one) per foundation of the project, for the register. */
export interface LatestMeasurement {
  foundationId: string;
  revisionLabel: string;
  measuredOn: string;
  verdicts: unknown;
  calibration: unknown;
}

/**
 * The newest uncorrected record of each foundation (design-team or register reader only:
 * the caller checks the permission). Vendors' and the team's records alike.
 */
export async function listLatestMeasurements(projectId: string): Promise<LatestMeasurement[]> {
  const corrector = alias(measurementRecords, "corrector");
  const rows = await getDb()
    .select({ m: measurementRecords, label: revisions.label })
    .from(measurementRecords)
    .innerJoin(revisions, eq(revisions.id, measurementRecords.revisionId))
    .leftJoin(corrector, eq(corrector.supersedesId, measurementRecords.id))
    .where(and(eq(measurementRecords.projectId, projectId), isNull(corrector.id)))
    .orderBy(desc(measurementRecords.measuredOn), desc(measurementRecords.createdAt));
  const seen = new Set<string>();
  const out: LatestMeasurement[] = [];
  for (const { m, label } of rows) {
    if (seen.has(m.foundationId)) continue;
    seen.add(m.foundationId);
    out.push({ foundationId: m.foundationId, revisionLabel: label, measuredOn: m.measuredOn, verdicts: m.verdicts, calibration: m.calibration });
  }
  return out;
}

/** Every record of a revision, for its calculation package (the package's reader is already checked). */
export async function listRevisionMeasurementsForPackage(revisionId: string): Promise<MeasurementDetail[]> {
  const rows = await getDb()
    .select({ m: measurementRecords, companyName: companies.name, createdByName: creator.name })
    .from(measurementRecords)
    .innerJoin(creator, eq(creator.id, measurementRecords.createdById))
    .leftJoin(companies, eq(companies.id, measurementRecords.companyId))
    .where(eq(measurementRecords.revisionId, revisionId))
    .orderBy(desc(measurementRecords.measuredOn), desc(measurementRecords.createdAt));
  const correctedBy = new Map(rows.filter((r) => r.m.supersedesId).map((r) => [r.m.supersedesId as string, r.m.id]));
  return rows.map(({ m, companyName, createdByName }) => ({
    ...m,
    supersededById: correctedBy.get(m.id) ?? null,
    companyName,
    createdByName,
  }));
}

/**
 * The foundation's approved revision of record (the latest approved), for a link to its site
 * measurements. The caller has already checked that the actor may see the foundation
 * (a vendor: through its company's data request).
 */
export async function getRevisionOfRecordRef(projectId: string, foundationId: string): Promise<{ id: string; label: string } | undefined> {
  const rows = await getDb()
    .select({ id: revisions.id, label: revisions.label })
    .from(revisions)
    .innerJoin(revisionDecisions, eq(revisionDecisions.revisionId, revisions.id))
    .where(and(eq(revisions.projectId, projectId), eq(revisions.foundationId, foundationId), eq(revisionDecisions.outcome, "approved")))
    .orderBy(desc(revisions.sequence))
    .limit(1);
  return rows[0];
}
