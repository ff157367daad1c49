import "server-only";
// Adding a site measurement record: the file's safeguards, the evaluation against the approved
// revision (on the analysis pool: calibration runs the engine many times), the one transaction
// that stores it, and the soil-flag mail. The API route and the page share this.
import { AppError } from "@/modules/platform/errors";
import { formatBytes } from "@/modules/vendor-data/intake";
import { formatRef } from "@/modules/vendor-data/types";
import { measurementFieldsSchema, type MeasurementFields } from "@/modules/desk/measurement-form";
import { soilFlagText } from "@/modules/desk/measurement-format";
import { formatIssuePath } from "@/modules/platform/errors";
import { recordAuditEvent } from "@/db/queries/audit";
import { createMeasurementRecord, getCommissioningScope, type CommissioningScope, type CreatedMeasurement } from "@/db/queries/commissioning";
import { getProjectForMember, type Actor } from "@/db/queries/projects";
import { listMemberEmailsByRole } from "@/db/queries/revisions";
import { appUrl, sendEmail } from "@/app/_lib/mailer";
import { evaluateInPool } from "@/app/_lib/analysis-pool";
import { MAX_MEASUREMENT_BYTES, readMeasurementUpload } from "@/modules/desk/measurement-intake";
import { knownPointsOf } from "@/modules/commissioning/response";

export function commissioningPath(projectId: string, foundationId: string, revisionId: string, recordId?: string): string {
  const base = `/projects/${projectId}/foundations/${foundationId}/revisions/${revisionId}/commissioning`;
  return recordId ? `${base}/${recordId}` : base;
}

/** The scope, or 404 exactly as for a revision that does not exist (another company learns nothing). */
export async function requireCommissioningScope(actor: Actor, projectId: string, foundationId: string, revisionId: string, permission: "measurement.read" | "measurement.create"): Promise<CommissioningScope> {
  const scope = await getCommissioningScope(actor, projectId, foundationId, revisionId, permission);
  if (!scope) throw new AppError("not_found", "That revision is not on this foundation.");
  return scope;
}

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** For pages: the read scope, or undefined (the page answers not-found). */
export async function requireCommissioningScopeForPage(actor: Actor, projectId: string, foundationId: string, revisionId: string): Promise<CommissioningScope | undefined> {
  if (!uuid.test(foundationId) || !uuid.test(revisionId)) return undefined;
  return getCommissioningScope(actor, projectId, foundationId, revisionId, "measurement.read");
}

/** The record's fields from the multipart text fields, or 400 naming each field. */
export function parseMeasurementFields(fields: Record<string, string>): MeasurementFields {
  const parsed = measurementFieldsSchema.safeParse(fields);
  if (!parsed.success) {
    throw new AppError(
      "invalid_input",
      "Some fields of the record are missing or wrong; nothing was stored.",
      parsed.error.issues.map((i) => ({ path: formatIssuePath(i.path), message: i.message })),
    );
  }
  return parsed.data;
}

export { MAX_MEASUREMENT_BYTES };

/**
 * Checks the file (size, zip bomb, content type, cells, formulas), evaluates it against the
 * revision and stores the record. Any problem rejects the whole file and stores nothing.
 */
export async function addMeasurementRecord(
  actor: Actor,
  scope: CommissioningScope,
  fields: MeasurementFields,
  file: { fileName: string; bytes: Buffer },
): Promise<CreatedMeasurement> {
  const projectId = scope.membership.projectId;
  // The file may name only the revision's own bearings and check points (a typo is a cell error, not a reading without prediction).
  const intake = await readMeasurementUpload(file.bytes, fields.kind, knownPointsOf(scope.revision.input));
  if (!intake.ok) {
    await recordAuditEvent({ projectId, actorId: actor.userId, action: "measurement-upload.refused", detail: { foundationId: scope.foundation.id, revisionId: scope.revision.id, reason: intake.reason, problems: intake.problems.length } });
    if (intake.reason === "too_large") throw new AppError("payload_too_large", intake.problems[0]?.message ?? `A measurement file may be at most ${formatBytes(MAX_MEASUREMENT_BYTES)}.`);
    const issues = intake.problems.map((p) => ({ path: formatRef(p), sheet: p.sheet, cell: p.cell, message: p.message }));
    const count = issues.length;
    throw new AppError(
      "invalid_input",
      intake.reason === "wrong_type" ? (intake.problems[0]?.message ?? "The file type is not accepted.") : `The file has ${count} problem${count === 1 ? "" : "s"}; nothing was stored. Correct ${count === 1 ? "it" : "them"} and upload again.`,
      issues,
    );
  }
  const evaluation = await evaluateInPool({ input: scope.revision.input, result: scope.revision.result, speedRpm: fields.speedRpm, readings: intake.readings, trace: intake.trace, ...(fields.machineGroup ? { machineGroup: fields.machineGroup } : {}) });
  const created = await createMeasurementRecord(actor, scope, {
    ...fields,
    file: { fileName: file.fileName, contentType: intake.contentType, bytes: file.bytes },
    readings: intake.readings,
    trace: intake.trace,
    verdicts: evaluation.verdicts,
    calibration: evaluation.calibration,
    engineVersion: evaluation.engineVersion,
    soilFlag: evaluation.soilFlag === undefined ? undefined : evaluation.soilFlag && { ...evaluation.soilFlag, revisionId: scope.revision.id, revisionLabel: scope.revision.label },
  });
  if (created.flagRaised) await mailSoilFlag(actor, scope, created);
  return created;
}

/** The designers and checkers of the project hear of a fitted G outside the band (the mail queue). */
async function mailSoilFlag(actor: Actor, scope: CommissioningScope, created: CreatedMeasurement): Promise<void> {
  const flag = created.flagRaised;
  if (!flag) return;
  const projectId = scope.membership.projectId;
  const project = await getProjectForMember(actor, projectId);
  const units = project?.units ?? "si";
  const recipients = await listMemberEmailsByRole(projectId, ["designer", "checker"]);
  const seen = new Set<string>();
  const link = appUrl(commissioningPath(projectId, scope.foundation.id, scope.revision.id, created.record.id));
  for (const r of recipients) {
    if (seen.has(r.email)) continue;
    seen.add(r.email);
    await sendEmail({
      to: r.email,
      subject: `[Plinthwise] ${scope.foundation.tag}: site-measured soil outside the design band`,
      text:
        `A site measurement of ${scope.foundation.tag} (${created.record.measuredOn}, by ${created.record.measuredBy}) against revision ${scope.revision.label} ` +
        `fits a soil shear modulus outside the design's soil band: ${soilFlagText(flag, units)}.\n\n` +
        `The foundation is flagged on the project table until a later record fits inside the band. Review the record: ${link}\n\n` +
        `File SHA-256: ${created.record.sha256}\nEngine version: ${created.record.engineVersion}\n`,
    });
  }
}
