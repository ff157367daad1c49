import { getFoundation } from "@/db/queries/foundations";
import { getProjectForMember } from "@/db/queries/projects";
import { getRevision, getUserContact, listRevisionHistory, listRevisions } from "@/db/queries/revisions";
import { defineRoute } from "@/app/_lib/route";
import { attachmentDisposition, packageFileName, revisionWorkbookBytes, XLSX_CONTENT_TYPE } from "@/modules/calc-package";
import { idOf, revisionNotFound, type RevisionParams } from "../../revision-params";

export const dynamic = "force-dynamic";

// Building a workbook costs ~100 ms of CPU. The same person asking again for the same
// revision in the same state within a minute gets the bytes already built (the cover's
// "generated" line then shows the first build's time).
const CACHE_TTL_MS = 60_000;
const built = new Map<string, { at: number; bytes: Uint8Array }>();

function cached(key: string): Uint8Array | undefined {
  const hit = built.get(key);
  if (hit && Date.now() - hit.at < CACHE_TTL_MS) return hit.bytes;
  if (hit) built.delete(key);
  return undefined;
}

function remember(key: string, bytes: Uint8Array): void {
  if (built.size >= 100) built.delete(built.keys().next().value as string);
  built.set(key, { at: Date.now(), bytes });
}

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
    const key = JSON.stringify([actor.userId, project.code, project.name, project.client, project.site, project.units, project.updatedAt, foundation, revision.id, history, trail.length]);
    const bytes =
      cached(key) ??
      new Uint8Array(
        await revisionWorkbookBytes({
      project: { code: project.code, name: project.name, client: project.client, site: project.site, units: project.units },
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
    remember(key, bytes);
    return new Response(bytes.slice(), {
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
