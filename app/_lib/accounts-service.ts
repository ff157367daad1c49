import { AppError } from "@/modules/platform/errors";
import { roleAllows, roleLabels, type ProjectRole } from "@/modules/platform/permissions";
import {
  clearSignInFailures,
  consumeToken,
  countRecentFailures,
  countRecentResetRequests,
  createOneTimeToken,
  createResetRequest,
  createUser,
  getLiveToken,
  getPublicUser,
  getUserByEmail,
  isKnownSignInAddress,
  recordSignInFailure,
  rememberSignInAddress,
  revokeUserSessions,
  revokeUserTokens,
  setUserPassword,
  setUserPasswordIfUnset,
  userHasPassword,
  type PublicUser,
} from "@/db/queries/accounts";
import { describeWait, judgeSignInAttempt, THROTTLE_WINDOW_MS } from "@/modules/platform/sign-in-throttle";
import { getOrCreateCompany, getProjectForMember, upsertMember, type Actor } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { getDummyHash, hashPassword, verifyPassword } from "./passwords";
import { appUrl, sendEmail } from "./mailer";
import { kickResetMail } from "./reset-mail";
import { startSession } from "./session";
import type { RequestPort } from "./request-context";
import { clientAddressOf } from "./client-address";

export { MAX_FAILURES_PER_ADDRESS, PAIR_FREE_FAILURES, ACCOUNT_FREE_FAILURES, THROTTLE_WINDOW_MS } from "@/modules/platform/sign-in-throttle";
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;
export { RESET_TTL_MS } from "./reset-mail";
// Forgot-password: per address and per target account (known or not, the same answer).
export const RESET_WINDOW_MS = 15 * 60 * 1000;
export const MAX_RESETS_PER_ADDRESS = 10;
export const MAX_RESETS_PER_ACCOUNT = 3;

export async function signIn(port: RequestPort, email: string, password: string): Promise<PublicUser> {
  const address = clientAddressOf(port);
  const [recent, user] = await Promise.all([countRecentFailures(email, address, THROTTLE_WINDOW_MS), getUserByEmail(email)]);
  const known = user ? await isKnownSignInAddress(user.id, address) : false;
  const verdict = judgeSignInAttempt(recent, known, Date.now());
  if (!verdict.allowed) {
    const wait = describeWait(verdict.retryAfterMs);
    const message =
      verdict.scope === "address"
        ? `Too many failed sign-ins from your network. Try again in ${wait}.`
        : `Too many failed sign-ins for this account from here. Try again in ${wait}, or reset your password.`;
    throw new AppError("too_many_requests", message);
  }
  const ok = await verifyPassword(password, user?.passwordHash ?? getDummyHash());
  if (!user || !user.passwordHash || !ok) {
    await recordSignInFailure(email, address);
    throw new AppError("unauthenticated", "That e-mail and password do not match an account.");
  }
  // Only this address's failures are forgiven: a guesser elsewhere keeps their delay.
  await clearSignInFailures(email, address);
  await rememberSignInAddress(user.id, address);
  await startSession(port, user.id);
  await recordAuditEvent({ actorId: user.id, action: "account.signed-in", detail: { address } });
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin, mayCreateProjects: user.mayCreateProjects, unitsPreference: user.unitsPreference };
}

/**
 * Always answers the same way, whether or not the account exists, and in the same time:
 * the request path only counts and records the request (the same statements either way);
 * looking the account up, making the link and sending the mail happen after the answer.
 */
export async function requestPasswordReset(port: RequestPort, email: string): Promise<void> {
  const address = clientAddressOf(port);
  const recent = await countRecentResetRequests(email, address, RESET_WINDOW_MS);
  if (recent.byAddress >= MAX_RESETS_PER_ADDRESS || recent.byAccount >= MAX_RESETS_PER_ACCOUNT) {
    throw new AppError("too_many_requests", "Too many password-reset requests. Try again in about 15 minutes, or look for the message already sent.");
  }
  await createResetRequest(email, address);
  kickResetMail();
}

/** After a password is set: no other reset or invitation link of the account works any more. */
async function afterPasswordChange(userId: string, email: string): Promise<void> {
  await revokeUserTokens(userId);
  await revokeUserSessions(userId);
  // A fresh password makes earlier guesses moot.
  await clearSignInFailures(email);
}

export async function resetPassword(port: RequestPort, token: string, password: string): Promise<PublicUser> {
  const row = await consumeToken("password-reset", token);
  if (!row) throw new AppError("not_found", "This reset link has expired or was already used. Ask for a new one.");
  await setUserPassword(row.userId, await hashPassword(password));
  const user = await getPublicUser(row.userId);
  if (!user) throw new AppError("not_found");
  await afterPasswordChange(row.userId, user.email);
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

/**
 * An invitation sets the password of an account that has none. An account that already
 * has a password keeps it: the membership was added when the invitation was sent, so the
 * person signs in as usual (the link is refused and asks for that, and is not used up).
 */
export async function acceptInvitation(port: RequestPort, token: string, name: string, password: string): Promise<{ projectId: string | null }> {
  const live = await getLiveToken("invitation", token);
  if (live && (await userHasPassword(live.userId))) {
    throw new AppError("conflict", "This account already has a password: sign in with it to open the project.");
  }
  const row = await consumeToken("invitation", token);
  if (!row) throw new AppError("not_found", "This invitation link has expired or was already used. Ask the project manager for a new one.");
  // Atomic against a password set meanwhile (another link, a reset): never overwrite one.
  if (!(await setUserPasswordIfUnset(row.userId, await hashPassword(password), name))) {
    throw new AppError("conflict", "This account already has a password: sign in with it to open the project.");
  }
  const user = await getPublicUser(row.userId);
  if (!user) throw new AppError("not_found");
  await afterPasswordChange(row.userId, user.email);
  await startSession(port, row.userId);
  await recordAuditEvent({ projectId: row.projectId, actorId: row.userId, action: "member.invitation-accepted" });
  return { projectId: row.projectId };
}
