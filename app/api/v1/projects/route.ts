import { AppError } from "@/modules/platform/errors";
import { createProjectSchema } from "@/modules/platform/account-schemas";
import { createProject, getProjectByCode, listProjectsForUser } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { defineRoute } from "../../../_lib/route";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "signedIn" },
  handler: async ({ auth }) => ({ projects: await listProjectsForUser(auth!.actor) }),
});

export const POST = defineRoute({
  access: { kind: "signedIn" },
  body: createProjectSchema,
  status: 201,
  handler: async ({ auth }, body) => {
    const user = auth!.user;
    if (!user.isAdmin && !user.mayCreateProjects) throw new AppError("forbidden", "Your account may not create projects.");
    if (await getProjectByCode(body.code)) throw new AppError("conflict", "A project with this code exists.", [{ path: "code", message: "Already used" }]);
    const project = await createProject(auth!.actor, body);
    await recordAuditEvent({ projectId: project.id, actorId: user.id, action: "project.created", detail: { code: project.code } });
    return { project };
  },
});
