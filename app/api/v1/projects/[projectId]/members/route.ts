import { inviteMemberSchema } from "@/modules/platform/account-schemas";
import { listMembers } from "@/db/queries/projects";
import { defineRoute } from "../../../../../_lib/route";
import { inviteMember } from "../../../../../_lib/accounts-service";

export const dynamic = "force-dynamic";

const inviteBodySchema = inviteMemberSchema.transform((v) => v);

export const GET = defineRoute({
  access: { kind: "project", permission: "members.read" },
  projectId: (p: { projectId: string }) => p.projectId,
  handler: async ({ auth, params }) => ({ members: await listMembers(auth!.actor, params.projectId) }),
});

export const POST = defineRoute({
  access: { kind: "project", permission: "members.manage" },
  projectId: (p: { projectId: string }) => p.projectId,
  body: inviteBodySchema,
  status: 201,
  handler: async ({ auth, params }, body) => inviteMember(auth!.actor, { ...body, projectId: params.projectId }),
});
