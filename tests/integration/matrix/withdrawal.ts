// Role-matrix rows for withdrawing and restoring a foundation (managers only). Each call
// gets a foundation of its own, so an allowed call never takes a demo foundation away.
import { createFoundation } from "@/db/queries/projects";
import { setFoundationWithdrawn } from "@/db/queries/foundations";
import { permissionMap } from "@/modules/platform/permissions";
import { restoreFoundationAction, withdrawFoundationAction } from "@/app/(desk)/actions";
import type { Fixture } from "../support/fixture";
import type { ActionCase, RouteCase } from "../support/matrix-types";

let n = 0;
async function freshFoundation(fx: Fixture, withdrawn: boolean): Promise<string> {
  n += 1;
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const f = await createFoundation(manager, fx.projectId, { tag: `WD-M-${Date.now()}-${n}`, machineTrain: "Matrix", location: "" });
  if (withdrawn) await setFoundationWithdrawn(manager, fx.projectId, f.id, { withdrawn: true, reason: "matrix set-up" });
  return f.id;
}

const ROUTE = "v1/projects/[projectId]/foundations/[foundationId]/withdrawal";

export const routeCases: RouteCase[] = [
  {
    route: ROUTE,
    method: "POST",
    allowed: [...permissionMap["foundation.withdraw"]],
    request: async (fx) => ({ params: { projectId: fx.projectId, foundationId: await freshFoundation(fx, false) }, body: { reason: "created by mistake" } }),
  },
  {
    route: ROUTE,
    method: "DELETE",
    allowed: [...permissionMap["foundation.withdraw"]],
    request: async (fx) => ({ params: { projectId: fx.projectId, foundationId: await freshFoundation(fx, true) } }),
  },
];

export const actionCases: ActionCase[] = [
  {
    name: "foundation.withdraw",
    action: withdrawFoundationAction,
    allowed: [...permissionMap["foundation.withdraw"]],
    fields: async (fx) => ({ projectId: fx.projectId, foundationId: await freshFoundation(fx, false), reason: "created by mistake" }),
  },
  {
    name: "foundation.restore",
    action: restoreFoundationAction,
    allowed: [...permissionMap["foundation.withdraw"]],
    fields: async (fx) => ({ projectId: fx.projectId, foundationId: await freshFoundation(fx, true) }),
  },
];
