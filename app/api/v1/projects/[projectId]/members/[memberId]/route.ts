import { AppError } from "@/modules/platform/errors";
import { removeMember } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { defineRoute } from "../../../../../../_lib/route";

export const dynamic = "force-dynamic";

export const DELETE = defineRoute({
  access: { kind: "project", permission: "members.manage" },
  projectId: (p: { projectId: string; memberId: string }) => p.projectId,
  handler: async ({ auth, params }) => {
    // removeMember applies the last-manager rule (the same one as a role change by re-invitation).
    const member = /^[0-9a-f-]{36}$/i.test(params.memberId) ? await removeMember(params.projectId, params.memberId) : undefined;
    if (!member) throw new AppError("not_found", "That member is not on this project.");
    await recordAuditEvent({ projectId: params.projectId, actorId: auth!.user.id, action: "member.removed", detail: { userId: member.userId } });
    return { removed: params.memberId };
  },
});
