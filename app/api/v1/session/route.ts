import { z } from "zod";
import { emailField } from "@/modules/platform/account-schemas";
import { listProjectsForUser } from "@/db/queries/projects";
import { defineRoute } from "../../../_lib/route";
import { signIn } from "../../../_lib/accounts-service";
import { endSession } from "../../../_lib/session";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "signedIn" },
  handler: async ({ auth }) => {
    const user = auth!.user;
    return { user, projects: await listProjectsForUser(auth!.actor) };
  },
});

// Sign-in for API clients (curl, scripts): the same checks and throttling as the form.
export const POST = defineRoute({
  access: { kind: "public" },
  body: z.strictObject({ email: emailField, password: z.string().min(1, "Enter your password").max(200) }),
  handler: async ({ port }, body) => {
    const user = await signIn(port, body.email, body.password);
    return { user };
  },
});

export const DELETE = defineRoute({
  access: { kind: "signedIn" },
  handler: async ({ port }) => {
    await endSession(port);
    return { signedOut: true };
  },
});
