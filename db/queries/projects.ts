import { and, asc, eq, isNull } from "drizzle-orm";
import { getDb } from "../client";
import { companies, foundations, projectMembers, projects, users, type FoundationRow, type ProjectMemberRow, type ProjectRow } from "../schema";
import { AppError } from "@/modules/platform/errors";
import type { ProjectRole } from "@/modules/platform/permissions";

/** Who is asking: every query that reads project data takes this. */
export interface Actor {
  userId: string;
  isAdmin: boolean;
}

export interface Membership {
  memberId: string;
  projectId: string;
  role: ProjectRole;
  companyId: string | null;
}

export async function getMembership(actor: Actor, projectId: string): Promise<Membership | undefined> {
  const rows = await getDb()
    .select({ memberId: projectMembers.id, projectId: projectMembers.projectId, role: projectMembers.role, companyId: projectMembers.companyId })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, actor.userId)))
    .limit(1);
  return rows[0];
}

export interface ProjectSummary {
  id: string;
  code: string;
  name: string;
  role: ProjectRole;
}

export async function listProjectsForUser(actor: Actor): Promise<ProjectSummary[]> {
  return getDb()
    .select({ id: projects.id, code: projects.code, name: projects.name, role: projectMembers.role })
    .from(projectMembers)
    .innerJoin(projects, eq(projects.id, projectMembers.projectId))
    .where(eq(projectMembers.userId, actor.userId))
    .orderBy(asc(projects.code));
}

/** The project, only when the actor is a member of it. */
export async function getProjectForMember(actor: Actor, projectId: string): Promise<(ProjectRow & { role: ProjectRole }) | undefined> {
  const rows = await getDb()
    .select({ project: projects, role: projectMembers.role })
    .from(projects)
    .innerJoin(projectMembers, and(eq(projectMembers.projectId, projects.id), eq(projectMembers.userId, actor.userId)))
    .where(eq(projects.id, projectId))
    .limit(1);
  const r = rows[0];
  return r ? { ...r.project, role: r.role } : undefined;
}

export async function createProject(
  actor: Actor,
  input: { code: string; name: string; client: string; site: string; units: "si" | "us"; criteriaDefaults?: Record<string, number>; paperSize?: "a4" | "letter" },
): Promise<ProjectRow> {
  return getDb().transaction(async (tx) => {
    const inserted = await tx
      .insert(projects)
      .values({ ...input, criteriaDefaults: input.criteriaDefaults ?? {}, paperSize: input.paperSize ?? (input.units === "us" ? "letter" : "a4"), createdById: actor.userId })
      .returning();
    const project = inserted[0];
    if (!project) throw new Error("project insert returned nothing");
    // The creator manages the project.
    await tx.insert(projectMembers).values({ projectId: project.id, userId: actor.userId, role: "manager" });
    return project;
  });
}

export async function getProjectByCode(code: string): Promise<ProjectRow | undefined> {
  const rows = await getDb().select().from(projects).where(eq(projects.code, code)).limit(1);
  return rows[0];
}

export interface MemberListItem {
  memberId: string;
  userId: string;
  name: string;
  email: string;
  role: ProjectRole;
  company: string | null;
  hasPassword: boolean;
}

export async function listMembers(actor: Actor, projectId: string): Promise<MemberListItem[]> {
  if (!(await getMembership(actor, projectId))) return [];
  const rows = await getDb()
    .select({
      memberId: projectMembers.id,
      userId: users.id,
      name: users.name,
      email: users.email,
      role: projectMembers.role,
      company: companies.name,
      passwordHash: users.passwordHash,
    })
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .leftJoin(companies, eq(companies.id, projectMembers.companyId))
    .where(eq(projectMembers.projectId, projectId))
    .orderBy(asc(projectMembers.role), asc(users.name));
  return rows.map(({ passwordHash, ...r }) => ({ ...r, hasPassword: passwordHash !== null }));
}

type Tx = Parameters<Parameters<ReturnType<typeof getDb>["transaction"]>[0]>[0];

/**
 * The last-manager rule, the one place it lives: a project always keeps a manager, so a
 * change that takes the manager role from `userId` (removal, or re-invitation with another
 * role) is refused when no other manager remains. Runs inside the change's transaction and
 * locks the project's manager rows, so two racing changes cannot each leave the other as
 * the last manager and then both go through.
 */
async function assertAnotherManagerRemains(tx: Tx, projectId: string, userId: string): Promise<void> {
  const managers = await tx
    .select({ userId: projectMembers.userId })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.role, "manager")))
    .for("update");
  if (managers.some((m) => m.userId === userId) && managers.length <= 1) {
    throw new AppError("conflict", "A project keeps at least one manager: make another member a manager first.");
  }
}

/**
 * Adds the account to the project or changes its role. Only the invitation path
 * (app/_lib/accounts-service.ts inviteMember, which checks members.manage) and the trusted
 * seed call it. Taking the manager role from the last manager is refused.
 */
export async function upsertMember(input: { projectId: string; userId: string; role: ProjectRole; companyId?: string | null }): Promise<string> {
  return getDb().transaction(async (tx) => {
    if (input.role !== "manager") await assertAnotherManagerRemains(tx, input.projectId, input.userId);
    const rows = await tx
      .insert(projectMembers)
      .values({ projectId: input.projectId, userId: input.userId, role: input.role, companyId: input.companyId ?? null })
      .onConflictDoUpdate({
        target: [projectMembers.projectId, projectMembers.userId],
        set: { role: input.role, companyId: input.companyId ?? null, updatedAt: new Date() },
      })
      .returning({ id: projectMembers.id });
    const id = rows[0]?.id;
    if (!id) throw new Error("member upsert returned nothing");
    return id;
  });
}

/**
 * Removes the member under the last-manager rule (the same check as a role change).
 * Undefined when no such member is on the project.
 */
export async function removeMember(projectId: string, memberId: string): Promise<ProjectMemberRow | undefined> {
  return getDb().transaction(async (tx) => {
    const [member] = await tx
      .select()
      .from(projectMembers)
      .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.id, memberId)))
      .for("update");
    if (!member) return undefined;
    await assertAnotherManagerRemains(tx, projectId, member.userId);
    await tx.delete(projectMembers).where(eq(projectMembers.id, member.id));
    return member;
  });
}

export async function getOrCreateCompany(name: string): Promise<string> {
  const trimmed = name.trim();
  const existing = await getDb().select({ id: companies.id }).from(companies).where(eq(companies.name, trimmed)).limit(1);
  if (existing[0]) return existing[0].id;
  const rows = await getDb().insert(companies).values({ name: trimmed }).onConflictDoNothing().returning({ id: companies.id });
  if (rows[0]) return rows[0].id;
  const again = await getDb().select({ id: companies.id }).from(companies).where(eq(companies.name, trimmed)).limit(1);
  if (!again[0]) throw new Error("company upsert failed");
  return again[0].id;
}

// ---- foundations ------------------------------------------------------------

export async function listFoundations(actor: Actor, projectId: string): Promise<FoundationRow[]> {
  return getDb()
    .select({
      id: foundations.id,
      projectId: foundations.projectId,
      tag: foundations.tag,
      machineTrain: foundations.machineTrain,
      location: foundations.location,
      withdrawnAt: foundations.withdrawnAt,
      withdrawnById: foundations.withdrawnById,
      withdrawalReason: foundations.withdrawalReason,
      soilFlag: foundations.soilFlag,
      createdAt: foundations.createdAt,
      updatedAt: foundations.updatedAt,
    })
    .from(foundations)
    .innerJoin(projectMembers, and(eq(projectMembers.projectId, foundations.projectId), eq(projectMembers.userId, actor.userId)))
    // Withdrawn foundations leave the list (managers find them on the project page's own list).
    .where(and(eq(foundations.projectId, projectId), isNull(foundations.withdrawnAt)))
    .orderBy(asc(foundations.tag));
}

export async function createFoundation(
  actor: Actor,
  projectId: string,
  input: { tag: string; machineTrain: string; location: string },
): Promise<FoundationRow> {
  if (!(await getMembership(actor, projectId))) throw new Error("not a member");
  const rows = await getDb().insert(foundations).values({ projectId, ...input }).returning();
  const row = rows[0];
  if (!row) throw new Error("foundation insert returned nothing");
  return row;
}

export async function updateProjectSettings(
  actor: Actor,
  projectId: string,
  settings: { units: "si" | "us"; revisionScheme: "letters" | "numbers"; paperSize?: "a4" | "letter"; signOffSteps?: "one" | "two"; criteriaDefaults: Record<string, number>; soilBand: { lowerFactor?: number; upperFactor?: number } },
): Promise<ProjectRow | undefined> {
  const membership = await getMembership(actor, projectId);
  if (!membership || membership.role !== "manager") return undefined;
  const rows = await getDb()
    .update(projects)
    .set({ ...settings, updatedAt: new Date() })
    .where(eq(projects.id, projectId))
    .returning();
  return rows[0];
}
