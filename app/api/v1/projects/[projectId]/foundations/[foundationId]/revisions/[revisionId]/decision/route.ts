import { revisionDecisionSchema } from "@/modules/revisions";
import { defineRoute } from "@/app/_lib/route";
import { decideOnRevision } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/revision-service";
import { idOf, type RevisionParams } from "../../revision-params";

export const dynamic = "force-dynamic";

// Return with comments or approve: once per revision, never by its authors. A two-step
// project first takes "checked", then "approved" by a different person.
export const POST = defineRoute({
  access: { kind: "project", permission: "revision.decide" },
  projectId: (p: RevisionParams) => p.projectId,
  body: revisionDecisionSchema.pick({ outcome: true, note: true }).strict(),
  status: 201,
  handler: async ({ auth, params }, body) => {
    const revision = await decideOnRevision(auth!.actor, {
      projectId: params.projectId,
      foundationId: idOf(params.foundationId, "foundation"),
      revisionId: idOf(params.revisionId, "revision"),
      ...body,
    });
    return { revision };
  },
});
