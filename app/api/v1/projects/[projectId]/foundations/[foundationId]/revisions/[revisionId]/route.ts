import { getRevision, listRevisionComments } from "@/db/queries/revisions";
import { defineRoute } from "@/app/_lib/route";
import { idOf, revisionNotFound, type RevisionParams } from "../revision-params";

export const dynamic = "force-dynamic";

// One issued revision: what was issued (input, result, engine version, fingerprint),
// its state and its comments (for the design team; the client gets none, see listRevisionComments).
export const GET = defineRoute({
  access: { kind: "project", permission: "revision.read" },
  projectId: (p: RevisionParams) => p.projectId,
  handler: async ({ auth, params }) => {
    const foundationId = idOf(params.foundationId, "foundation");
    const revisionId = idOf(params.revisionId, "revision");
    const revision = await getRevision(auth!.actor, params.projectId, foundationId, revisionId);
    if (!revision) throw revisionNotFound();
    const comments = (await listRevisionComments(auth!.actor, params.projectId, foundationId, revisionId)) ?? [];
    return { revision, comments };
  },
});
