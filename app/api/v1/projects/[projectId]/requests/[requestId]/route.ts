import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { getVendorRequest } from "@/db/queries/vendor-requests";
import { requireUuid, type RequestParams } from "../request-params";

// One request with its versions, reviews and drawings; another company's request is a 404.
export const GET = defineRoute<RequestParams, undefined, unknown>({
  access: { kind: "project", permission: "vendorRequest.readOwn" },
  projectId: (p) => p.projectId,
  handler: async ({ auth, params }) => {
    const request = await getVendorRequest(auth!.actor, params.projectId, requireUuid(params.requestId));
    if (!request) throw new AppError("not_found");
    return { request };
  },
});
