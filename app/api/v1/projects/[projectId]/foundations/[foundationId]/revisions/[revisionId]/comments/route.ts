import { revisionCommentSchema } from "@/modules/revisions";
import { listRevisionComments } from "@/db/queries/revisions";
import { defineRoute } from "@/app/_lib/route";
import { commentOnRevision } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/revision-service";
import { idOf, revisionNotFound, type RevisionParams } from "../../revision-params";

export const dynamic = "force-dynamic";

const projectIdOf = (p: RevisionParams) => p.projectId;

export const GET = defineRoute({
  access: { kind: "project", permission: "revision.commentsRead" },
  projectId: projectIdOf,
  handler: async ({ auth, params }) => {
    const comments = await listRevisionComments(auth!.actor, params.projectId, idOf(params.foundationId, "foundation"), idOf(params.revisionId, "revision"));
    if (!comments) throw revisionNotFound();
    return { comments };
  },
});

// A comment on the whole revision or on one field (`fieldPath`), or an answer (`parentId`).
export const POST = defineRoute({
  access: { kind: "project", permission: "revision.comment" },
  projectId: projectIdOf,
  body: revisionCommentSchema.pick({ body: true, fieldPath: true, parentId: true }).strict(),
  status: 201,
  handler: async ({ auth, params }, body) => {
    const comment = await commentOnRevision(auth!.actor, {
      projectId: params.projectId,
      foundationId: idOf(params.foundationId, "foundation"),
      revisionId: idOf(params.revisionId, "revision"),
      ...body,
    });
    return { comment };
  },
});
