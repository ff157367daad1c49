import { z } from "zod";
import { defineRoute } from "@/app/_lib/route";
import { resolveRevisionComment } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/revision-service";
import { idOf, type CommentParams } from "../../../revision-params";

export const dynamic = "force-dynamic";

// Marks a comment resolved (or open again). JSON carries a boolean, the form a string.
export const PATCH = defineRoute({
  access: { kind: "project", permission: "revision.comment" },
  projectId: (p: CommentParams) => p.projectId,
  body: z.strictObject({ resolved: z.boolean("resolved must be true or false") }),
  handler: async ({ auth, params }, body) => {
    idOf(params.revisionId, "revision");
    const comment = await resolveRevisionComment(auth!.actor, {
      projectId: params.projectId,
      foundationId: idOf(params.foundationId, "foundation"),
      commentId: idOf(params.commentId, "comment"),
      resolved: body.resolved,
    });
    return { comment };
  },
});
