import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { MAX_DATA_BYTES } from "@/modules/vendor-data/layout";
import { readMachineDataUpload } from "@/modules/vendor-data/intake";
import { formatRef } from "@/modules/vendor-data/types";
import { recordAuditEvent } from "@/db/queries/audit";
import { getRequestScope, type RequestedMachine } from "@/db/queries/vendor-requests";
import { submitMachineData } from "@/app/(desk)/projects/[projectId]/requests/vendor-service";
import { readUploadedFile } from "../../upload-body";
import { requireUuid, type RequestParams } from "../../request-params";

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Upload of the filled workbook or a CSV (multipart field `file`; optional `drawingIds`,
 * comma-separated, and `note`). Any problem rejects the whole file and stores nothing;
 * the answer lists each problem with its sheet and cell. Accepted: a new version, 201.
 */
export const POST = defineRoute<RequestParams, undefined, unknown>({
  access: { kind: "project", permission: "vendorRequest.answer" },
  projectId: (p) => p.projectId,
  status: 201,
  handler: async ({ auth, params, request }) => {
    const actor = auth!.actor;
    // Ownership before the body is read: another company's request is a 404, unread.
    const scope = await getRequestScope(actor, params.projectId, requireUuid(params.requestId), "vendorRequest.answer");
    if (!scope) throw new AppError("not_found");
    const upload = await readUploadedFile(request, MAX_DATA_BYTES, "machine data file");
    const machines = scope.request.machines as RequestedMachine[];
    const intake = await readMachineDataUpload(upload.bytes, { requestId: scope.request.id, machineCount: machines.length });
    if (!intake.ok) {
      await recordAuditEvent({ projectId: params.projectId, actorId: actor.userId, action: "vendor-upload.refused", detail: { requestId: scope.request.id, reason: intake.reason, problems: intake.problems.length } });
      const issues = intake.problems.map((p) => ({ path: formatRef(p), sheet: p.sheet, cell: p.cell, message: p.message }));
      if (intake.reason === "too_large") throw new AppError("payload_too_large", intake.problems[0]?.message);
      const count = issues.length;
      throw new AppError(
        "invalid_input",
        intake.reason === "wrong_type" ? (intake.problems[0]?.message ?? "The file type is not accepted.") : `The file has ${count} problem${count === 1 ? "" : "s"}; nothing was stored. Correct ${count === 1 ? "it" : "them"} and upload again.`,
        issues,
      );
    }
    const drawingIds = (upload.fields.drawingIds ?? "").split(",").map((s) => s.trim()).filter(Boolean);
    if (drawingIds.some((id) => !uuid.test(id))) throw new AppError("invalid_input", undefined, [{ path: "drawingIds", message: "must be drawing ids" }]);
    const saved = await submitMachineData(actor, params.projectId, scope.request.id, {
      source: intake.source,
      machines: intake.machines,
      frame: intake.terms.frame,
      rampTimes: intake.rampTimes,
      file: { fileName: upload.fileName, contentType: intake.contentType, bytes: upload.bytes },
      drawingIds,
      note: (upload.fields.note ?? "").slice(0, 2000),
    });
    return { submission: saved, machines: intake.machines, frame: intake.terms.frame, formatVersion: intake.terms.formatVersion, rampTimes: intake.rampTimes };
  },
});
