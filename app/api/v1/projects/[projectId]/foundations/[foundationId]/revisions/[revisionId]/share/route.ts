import { defineRoute } from "@/app/_lib/route";
import { shareRevisionWithClient } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/revision-service";
import { idOf, type RevisionParams } from "../../revision-params";

export const dynamic = "force-dynamic";

const projectIdOf = (p: RevisionParams) => p.projectId;

// A manager shares an unapproved revision's package with the client (POST) or withdraws
// the share (DELETE); both are audit events. Approved revisions need no share.
export const POST = defineRoute({
  access: { kind: "project", permission: "revision.share" },
  projectId: projectIdOf,
  handler: async ({ auth, params }) => {
    const revision = await shareRevisionWithClient(auth!.actor, { projectId: params.projectId, foundationId: idOf(params.foundationId, "foundation"), revisionId: idOf(params.revisionId, "revision"), shared: true });
    return { revision };
  },
});

export const DELETE = defineRoute({
  access: { kind: "project", permission: "revision.share" },
  projectId: projectIdOf,
  handler: async ({ auth, params }) => {
    const revision = await shareRevisionWithClient(auth!.actor, { projectId: params.projectId, foundationId: idOf(params.foundationId, "foundation"), revisionId: idOf(params.revisionId, "revision"), shared: false });
    return { revision };
  },
});
