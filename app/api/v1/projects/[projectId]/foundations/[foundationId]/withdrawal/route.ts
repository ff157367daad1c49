import { z } from "zod";
import { setFoundationWithdrawn } from "@/db/queries/foundations";
import { defineRoute } from "@/app/_lib/route";
import { withdrawFoundationSchema } from "@/modules/platform/account-schemas";
import { foundationIdOf, projectIdOf } from "../foundation-params";

export const dynamic = "force-dynamic";

const withdrawBodySchema = withdrawFoundationSchema.pick({ reason: true });

// POST withdraws a foundation created by mistake (with a reason); DELETE restores it.
// Its revisions and audit trail are kept either way.
export const POST = defineRoute({
  access: { kind: "project", permission: "foundation.withdraw" },
  projectId: projectIdOf,
  body: withdrawBodySchema,
  handler: async ({ auth, params }, body: z.infer<typeof withdrawBodySchema>) => ({
    foundation: await setFoundationWithdrawn(auth!.actor, params.projectId, foundationIdOf(params), { withdrawn: true, reason: body.reason }),
  }),
});

export const DELETE = defineRoute({
  access: { kind: "project", permission: "foundation.withdraw" },
  projectId: projectIdOf,
  handler: async ({ auth, params }) => ({
    foundation: await setFoundationWithdrawn(auth!.actor, params.projectId, foundationIdOf(params), { withdrawn: false, reason: "" }),
  }),
});
