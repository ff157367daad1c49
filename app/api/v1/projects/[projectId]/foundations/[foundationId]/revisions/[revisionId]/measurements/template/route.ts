import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { buildMeasurementTemplate } from "@/modules/commissioning/readings";
import { knownPointsOf } from "@/modules/commissioning/response";
import { XLSX_MIME } from "@/modules/vendor-data/intake";
import { getProjectForMember } from "@/db/queries/projects";
import { requireCommissioningScope } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/commissioning/commissioning-service";
import { idOf, type RevisionParams } from "../../../revision-params";

export const dynamic = "force-dynamic";

// The site measurement template of this revision (.xlsx): a row per bearing and direction of the
// revision's model, r.m.s. velocity in the project's units, and an empty run-up sheet.
export const GET = defineRoute<RevisionParams, undefined, unknown>({
  access: { kind: "project", permission: "measurement.create" },
  projectId: (p) => p.projectId,
  handler: async ({ auth, params }) => {
    const actor = auth!.actor;
    const scope = await requireCommissioningScope(actor, params.projectId, idOf(params.foundationId, "foundation"), idOf(params.revisionId, "revision"), "measurement.create");
    const project = await getProjectForMember(actor, params.projectId);
    if (!project) throw new AppError("not_found");
    const input = scope.revision.input;
    const bytes = await buildMeasurementTemplate({
      projectCode: project.code,
      foundationTag: scope.foundation.tag,
      revisionLabel: scope.revision.label,
      speedRpm: input.machines[0]?.rotors[0]?.speedRpm ?? null,
      units: project.units,
      points: knownPointsOf(input),
    });
    const name = `${project.code}_${scope.foundation.tag}_rev-${scope.revision.label}_site-measurements.xlsx`.replace(/[^A-Za-z0-9._-]/g, "_");
    return new Response(new Uint8Array(bytes), {
      headers: { "content-type": XLSX_MIME, "content-disposition": `attachment; filename="${name}"`, "cache-control": "private, no-store" },
    });
  },
});
