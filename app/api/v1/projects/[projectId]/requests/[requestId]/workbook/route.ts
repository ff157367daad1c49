import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { buildRequestWorkbook } from "@/modules/vendor-data/workbook-build";
import { XLSX_MIME } from "@/modules/vendor-data/intake";
import { getProjectForMember } from "@/db/queries/projects";
import { getVendorRequest } from "@/db/queries/vendor-requests";
import { prefillMachines } from "@/app/(desk)/projects/[projectId]/requests/vendor-service";
import { requireUuid, type RequestParams } from "../../request-params";

// The machine data workbook generated for this request, prefilled with the newest figures.
export const GET = defineRoute<RequestParams, undefined, unknown>({
  access: { kind: "project", permission: "vendorRequest.readOwn" },
  projectId: (p) => p.projectId,
  handler: async ({ auth, params }) => {
    const request = await getVendorRequest(auth!.actor, params.projectId, requireUuid(params.requestId));
    const project = await getProjectForMember(auth!.actor, params.projectId);
    if (!request || !project) throw new AppError("not_found");
    const bytes = await buildRequestWorkbook({
      requestId: request.id,
      projectCode: project.code,
      projectName: project.name,
      foundationTag: request.foundationTag,
      machineTrain: request.machineTrain,
      companyName: request.companyName,
      dueOn: request.dueOn,
      message: request.message,
      machines: prefillMachines(request),
    });
    const name = `${project.code}_${request.foundationTag}_machine-data.xlsx`.replace(/[^A-Za-z0-9._-]/g, "_");
    return new Response(new Uint8Array(bytes), {
      headers: { "content-type": XLSX_MIME, "content-disposition": `attachment; filename="${name}"`, "cache-control": "private, no-store" },
    });
  },
});
