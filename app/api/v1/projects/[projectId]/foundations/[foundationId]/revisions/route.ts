import { revisionIssueSchema } from "@/modules/revisions";
import { listRevisions } from "@/db/queries/revisions";
import { getFoundation } from "@/db/queries/foundations";
import { defineRoute } from "@/app/_lib/route";
import { issueForCheck } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/revision-service";
import { idOf, type RevisionListParams } from "./revision-params";

export const dynamic = "force-dynamic";

const projectIdOf = (p: RevisionListParams) => p.projectId;

export const GET = defineRoute({
  access: { kind: "project", permission: "revision.read" },
  projectId: projectIdOf,
  handler: async ({ auth, params }) => {
    const foundationId = idOf(params.foundationId, "foundation");
    if (!(await getFoundation(auth!.actor, params.projectId, foundationId))) idOf(null, "foundation");
    return { revisions: await listRevisions(auth!.actor, params.projectId, foundationId) };
  },
});

// Issues the saved draft for check with its revision `note` (required: what changed and why);
// `draftVersion` (optional) refuses a draft saved since; `purpose` (optional, "issued-for-check"
// by default) says what the revision is issued for.
export const POST = defineRoute({
  access: { kind: "project", permission: "revision.issue" },
  projectId: projectIdOf,
  body: revisionIssueSchema.pick({ draftVersion: true, note: true, purpose: true }).strict(),
  status: 201,
  handler: async ({ auth, params }, body) => {
    const revision = await issueForCheck(auth!.actor, { projectId: params.projectId, foundationId: idOf(params.foundationId, "foundation"), draftVersion: body.draftVersion, note: body.note, purpose: body.purpose });
    return { revision };
  },
});
