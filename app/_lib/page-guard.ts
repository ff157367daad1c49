import "server-only";
import { cache } from "react";
import { notFound, redirect } from "next/navigation";
import { roleAllows, type ProjectPermission, type ProjectRole } from "@/modules/platform/permissions";
import { getProjectForMember, type Actor } from "@/db/queries/projects";
import type { PublicUser } from "@/db/queries/accounts";
import type { ProjectRow } from "@/db/schema";
import { getRequestPort } from "./next-port";
import { getUserFromPort } from "./session";

// Once per request each (React's cache lives for one server render): the session cookie is
// unsealed and its row read once, and the membership row once, however many layouts and
// pages of the request ask.
const loadUser = cache(async (): Promise<PublicUser | undefined> => getUserFromPort(await getRequestPort()));
const loadMembership = cache(async (userId: string, isAdmin: boolean, projectId: string) => getProjectForMember({ userId, isAdmin }, projectId));

/** The project with the caller's role on it, or undefined when not a member (read once per request). */
export async function getMemberProject(actor: Actor, projectId: string): Promise<Awaited<ReturnType<typeof getProjectForMember>>> {
  if (!/^[0-9a-f-]{36}$/i.test(projectId)) return undefined;
  return loadMembership(actor.userId, actor.isAdmin, projectId);
}

/** The signed-in user for a page; redirects to sign-in unless `optional`. */
export async function getPageUser(opts: { optional: true }): Promise<PublicUser | undefined>;
export async function getPageUser(opts?: { optional?: false }): Promise<PublicUser>;
export async function getPageUser(opts?: { optional?: boolean }): Promise<PublicUser | undefined> {
  const user = await loadUser();
  if (!user && !opts?.optional) redirect("/sign-in");
  return user;
}

export function actorOf(user: PublicUser): Actor {
  return { userId: user.id, isAdmin: user.isAdmin };
}

/** A project page the caller's role allows, or the not-found page (never the data). */
export async function requireProjectPage(
  projectId: string,
  permission: ProjectPermission,
): Promise<{ user: PublicUser; actor: Actor; project: ProjectRow; role: ProjectRole }> {
  const user = await getPageUser();
  if (!/^[0-9a-f-]{36}$/i.test(projectId)) notFound();
  const actor = actorOf(user);
  const project = await getMemberProject(actor, projectId);
  if (!project || !roleAllows(project.role, permission)) notFound();
  const { role, ...row } = project;
  return { user, actor, project: row, role };
}

export async function requireAdminPage(): Promise<PublicUser> {
  const user = await getPageUser();
  if (!user.isAdmin) notFound();
  return user;
}
