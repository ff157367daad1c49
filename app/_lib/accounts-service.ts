import { AppError } from "@/modules/platform/errors";
import { roleAllows, roleLabels, type ProjectRole } from "@/modules/platform/permissions";
import { getServerEnv } from "@/modules/platform/env";
import {
  clearSignInFailures,
  consumeToken,
  countRecentFailures,
  createOneTimeToken,
  createUser,
  getPublicUser,
  getUserByEmail,
  recordSignInFailure,
  revokeUserSessions,
  setUserPassword,
  type PublicUser,
} from "@/db/queries/accounts";
import { getOrCreateCompany, getProjectForMember, upsertMember, type Actor } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { getDummyHash, hashPassword, verifyPassword } from "./passwords";
import { appUrl, sendEmail } from "./mailer";
import { startSession } from "./session";
import type { RequestPort } from "./request-context";

export const THROTTLE_WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_ACCOUNT = 5;
export const MAX_FAILURES_PER_ADDRESS = 25;
export const RESET_TTL_MS = 60 * 60 * 1000;
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

/** The client's address: the nearest proxy's view, or the first hop when TRUST_PROXY=1. */
export function clientAddressOf(port: RequestPort): string {
  const fwd = port.getHeader("x-forwarded-for");
  if (fwd) {
    const hops = fwd.split(",").map((h) => h.trim()).filter(Boolean);
    const pick = getServerEnv().TRUST_PROXY === "1" ? hops[0] : hops[hops.length - 1];
    if (pick) return pick.slice(0, 64);
  }
  return port.getHeader("x-real-ip")?.slice(0, 64) ?? "direct";
}

function minutesUntil(oldest: Date | null): number {
  if (!oldest) return Math.ceil(THROTTLE_WINDOW_MS / 60000);
  return Math.max(1, Math.ceil((oldest.getTime() + THROTTLE_WINDOW_MS - Date.now()) / 60000));
}

export async function signIn(port: RequestPort, email: string, password: string): Promise<PublicUser> {
  const address = clientAddressOf(port);
  const recent = await countRecentFailures(email, address, THROTTLE_WINDOW_MS);
  if (recent.byAccount >= MAX_FAILURES_PER_ACCOUNT) {
    throw new AppError(
      "too_many_requests",
      `Too many failed sign-ins for this account. Try again in about ${minutesUntil(recent.oldestByAccount)} minutes, or reset your password.`,
    );
  }
  if (recent.byAddress >= MAX_FAILURES_PER_ADDRESS) {
    throw new AppError("too_many_requests", `Too many failed sign-ins from your network. Try again in about ${minutesUntil(recent.oldestByAddress)} minutes.`);
  }
  const user = await getUserByEmail(email);
  const ok = await verifyPassword(password, user?.passwordHash ?? getDummyHash());
  if (!user || !user.passwordHash || !ok) {
    await recordSignInFailure(email, address);
    throw new AppError("unauthenticated", "That e-mail and password do not match an account.");
  }
  await clearSignInFailures(email);
  await startSession(port, user.id);
  await recordAuditEvent({ actorId: user.id, action: "account.signed-in", detail: { address } });
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin, mayCreateProjects: user.mayCreateProjects, unitsPreference: user.unitsPreference };
}

/** Always answers the same way, whether or not the account exists. */
export async function requestPasswordReset(email: string): Promise<void> {
  const user = await getUserByEmail(email);
  if (!user) return;
  const token = await createOneTimeToken({ purpose: "password-reset", userId: user.id, ttlMs: RESET_TTL_MS });
  await sendEmail({
    to: user.email,
    subject: "Plinthwise: reset your password",
    text: [
      `Hello ${user.name},`,
      "",
      "Someone (hopefully you) asked to reset the password of your Plinthwise account.",
      `Open this link within ${RESET_TTL_MS / 60000} minutes to choose a new one; it works once:`,
      appUrl(`/reset/${token}`),
      "",
      "If you did not ask for this, ignore this message.",
    ].join("\n"),
  });
  await recordAuditEvent({ actorId: user.id, action: "account.reset-requested" });
}

export async function resetPassword(port: RequestPort, token: string, password: string): Promise<PublicUser> {
  const row = await consumeToken("password-reset", token);
  if (!row) throw new AppError("not_found", "This reset link has expired or was already used. Ask for a new one.");
  await setUserPassword(row.userId, await hashPassword(password));
  await revokeUserSessions(row.userId);
  const user = await getPublicUser(row.userId);
  if (!user) throw new AppError("not_found");
  // A fresh password lifts the lock on the account.
  await clearSignInFailures(user.email);
  await startSession(port, row.userId);
  await recordAuditEvent({ actorId: row.userId, action: "account.password-reset" });
  return user;
}

/**
 * Adds an account to a project (creating it when new) or changes its role there, and
 * e-mails it. Managers only; the last manager keeps the role (upsertMember's rule).
 */
export async function inviteMember(
  actor: Actor,
  input: { projectId: string; email: string; name: string; role: ProjectRole; company: string },
): Promise<{ userId: string; memberId: string }> {
  // The one check on adding a member or changing a role: every path that grants project
  // access (the Team page, the members API, nothing else) comes through here.
  const project = await getProjectForMember(actor, input.projectId);
  if (!project || !roleAllows(project.role, "members.manage")) throw new AppError("forbidden", "Only the project's manager adds members or changes their roles.");
  const existing = await getUserByEmail(input.email);
  const user = existing ?? (await createUser({ email: input.email, name: input.name }));
  const companyId = input.role === "vendor" && input.company ? await getOrCreateCompany(input.company) : null;
  const memberId = await upsertMember({ projectId: input.projectId, userId: user.id, role: input.role, companyId });
  const needsPassword = !existing || !existing.passwordHash;
  const lines = [`Hello ${input.name},`, "", `You have been added to project ${project.code} (${project.name}) on Plinthwise as ${roleLabels[input.role]}.`];
  if (needsPassword) {
    const token = await createOneTimeToken({
      purpose: "invitation",
      userId: user.id,
      ttlMs: INVITATION_TTL_MS,
      projectId: input.projectId,
      role: input.role,
      companyId,
    });
    lines.push("", `Open this link within ${INVITATION_TTL_MS / 86400000} days to set your password; it works once:`, appUrl(`/invite/${token}`));
  } else {
    lines.push("", `Sign in as usual: ${appUrl("/sign-in")}`);
  }
  await sendEmail({ to: user.email, subject: `Plinthwise: you are invited to ${project.code}`, text: lines.join("\n") });
  await recordAuditEvent({ projectId: input.projectId, actorId: actor.userId, action: "member.invited", detail: { email: user.email, role: input.role } });
  return { userId: user.id, memberId };
}

export async function acceptInvitation(port: RequestPort, token: string, name: string, password: string): Promise<{ projectId: string | null }> {
  const row = await consumeToken("invitation", token);
  if (!row) throw new AppError("not_found", "This invitation link has expired or was already used. Ask the project manager for a new one.");
  await setUserPassword(row.userId, await hashPassword(password), name);
  await startSession(port, row.userId);
  await recordAuditEvent({ projectId: row.projectId, actorId: row.userId, action: "member.invitation-accepted" });
  return { projectId: row.projectId };
}
