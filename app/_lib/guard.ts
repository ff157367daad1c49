import { AppError } from "@/modules/platform/errors";
import { roleAllows, type ProjectPermission } from "@/modules/platform/permissions";
import { getMembership, type Actor, type Membership } from "@/db/queries/projects";
import type { PublicUser } from "@/db/queries/accounts";
import { getUserFromPort } from "./session";
import type { RequestPort } from "./request-context";

export interface AuthContext {
  user: PublicUser;
  actor: Actor;
  port: RequestPort;
}

export type Access =
  | { kind: "public" }
  | { kind: "signedIn" }
  | { kind: "admin" }
  | { kind: "project"; permission: ProjectPermission };

/** Throws AppError('unauthenticated') when nobody is signed in. */
export async function requireUser(port: RequestPort): Promise<AuthContext> {
  const user = await getUserFromPort(port);
  if (!user) throw new AppError("unauthenticated");
  return { user, actor: { userId: user.id, isAdmin: user.isAdmin }, port };
}

export function requireAdmin(ctx: AuthContext): void {
  if (!ctx.user.isAdmin) throw new AppError("forbidden");
}

/**
 * The single project guard: the caller must be a member of the project with a
 * role the permission map allows. Non-members and members without the role get
 * the same 'forbidden', so IDs of other projects reveal nothing.
 */
export async function requireProjectPermission(ctx: AuthContext, projectId: string, permission: ProjectPermission): Promise<Membership> {
  const membership = await getMembership(ctx.actor, projectId);
  if (!membership || !roleAllows(membership.role, permission)) throw new AppError("forbidden");
  return membership;
}
