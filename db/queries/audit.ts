import { getDb } from "../client";
import { auditEvents } from "../schema";

export async function recordAuditEvent(input: { projectId?: string | null; actorId?: string | null; action: string; detail?: Record<string, unknown> }): Promise<void> {
  await getDb()
    .insert(auditEvents)
    .values({ projectId: input.projectId ?? null, actorId: input.actorId ?? null, action: input.action, detail: input.detail ?? {} });
}
