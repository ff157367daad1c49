import { AppError } from "@/modules/platform/errors";
import { countManagers, deleteMember, getMemberById } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { defineRoute } from "../../../../../../_lib/route";

export const dynamic = "force-dynamic";

export const DELETE = defineRoute({
  access: { kind: "project", permission: "members.manage" },
  projectId: (p: { projectId: string; memberId: string }) => p.projectId,
  handler: async ({ auth, params }) => {
    const member = /^[0-9a-f-]{36}$/i.test(params.memberId) ? await getMemberById(params.projectId, params.memberId) : undefined;
    if (!member) throw new AppError("not_found", "That member is not on this project.");
    if (member.role === "manager" && (await countManagers(params.projectId)) <= 1) throw new AppError("conflict", "A project keeps at least one manager.");
    await deleteMember(params.projectId, params.memberId);
    await recordAuditEvent({ projectId: params.projectId, actorId: auth!.user.id, action: "member.removed", detail: { userId: member.userId } });
    return { removed: params.memberId };
  },
});
