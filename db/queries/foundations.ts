import { and, asc, eq, isNotNull, isNull } from "drizzle-orm";
import { AppError } from "@/modules/platform/errors";
import { roleAllows } from "@/modules/platform/permissions";
import { getDb } from "../client";
import { foundations, projectMembers, type FoundationRow } from "../schema";
import { recordAuditEvent } from "./audit";
import type { Actor } from "./projects";

/**
 * One foundation, only when it belongs to that project and the actor is a member of it:
 * a foundation id from another project answers undefined, like one that does not exist.
 * A withdrawn foundation is there for the project's managers only.
 */
export async function getFoundation(actor: Actor, projectId: string, foundationId: string): Promise<FoundationRow | undefined> {
  const rows = await getDb()
    .select({ foundation: foundations, role: projectMembers.role })
    .from(foundations)
    .innerJoin(projectMembers, and(eq(projectMembers.projectId, foundations.projectId), eq(projectMembers.userId, actor.userId)))
    .where(and(eq(foundations.id, foundationId), eq(foundations.projectId, projectId)))
    .limit(1);
  const row = rows[0];
  if (!row) return undefined;
  if (row.foundation.withdrawnAt && !roleAllows(row.role, "foundation.withdraw")) return undefined;
  return row.foundation;
}

/** Refuses a change to a withdrawn foundation: it is kept as it was until a manager restores it. */
export function assertFoundationActive(foundation: Pick<FoundationRow, "tag" | "withdrawnAt">): void {
  if (foundation.withdrawnAt) throw new AppError("conflict", `${foundation.tag} is withdrawn: a manager restores it before anything on it changes.`);
}

/** Withdrawn foundations of the project, for its managers (others get an empty list). */
export async function listWithdrawnFoundations(actor: Actor, projectId: string): Promise<FoundationRow[]> {
  const rows = await getDb()
    .select({ foundation: foundations, role: projectMembers.role })
    .from(foundations)
    .innerJoin(projectMembers, and(eq(projectMembers.projectId, foundations.projectId), eq(projectMembers.userId, actor.userId)))
    .where(and(eq(foundations.projectId, projectId), isNotNull(foundations.withdrawnAt)))
    .orderBy(asc(foundations.tag));
  return rows.filter((r) => roleAllows(r.role, "foundation.withdraw")).map((r) => r.foundation);
}

/** Withdraws (true) or restores (false) a foundation; records who, when and why in the audit log. */
export async function setFoundationWithdrawn(actor: Actor, projectId: string, foundationId: string, change: { withdrawn: boolean; reason: string }): Promise<FoundationRow> {
  const foundation = await getFoundation(actor, projectId, foundationId);
  if (!foundation) throw new AppError("not_found", "That foundation is not in this project.");
  if (Boolean(foundation.withdrawnAt) === change.withdrawn) {
    throw new AppError("conflict", change.withdrawn ? `${foundation.tag} is already withdrawn.` : `${foundation.tag} is not withdrawn.`);
  }
  const [row] = await getDb()
    .update(foundations)
    .set(
      change.withdrawn
        ? { withdrawnAt: new Date(), withdrawnById: actor.userId, withdrawalReason: change.reason, updatedAt: new Date() }
        : { withdrawnAt: null, withdrawnById: null, withdrawalReason: "", updatedAt: new Date() },
    )
    .where(and(eq(foundations.id, foundation.id), change.withdrawn ? isNull(foundations.withdrawnAt) : isNotNull(foundations.withdrawnAt)))
    .returning();
  if (!row) throw new AppError("conflict");
  await recordAuditEvent({
    projectId,
    actorId: actor.userId,
    action: change.withdrawn ? "foundation.withdrawn" : "foundation.restored",
    detail: { foundationId: row.id, tag: row.tag, ...(change.withdrawn ? { reason: change.reason } : {}) },
  });
  return row;
}
