import { getFoundation } from "@/db/queries/foundations";
import { getProjectForMember } from "@/db/queries/projects";
import { getRevision, getUserContact, listRevisionHistory, listRevisions } from "@/db/queries/revisions";
import { defineRoute } from "@/app/_lib/route";
import { attachmentDisposition, packageFileName, revisionWorkbookBytes, XLSX_CONTENT_TYPE } from "@/modules/calc-package";
import { idOf, revisionNotFound, type RevisionParams } from "../../revision-params";

export const dynamic = "force-dynamic";

// The calculation package of one revision (an .xlsx download). Every stored revision is an
// issued one, so "package.export" (all roles but vendors) is the whole rule; the queries
// scope by membership again.
export const GET = defineRoute({
  access: { kind: "project", permission: "package.export" },
  projectId: (p: RevisionParams) => p.projectId,
  handler: async ({ auth, params }) => {
    const actor = auth!.actor;
    const foundationId = idOf(params.foundationId, "foundation");
    const revisionId = idOf(params.revisionId, "revision");
    const [project, foundation, revision] = await Promise.all([getProjectForMember(actor, params.projectId), getFoundation(actor, params.projectId, foundationId), getRevision(actor, params.projectId, foundationId, revisionId)]);
    if (!project || !foundation || !revision) throw revisionNotFound();
    const [history, trail, me] = await Promise.all([listRevisions(actor, params.projectId, foundationId), listRevisionHistory(actor, params.projectId, foundationId), getUserContact(actor.userId)]);
    const bytes = await revisionWorkbookBytes({
      project: { code: project.code, name: project.name, client: project.client, site: project.site, units: project.units },
      foundation: { tag: foundation.tag, machineTrain: foundation.machineTrain, location: foundation.location },
      revision,
      input: revision.input,
      result: revision.result,
      history,
      trail,
      generatedAt: new Date(),
      generatedByName: me?.name ?? "",
    });
    return new Response(new Uint8Array(bytes), {
      headers: {
        "content-type": XLSX_CONTENT_TYPE,
        "content-length": String(bytes.length),
        "content-disposition": attachmentDisposition(packageFileName(project.code, foundation.tag, revision.label)),
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
      },
    });
  },
});
