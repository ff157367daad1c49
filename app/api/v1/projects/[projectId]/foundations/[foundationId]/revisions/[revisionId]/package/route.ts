import { getFoundation } from "@/db/queries/foundations";
import { getProjectForMember } from "@/db/queries/projects";
import { getRevision, getUserContact, listRevisionHistory, listRevisions } from "@/db/queries/revisions";
import { createBuiltBytesCache } from "@/app/_lib/built-bytes";
import { defineRoute } from "@/app/_lib/route";
import { attachmentDisposition, packageFileName, revisionWorkbookBytes, XLSX_CONTENT_TYPE } from "@/modules/calc-package";
import { idOf, revisionNotFound, type RevisionParams } from "../../revision-params";

export const dynamic = "force-dynamic";

// Building a workbook costs ~100 ms of CPU. The same person asking again for the same
// revision in the same state within a minute gets the bytes already built (the cover's
// "generated" line then shows the first build's time); simultaneous requests share a build.
const built = createBuiltBytesCache({ ttlMs: 60_000, maxEntries: 100 });

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
    // The light rows first: they make the cache key, and the revision's stored result
    // (about a megabyte with its sweep) is read only when a workbook is actually built.
    const [project, foundation, history, trail, me] = await Promise.all([
      getProjectForMember(actor, params.projectId),
      getFoundation(actor, params.projectId, foundationId),
      listRevisions(actor, params.projectId, foundationId),
      listRevisionHistory(actor, params.projectId, foundationId),
      getUserContact(actor.userId),
    ]);
    const summary = history.find((r) => r.id === revisionId);
    if (!project || !foundation || !summary) throw revisionNotFound();
    const key = JSON.stringify([actor.userId, project.code, project.name, project.client, project.site, project.units, project.paperSize, project.updatedAt, foundation, revisionId, history, trail.length]);
    const bytes = await built.get(key, async () => {
      const revision = await getRevision(actor, params.projectId, foundationId, revisionId);
      if (!revision) throw revisionNotFound();
      return new Uint8Array(
        await revisionWorkbookBytes({
          project: { code: project.code, name: project.name, client: project.client, site: project.site, units: project.units, paperSize: project.paperSize },
          foundation: { tag: foundation.tag, machineTrain: foundation.machineTrain, location: foundation.location },
          revision,
          input: revision.input,
          result: revision.result,
          history,
          trail,
          generatedAt: new Date(),
          generatedByName: me?.name ?? "",
        }),
      );
    });
    return new Response(bytes.slice(), {
      headers: {
        "content-type": XLSX_CONTENT_TYPE,
        "content-length": String(bytes.length),
        "content-disposition": attachmentDisposition(packageFileName(project.code, foundation.tag, summary.label)),
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
      },
    });
  },
});
