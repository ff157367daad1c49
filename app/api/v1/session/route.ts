import { listProjectsForUser } from "@/db/queries/projects";
import { defineRoute } from "../../../_lib/route";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "signedIn" },
  handler: async ({ auth }) => {
    const user = auth!.user;
    return { user, projects: await listProjectsForUser(auth!.actor) };
  },
});
