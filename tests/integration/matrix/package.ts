// Role-matrix rows for the calculation-package downloads: the package of a demo revision
// and its PDF rendition (everyone but vendors) and the project register (managers only).
import { listFoundations } from "@/db/queries/projects";
import { listRevisions } from "@/db/queries/revisions";
import { permissionMap } from "@/modules/platform/permissions";
import type { Fixture } from "../support/fixture";
import type { RouteCase } from "../support/matrix-types";

async function demoRevision(fx: Fixture): Promise<Record<string, string>> {
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const foundation = (await listFoundations(manager, fx.projectId)).find((f) => f.tag === "PH1-P101");
  if (!foundation) throw new Error("demo foundation PH1-P101 missing");
  const revision = (await listRevisions(manager, fx.projectId, foundation.id))[0];
  if (!revision) throw new Error("PH1-P101 has no revision");
  return { projectId: fx.projectId, foundationId: foundation.id, revisionId: revision.id };
}

export const routeCases: RouteCase[] = [
  {
    route: "v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/package",
    method: "GET",
    allowed: [...permissionMap["package.export"]],
    request: async (fx) => ({ params: await demoRevision(fx) }),
  },
  {
    route: "v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/package/pdf",
    method: "GET",
    allowed: [...permissionMap["package.export"]],
    request: async (fx) => ({ params: await demoRevision(fx) }),
  },
  { route: "v1/projects/[projectId]/register", method: "GET", allowed: [...permissionMap["register.export"]], request: async (fx) => ({ params: { projectId: fx.projectId } }) },
];
