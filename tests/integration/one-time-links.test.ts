// Password reset and invitation: the e-mail reaches the fake SMTP server over
// real SMTP, its link works once, and an expired link does not work.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { acceptInvitationAction, forgotPasswordAction, resetPasswordAction, signInAction } from "@/app/(auth)/actions";
import { inviteMemberAction } from "@/app/(desk)/actions";
import { hashPassword } from "@/app/_lib/passwords";
import { closeDb, getDb } from "@/db/client";
import { createOneTimeToken, createUser, getUserByEmail } from "@/db/queries/accounts";
import { resetServerEnvForTests } from "@/modules/platform/env";
import { outgoingEmails } from "@/db/schema";
import { resetMailIdle } from "@/app/_lib/reset-mail";
import { flushEmailQueue } from "@/app/_lib/mailer";
import { getMembership } from "@/db/queries/projects";
import { oneTimeTokens } from "@/db/schema";
import { callAction, callRoute, getFixture, freshPeer, linkToken, sessionCookieFrom, waitForEmail, type Fixture } from "./support/fixture";

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  await resetMailIdle();
  await closeDb();
});

describe("password reset", () => {
  const email = `reset-${Date.now()}@example.test`;

  it("e-mails a link that sets a new password once", async () => {
    await createUser({ email, name: "Rena Reset", passwordHash: await hashPassword("old password 123") });
    const asked = await callAction(forgotPasswordAction, { email }, null, freshPeer());
    expect(asked.state.ok).toBe(true);
    const mail = await waitForEmail(email, "reset your password");
    const token = linkToken(mail.text, "reset");

    const first = await callAction(resetPasswordAction, { token, password: "new password 456", confirm: "new password 456" }, null);
    expect(first.state.ok).toBe(true);
    // The reset signs the person in.
    expect((await callRoute("v1/session", "GET", {}, { cookie: sessionCookieFrom(first.port.setCookieHeaders) })).status).toBe(200);

    const again = await callAction(resetPasswordAction, { token, password: "third password 789", confirm: "third password 789" }, null);
    expect(again.state.ok).toBe(false);
    if (!again.state.ok) expect(again.state.message).toMatch(/expired or was already used/);

    const oldPw = await callAction(signInAction, { email, password: "old password 123" }, null, freshPeer());
    expect(oldPw.state.ok).toBe(false);
    const newPw = await callAction(signInAction, { email, password: "new password 456" }, null);
    expect(newPw.state.ok).toBe(true);
  });

  it("answers the same for an unknown address and sends nothing", async () => {
    const r = await callAction(forgotPasswordAction, { email: "no-account-here@example.test" }, null, freshPeer());
    expect(r.state.ok).toBe(true);
    await expect(waitForEmail("no-account-here@example.test", "reset", 600)).rejects.toThrow(/no e-mail/);
  });

  it("refuses an expired link", async () => {
    const user = await getUserByEmail(email);
    const token = await createOneTimeToken({ purpose: "password-reset", userId: user!.id, ttlMs: -1000 });
    const r = await callAction(resetPasswordAction, { token, password: "another password 1", confirm: "another password 1" }, null);
    expect(r.state.ok).toBe(false);
  });

  it("keeps only the token's hash in the database", async () => {
    const user = await getUserByEmail(email);
    const token = await createOneTimeToken({ purpose: "password-reset", userId: user!.id, ttlMs: 60_000 });
    const rows = await getDb().select().from(oneTimeTokens).where(eq(oneTimeTokens.userId, user!.id));
    expect(rows.every((r) => r.tokenHash !== token && r.tokenHash.length === 64)).toBe(true);
  });
});

describe("invitation", () => {
  const email = `invitee-${Date.now()}@example.test`;

  it("a manager's invitation e-mails a one-time link that sets the password and joins the project", async () => {
    const invited = await callAction(inviteMemberAction, { projectId: fx.projectId, email, name: "Ivo Invitee", role: "checker" }, fx.cookies.manager);
    expect(invited.state.ok).toBe(true);
    const mail = await waitForEmail(email, "you are invited");
    expect(mail.text).toContain("WRP-PH1");
    const token = linkToken(mail.text, "invite");

    const accepted = await callAction(acceptInvitationAction, { token, name: "Ivo Invitee", password: "invitee password 1", confirm: "invitee password 1" }, null);
    expect(accepted.state.ok).toBe(true);
    if (accepted.state.ok) expect(accepted.state.data.projectId).toBe(fx.projectId);
    const user = await getUserByEmail(email);
    const membership = await getMembership({ userId: user!.id, isAdmin: false }, fx.projectId);
    expect(membership?.role).toBe("checker");

    const reuse = await callAction(acceptInvitationAction, { token, name: "Mallory", password: "hijack password 1", confirm: "hijack password 1" }, null);
    expect(reuse.state.ok).toBe(false);
    const signIn = await callAction(signInAction, { email, password: "invitee password 1" }, null);
    expect(signIn.state.ok).toBe(true);
  });

  it("an expired invitation is refused", async () => {
    const user = await createUser({ email: `late-${Date.now()}@example.test`, name: "Lena Late" });
    const token = await createOneTimeToken({ purpose: "invitation", userId: user.id, ttlMs: -1, projectId: fx.projectId, role: "viewer" });
    const r = await callAction(acceptInvitationAction, { token, name: "Lena Late", password: "late password 12", confirm: "late password 12" }, null);
    expect(r.state.ok).toBe(false);
    if (!r.state.ok) expect(r.state.code).toBe("not_found");
  });

  it("a designer cannot invite", async () => {
    const r = await callAction(inviteMemberAction, { projectId: fx.projectId, email: `nope-${Date.now()}@example.test`, name: "N", role: "viewer" }, fx.cookies.designer);
    expect(r.state.ok).toBe(false);
    if (!r.state.ok) expect(r.state.code).toBe("forbidden");
  });

  it("a vendor invitation needs a company, named as the field", async () => {
    const r = await callAction(inviteMemberAction, { projectId: fx.projectId, email: `v-${Date.now()}@example.test`, name: "V", role: "vendor" }, fx.cookies.manager);
    expect(r.state.ok).toBe(false);
    if (!r.state.ok) expect(r.state.fieldErrors?.company?.[0]).toMatch(/company/);
  });
});

describe("a password change kills every other link of the account", () => {
  it("a reset makes the account's other reset and invitation links fail", async () => {
    const user = await createUser({ email: `links-${Date.now()}@example.test`, name: "Lio Links", passwordHash: await hashPassword("first password 1") });
    const used = await createOneTimeToken({ purpose: "password-reset", userId: user.id, ttlMs: 60_000 });
    const otherReset = await createOneTimeToken({ purpose: "password-reset", userId: user.id, ttlMs: 60_000 });
    const invitation = await createOneTimeToken({ purpose: "invitation", userId: user.id, ttlMs: 60_000, projectId: fx.projectId, role: "viewer" });
    const r = await callAction(resetPasswordAction, { token: used, password: "second password 2", confirm: "second password 2" }, null);
    expect(r.state.ok).toBe(true);
    const again = await callAction(resetPasswordAction, { token: otherReset, password: "attacker password 3", confirm: "attacker password 3" }, null);
    expect(again.state.ok).toBe(false);
    if (!again.state.ok) expect(again.state.code).toBe("not_found");
    const inv = await callAction(acceptInvitationAction, { token: invitation, name: "Lio Links", password: "attacker password 4", confirm: "attacker password 4" }, null);
    expect(inv.state.ok).toBe(false);
    expect((await callAction(signInAction, { email: user.email, password: "second password 2" }, null, freshPeer())).state.ok).toBe(true);
  });

  it("accepting an invitation makes the account's other invitation and reset links fail", async () => {
    const user = await createUser({ email: `twice-${Date.now()}@example.test`, name: "Tam Twice" });
    const first = await createOneTimeToken({ purpose: "invitation", userId: user.id, ttlMs: 60_000, projectId: fx.projectId, role: "viewer" });
    const second = await createOneTimeToken({ purpose: "invitation", userId: user.id, ttlMs: 60_000, projectId: fx.projectId, role: "viewer" });
    const reset = await createOneTimeToken({ purpose: "password-reset", userId: user.id, ttlMs: 60_000 });
    expect((await callAction(acceptInvitationAction, { token: first, name: "Tam Twice", password: "tam password 123", confirm: "tam password 123" }, null)).state.ok).toBe(true);
    const r2 = await callAction(acceptInvitationAction, { token: second, name: "Mallory", password: "hijack password 2", confirm: "hijack password 2" }, null);
    expect(r2.state.ok).toBe(false);
    const r3 = await callAction(resetPasswordAction, { token: reset, password: "hijack password 3", confirm: "hijack password 3" }, null);
    expect(r3.state.ok).toBe(false);
    expect((await callAction(signInAction, { email: user.email, password: "tam password 123" }, null, freshPeer())).state.ok).toBe(true);
  });

  it("an invitation never overwrites the password of an account that has one", async () => {
    const user = await createUser({ email: `has-pw-${Date.now()}@example.test`, name: "Hal Haspw", passwordHash: await hashPassword("own password 123") });
    const token = await createOneTimeToken({ purpose: "invitation", userId: user.id, ttlMs: 60_000, projectId: fx.projectId, role: "viewer" });
    const r = await callAction(acceptInvitationAction, { token, name: "Hal Haspw", password: "other password 9", confirm: "other password 9" }, null);
    expect(r.state.ok).toBe(false);
    if (!r.state.ok) {
      expect(r.state.code).toBe("conflict");
      expect(r.state.message).toMatch(/already has a password: sign in/);
    }
    expect(sessionCookieFrom(r.port.setCookieHeaders)).toBeNull();
    expect((await callAction(signInAction, { email: user.email, password: "other password 9" }, null, freshPeer())).state.ok).toBe(false);
    expect((await callAction(signInAction, { email: user.email, password: "own password 123" }, null, freshPeer())).state.ok).toBe(true);
  });
});

describe("the outbox never shows a live link outside the demo", () => {
  it("keeps a sent message without its link, and the admin outbox shows none while PLINTH_DEMO=0", async () => {
    const email = `outbox-${Date.now()}@example.test`;
    await createUser({ email, name: "Otto Outbox", passwordHash: await hashPassword("outbox password 1") });
    expect((await callAction(forgotPasswordAction, { email }, null, freshPeer())).state.ok).toBe(true);
    await resetMailIdle();
    await flushEmailQueue();
    const token = linkToken((await waitForEmail(email, "reset your password")).text, "reset");
    const stored = await getDb().select().from(outgoingEmails).where(eq(outgoingEmails.to, email));
    expect(stored).toHaveLength(1);
    expect(stored[0]!.status).toBe("sent");
    expect(stored[0]!.text).not.toContain(token);
    expect(stored[0]!.text).toMatch(/\/reset\/\[link removed after sending\]/);

    const saved = process.env.PLINTH_DEMO;
    try {
      process.env.PLINTH_DEMO = "0";
      resetServerEnvForTests();
      const res = await callRoute("v1/admin/outbox", "GET", {}, { cookie: fx.cookies.admin });
      expect(res.status).toBe(200);
      const body = await res.text();
      expect(body).toContain(email);
      expect(body).not.toContain(token);
    } finally {
      process.env.PLINTH_DEMO = saved;
      resetServerEnvForTests();
    }
    // In the demo the local mail server's copy (invented accounts) keeps its link to follow.
    const demo = await (await callRoute("v1/admin/outbox", "GET", {}, { cookie: fx.cookies.admin })).text();
    expect(demo).toContain(token);
  });
});
