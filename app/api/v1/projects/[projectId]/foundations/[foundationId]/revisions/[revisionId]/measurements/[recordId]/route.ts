import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { getMeasurementRecord } from "@/db/queries/commissioning";
import { requireCommissioningScope } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/commissioning/commissioning-service";
import { idOf, type RevisionParams } from "../../../revision-params";

export const dynamic = "force-dynamic";

// One site measurement record with its parsed readings or trace, verdicts and (for readers of
// the design side) calibration.
export const GET = defineRoute<RevisionParams & { recordId: string }, undefined, unknown>({
  access: { kind: "project", permission: "measurement.read" },
  projectId: (p) => p.projectId,
  handler: async ({ auth, params }) => {
    const scope = await requireCommissioningScope(auth!.actor, params.projectId, idOf(params.foundationId, "foundation"), idOf(params.revisionId, "revision"), "measurement.read");
    const record = await getMeasurementRecord(scope, params.recordId);
    if (!record) throw new AppError("not_found", "No such measurement record on this revision.");
    return { record };
  },
});
