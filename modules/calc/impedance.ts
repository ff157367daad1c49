// Picks the impedance method of the input.
import type { ImpedanceInput } from "./schema";
import type { ImpedanceContext, ImpedanceModel } from "./impedance-model";
import { equivalentRadiusImpedance } from "./impedance-equivalent-radius";
import { gazetasImpedance } from "./impedance-gazetas";
import { userImpedance } from "./impedance-user";
import { springsImpedance } from "./impedance-springs";
import { pilesImpedance } from "./impedance-piles";
import { congruence, twoStageImpedance } from "./two-stage";
import { springMatrix } from "./impedance-springs";
import type { BaseSupportInput } from "./schema";

/** The soil under a base block: the support's method for the base's footprint at B (two-stage.ts). */
function baseSoilImpedance(support: BaseSupportInput, ctx: ImpedanceContext, factor: number): ImpedanceModel {
  switch (support.method) {
    case "equivalent-radius":
      return equivalentRadiusImpedance(ctx);
    case "gazetas":
      return gazetasImpedance(ctx, support.gazetasDynamic ?? "published");
    case "user":
      return userImpedance(ctx, support.stiffness, support.dampingRatio, factor);
  }
}

/**
 * Springs on a base block: the springs' own model (as on a rigid floor) and the base's soil
 * model, combined into the condensed support of the upper block (two-stage.ts). The soil method
 * sees the base's footprint and the mass on the soil (base and upper block together about B, as
 * the block on soil gives its analog and ratio dashpots the whole mass on the soil).
 */
function twoStageSupport(input: Extract<ImpedanceInput, { method: "springs" }>, ctx: ImpedanceContext, factor: number): ImpedanceModel {
  const bb = ctx.baseBlock;
  if (!bb || !input.base) throw new Error("internal error: springs on a base block without the base's model");
  const origin = ctx.origin ?? [0, 0];
  const springs = springsImpedance(ctx, input.springs, input.dampingRatio, factor, origin);
  const springK = Float64Array.from(springMatrix(input.springs, "k", origin), (v) => v * factor);
  const dampers = input.springs.some((s) => s.cz !== undefined || s.ch !== undefined);
  const springC = dampers ? Float64Array.from(springMatrix(input.springs, "c", origin)) : new Float64Array(36);
  if (!dampers) {
    const k = new Float64Array(6);
    const c = new Float64Array(6);
    springs.evaluate(0, k, c);
    for (let i = 0; i < 6; i++) springC[i * 7] = c[i] as number;
  }
  const T = bb.model.transfer;
  const massOnSoil = congruence(T, bb.upperMass);
  for (let i = 0; i < 36; i++) massOnSoil[i] = (massOnSoil[i] as number) + (bb.model.massMatrix[i] as number);
  const soilCtx: ImpedanceContext = {
    soil: bb.soil,
    base: bb.model.area,
    massDiagonal: [0, 1, 2, 3, 4, 5].map((i) => massOnSoil[i * 7] as number),
    origin: [0, 0],
  };
  const support = input.base.support ?? { method: "gazetas" as const };
  const soil = baseSoilImpedance(support, soilCtx, factor);
  const parts = { base: bb.model, springs, springK, springC, soil, beta: bb.soil.materialDamping, massOnSoil };
  const details: Record<string, number> = {
    ...springs.details,
    baseMass: bb.model.mass,
    baseArea: bb.model.area.area,
    springHeight: bb.model.springHeight,
  };
  return twoStageImpedance(parts, details, [...springs.warnings, ...soil.warnings.map((w) => `Base block: ${w}`)]);
}

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
      if (input.base) return twoStageSupport(input, ctx, factor);
      return springsImpedance(ctx, input.springs, input.dampingRatio, factor, ctx.origin ?? [0, 0]);
    case "piles":
      return pilesImpedance(ctx, input, ctx.origin ?? [0, 0]);
  }
}
