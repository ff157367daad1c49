import { defineRoute } from "@/app/_lib/route";
import { listVendorRequests } from "@/db/queries/vendor-requests";

// The data requests the caller may see: a vendor only those addressed to their company.
export const GET = defineRoute<{ projectId: string }, undefined, unknown>({
  access: { kind: "project", permission: "vendorRequest.readOwn" },
  projectId: (p) => p.projectId,
  handler: async ({ auth, params }) => ({ requests: await listVendorRequests(auth!.actor, params.projectId) }),
});
