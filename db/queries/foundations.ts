import { and, eq } from "drizzle-orm";
import { getDb } from "../client";
import { foundations, projectMembers, type FoundationRow } from "../schema";
import type { Actor } from "./projects";

/**
 * One foundation, only when it belongs to that project and the actor is a member of it:
 * a foundation id from another project answers undefined, like one that does not exist.
 */
export async function getFoundation(actor: Actor, projectId: string, foundationId: string): Promise<FoundationRow | undefined> {
  const rows = await getDb()
    .select({ foundation: foundations })
    .from(foundations)
    .innerJoin(projectMembers, and(eq(projectMembers.projectId, foundations.projectId), eq(projectMembers.userId, actor.userId)))
    .where(and(eq(foundations.id, foundationId), eq(foundations.projectId, projectId)))
    .limit(1);
  return rows[0]?.foundation;
}
