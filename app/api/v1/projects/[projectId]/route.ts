import { AppError } from "@/modules/platform/errors";
import { getProjectForMember } from "@/db/queries/projects";
import { defineRoute } from "../../../../_lib/route";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "project", permission: "project.read" },
  projectId: (p: { projectId: string }) => p.projectId,
  handler: async ({ auth, params }) => {
    const project = await getProjectForMember(auth!.actor, params.projectId);
    if (!project) throw new AppError("not_found");
    return { project };
  },
});
