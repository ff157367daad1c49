// Picks the impedance method of the input.
import type { ImpedanceInput } from "./schema";
import type { ImpedanceContext, ImpedanceModel } from "./impedance-model";
import { equivalentRadiusImpedance } from "./impedance-equivalent-radius";
import { gazetasImpedance } from "./impedance-gazetas";
import { userImpedance } from "./impedance-user";
import { springsImpedance } from "./impedance-springs";
import { pilesImpedance } from "./impedance-piles";

/**
 * The impedance model. `factor` is the soil-band factor: the soil methods receive it through
 * G in ctx.soil; user springs have it applied to their stiffness here.
 */
export function buildImpedance(input: ImpedanceInput, ctx: ImpedanceContext, factor: number): ImpedanceModel {
  switch (input.method) {
    case "equivalent-radius":
      return equivalentRadiusImpedance(ctx);
    case "gazetas":
      return gazetasImpedance(ctx, input.gazetasDynamic ?? "published");
    case "user":
      return userImpedance(ctx, input.stiffness, input.dampingRatio, factor);
    case "springs":
      return springsImpedance(ctx, input.springs, input.dampingRatio, factor, ctx.origin ?? [0, 0]);
    case "piles":
      return pilesImpedance(ctx, input, ctx.origin ?? [0, 0]);
  }
}
