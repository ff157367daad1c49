// Role-matrix rows for site measurement records (commissioning). Rows run on the demo's
// PH1-P101 revision of record (its data request went to Corvane Pumps, the demo vendor's own
// company, so an allowed vendor passes the company check too); an allowed POST sends JSON
// where a file is expected and gets a 400, so nothing is stored.
import { permissionMap } from "@/modules/platform/permissions";
import { listRevisions } from "@/db/queries/revisions";
import { listFoundations } from "@/db/queries/projects";
import type { Fixture, MatrixRole } from "../support/fixture";
import type { RouteCase } from "../support/matrix-types";

const BASE = "v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/measurements";

async function pumpRevision(fx: Fixture): Promise<{ projectId: string; foundationId: string; revisionId: string }> {
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const pump = (await listFoundations(manager, fx.projectId)).find((f) => f.tag === "PH1-P101");
  if (!pump) throw new Error("the demo foundation PH1-P101 is missing: was the database seeded?");
  const latest = (await listRevisions(manager, fx.projectId, pump.id)).at(-1);
  if (!latest) throw new Error("PH1-P101 has no revision");
  return { projectId: fx.projectId, foundationId: pump.id, revisionId: latest.id };
}

const readers: MatrixRole[] = [...permissionMap["measurement.read"]];
const adders: MatrixRole[] = [...permissionMap["measurement.create"]];

export const routeCases: RouteCase[] = [
  { route: BASE, method: "GET", allowed: readers, request: async (fx) => ({ params: await pumpRevision(fx) }) },
  { route: BASE, method: "POST", allowed: adders, request: async (fx) => ({ params: await pumpRevision(fx), body: { file: "not a file" } }) },
  { route: `${BASE}/template`, method: "GET", allowed: adders, request: async (fx) => ({ params: await pumpRevision(fx) }) },
  // No such record: an allowed reader gets a 404 after the guard and the company check.
  { route: `${BASE}/[recordId]`, method: "GET", allowed: readers, request: async (fx) => ({ params: { ...(await pumpRevision(fx)), recordId: "00000000-0000-4000-8000-000000000000" } }) },
];
