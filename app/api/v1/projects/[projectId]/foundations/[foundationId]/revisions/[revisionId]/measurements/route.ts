import { defineRoute } from "@/app/_lib/route";
import { listMeasurementRecords } from "@/db/queries/commissioning";
import {
  addMeasurementRecord,
  MAX_MEASUREMENT_BYTES,
  parseMeasurementFields,
  requireCommissioningScope,
} from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/commissioning/commissioning-service";
import { readUploadedFile } from "../../../../../requests/upload-body";
import { idOf, type RevisionParams } from "../../revision-params";

export const dynamic = "force-dynamic";

// Site measurement records of an approved revision (commissioning). GET lists the records the
// caller may see (a vendor: its own company's, readings and verdicts without the design side);
// POST adds one: multipart with the file in `file` and the fields measuredOn, measuredBy,
// instrument, instrumentCalibratedOn, speedRpm, load, kind ("readings" | "run-up"), note and
// supersedesId (the record it corrects). 201 with the record; nothing is stored on any problem.
export const GET = defineRoute<RevisionParams, undefined, unknown>({
  access: { kind: "project", permission: "measurement.read" },
  projectId: (p) => p.projectId,
  handler: async ({ auth, params }) => {
    const scope = await requireCommissioningScope(auth!.actor, params.projectId, idOf(params.foundationId, "foundation"), idOf(params.revisionId, "revision"), "measurement.read");
    return { revision: { id: scope.revision.id, label: scope.revision.label, approved: scope.revision.approvedAt !== null, ofRecord: scope.revision.ofRecord }, records: await listMeasurementRecords(scope) };
  },
});

export const POST = defineRoute<RevisionParams, undefined, unknown>({
  access: { kind: "project", permission: "measurement.create" },
  projectId: (p) => p.projectId,
  status: 201,
  handler: async ({ auth, params, request }) => {
    const actor = auth!.actor;
    // Scope before the body is read: another company's foundation is a 404, unread.
    const scope = await requireCommissioningScope(actor, params.projectId, idOf(params.foundationId, "foundation"), idOf(params.revisionId, "revision"), "measurement.create");
    const upload = await readUploadedFile(request, MAX_MEASUREMENT_BYTES, "measurement file");
    const fields = parseMeasurementFields(upload.fields);
    const created = await addMeasurementRecord(actor, scope, fields, { fileName: upload.fileName, bytes: upload.bytes });
    return { record: created.record, soilFlag: created.flagRaised };
  },
});
