import { getFoundation } from "@/db/queries/foundations";
import { defineRoute } from "@/app/_lib/route";
import { foundationIdOf, foundationNotFound, projectIdOf } from "./foundation-params";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "project", permission: "foundation.read" },
  projectId: projectIdOf,
  handler: async ({ auth, params }) => {
    const foundation = await getFoundation(auth!.actor, params.projectId, foundationIdOf(params));
    if (!foundation) throw foundationNotFound();
    return { foundation };
  },
});
