import { z } from "zod";
import { AppError } from "@/modules/platform/errors";
import { createFoundationSchema } from "@/modules/platform/account-schemas";
import { createFoundation, listFoundations } from "@/db/queries/projects";
import { isUniqueViolation } from "@/db/queries/errors";
import { recordAuditEvent } from "@/db/queries/audit";
import { defineRoute } from "../../../../../_lib/route";

export const dynamic = "force-dynamic";

const bodySchema = createFoundationSchema.omit({ projectId: true }).strict();

export const GET = defineRoute({
  access: { kind: "project", permission: "foundation.read" },
  projectId: (p: { projectId: string }) => p.projectId,
  handler: async ({ auth, params }) => ({ foundations: await listFoundations(auth!.actor, params.projectId) }),
});

export const POST = defineRoute({
  access: { kind: "project", permission: "foundation.create" },
  projectId: (p: { projectId: string }) => p.projectId,
  body: bodySchema,
  status: 201,
  handler: async ({ auth, params }, body: z.infer<typeof bodySchema>) => {
    try {
      const foundation = await createFoundation(auth!.actor, params.projectId, body);
      await recordAuditEvent({ projectId: params.projectId, actorId: auth!.user.id, action: "foundation.created", detail: { tag: foundation.tag } });
      return { foundation };
    } catch (e) {
      if (isUniqueViolation(e, "foundations_project_tag_uq")) throw new AppError("conflict", "This tag is already used in the project.", [{ path: "tag", message: "Already used" }]);
      throw e;
    }
  },
});
