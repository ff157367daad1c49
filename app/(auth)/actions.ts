"use server";

import { z } from "zod";
import {
  acceptInvitationSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
} from "@/modules/platform/account-schemas";
import { getServerEnv } from "@/modules/platform/env";
import { safeRedirectPath } from "@/modules/platform/redirects";
import { defineAction } from "../_lib/action";
import { acceptInvitation, requestPasswordReset, resetPassword, signIn } from "../_lib/accounts-service";


export const signInAction = defineAction({
  name: "auth.signIn",
  access: { kind: "public" },
  schema: signInSchema,
  handler: async (ctx, input) => {
    const user = await signIn(ctx.port, input.email, input.password);
    return { userId: user.id, next: safeRedirectPath(input.next, getServerEnv().APP_URL) };
  },
  redirectTo: (data) => data.next,
});

export const forgotPasswordAction = defineAction({
  name: "auth.forgotPassword",
  access: { kind: "public" },
  schema: forgotPasswordSchema,
  handler: async (ctx, input) => {
    await requestPasswordReset(ctx.port, input.email);
    return { sent: true };
  },
});

export const resetPasswordAction = defineAction({
  name: "auth.resetPassword",
  access: { kind: "public" },
  schema: resetPasswordSchema,
  handler: async (ctx, input) => {
    const user = await resetPassword(ctx.port, input.token, input.password);
    return { userId: user.id };
  },
  redirectTo: () => "/",
});

export const acceptInvitationAction = defineAction({
  name: "auth.acceptInvitation",
  access: { kind: "public" },
  schema: acceptInvitationSchema,
  handler: async (ctx, input) => acceptInvitation(ctx.port, input.token, input.name, input.password),
  redirectTo: (data) => (data.projectId ? `/projects/${data.projectId}` : "/"),
});

export const signOutAction = defineAction({
  name: "auth.signOut",
  access: { kind: "signedIn" },
  schema: z.object({}),
  handler: async (ctx) => {
    const { endSession } = await import("../_lib/session");
    await endSession(ctx.port);
    return { signedOut: true };
  },
  redirectTo: () => "/sign-in",
});
