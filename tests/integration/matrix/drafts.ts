// Role-matrix rows for the foundation, draft and calculate routes; allowed roles come
// from the permission map so the rows follow it.
import { getDraft } from "@/db/queries/drafts";
import { permissionMap } from "@/modules/platform/permissions";
import type { Fixture, MatrixRole } from "../support/fixture";
import type { RouteCase } from "../support/matrix-types";
import { sampleAnalysisInput } from "../analysis-input-sample";

const signedIn: MatrixRole[] = ["outsider", "admin", "manager", "designer", "checker", "vendor", "viewer"];

function foundationParams(fx: Fixture): { projectId: string; foundationId: string } {
  const foundationId = fx.foundationIds[0];
  if (!foundationId) throw new Error("the demo project has no foundation");
  return { projectId: fx.projectId, foundationId };
}

/**
 * Saves the stored input again at its current version, so an allowed save succeeds and
 * the demo draft keeps its content; with no draft yet, it creates one from the sample.
 */
async function resaveBody(fx: Fixture): Promise<{ version: number; input: unknown }> {
  const p = foundationParams(fx);
  const draft = await getDraft({ userId: fx.userIds.manager, isAdmin: false }, p.projectId, p.foundationId);
  if (!draft) throw new Error("the manager cannot read the demo foundation's draft");
  return { version: draft.version, input: draft.input ?? sampleAnalysisInput() };
}

export const routeCases: RouteCase[] = [
  {
    route: "v1/projects/[projectId]/foundations/[foundationId]",
    method: "GET",
    allowed: [...permissionMap["foundation.read"]],
    request: async (fx) => ({ params: foundationParams(fx) }),
  },
  // The live draft is the design team's: the client (viewer) is refused (issue 18, item 5).
  {
    route: "v1/projects/[projectId]/foundations/[foundationId]/draft",
    method: "GET",
    allowed: [...permissionMap["draft.read"]],
    request: async (fx) => ({ params: foundationParams(fx) }),
  },
  {
    route: "v1/projects/[projectId]/foundations/[foundationId]/draft",
    method: "PUT",
    allowed: [...permissionMap["draft.edit"]],
    request: async (fx) => ({ params: foundationParams(fx), body: await resaveBody(fx) }),
  },
  {
    route: "v1/calculate",
    method: "POST",
    allowed: signedIn,
    request: async () => ({ params: {}, body: sampleAnalysisInput() }),
  },
  {
    route: "v1/engine",
    method: "GET",
    allowed: signedIn,
    request: async () => ({ params: {} }),
  },
];
