import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { buildMachineCsv } from "@/modules/vendor-data/csv";
import { getProjectForMember } from "@/db/queries/projects";
import { getVendorRequest } from "@/db/queries/vendor-requests";
import { prefillMachines } from "@/app/(desk)/projects/[projectId]/requests/vendor-service";
import { requireUuid, type RequestParams } from "../../request-params";

// The CSV alternative to the workbook: its header and the newest figures, one line per rotor.
export const GET = defineRoute<RequestParams, undefined, unknown>({
  access: { kind: "project", permission: "vendorRequest.readOwn" },
  projectId: (p) => p.projectId,
  handler: async ({ auth, params }) => {
    const request = await getVendorRequest(auth!.actor, params.projectId, requireUuid(params.requestId));
    const project = await getProjectForMember(auth!.actor, params.projectId);
    if (!request || !project) throw new AppError("not_found");
    const csv = buildMachineCsv(prefillMachines(request));
    const name = `${project.code}_${request.foundationTag}_machine-data.csv`.replace(/[^A-Za-z0-9._-]/g, "_");
    return new Response(csv, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}"`, "cache-control": "private, no-store" } });
  },
});
