// Method "piles" (issue 16): a rigid cap (the block) on a group of vertical piles. Single-pile
// head impedance: Gazetas (1991) with the Randolph & Wroth (1978) vertical static stiffness
// (pile-single.ts); group at O with the Dobry & Gazetas (1988) dynamic interaction factors
// (pile-group.ts). The impedance is a full 6 x 6 K(w), C(w): a pile group couples sway and
// rocking (K_x,ry, K_y,rx) and, for an unsymmetric layout, any pair of DOFs.
import type { ImpedanceContext, ImpedanceModel } from "./impedance-model";
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { pileGroupModel } from "./pile-group";
import type { SoilProperties } from "./soil";
import type { PilesImpedanceInput } from "./schema";

/** Density of a reinforced-concrete pile when the input gives none (kg/m^3; recalled, common practice). */
export const PILE_DENSITY_DEFAULT = 2500;
/** Range of Ep/Es over which Gazetas fitted his closed forms (recalled): outside it a warning. */
export const PILE_STIFFNESS_RATIO_RANGE = [100, 10000] as const;
/** Smallest centre-to-centre spacing accepted, in diameters (the interaction factors are for separated shafts; common practice). */
export const PILE_MIN_SPACING_DIAMETERS = 2;
/** Frequencies probed for the passivity warning: from, to (Hz) and the ratio between steps (engine choice, 25 points). */
export const CLAMP_PROBE_HZ = [0.5, 100, 1.247] as const;

export function pileSoilOf(ctx: ImpedanceContext): { shearModulus: number; density: number; poissonRatio: number } {
  return { shearModulus: ctx.soil.shearModulus, density: ctx.soil.density, poissonRatio: ctx.soil.poissonRatio };
}

/** The pile group of an input at soil properties `soil`, heads relative to O. */
function groupOf(input: PilesImpedanceInput, soil: Pick<SoilProperties, "shearModulus" | "density" | "poissonRatio" | "materialDamping">, origin: [number, number]) {
  const spec = {
    diameter: input.diameter,
    length: input.length,
    youngsModulus: input.youngsModulus,
    density: input.pileDensity ?? PILE_DENSITY_DEFAULT,
    tip: input.tip,
    profile: input.soilProfile ?? "uniform",
  } as const;
  const x = Float64Array.from(input.piles, (p) => p.x - origin[0]);
  const y = Float64Array.from(input.piles, (p) => p.y - origin[1]);
  const interaction = (input.interaction ?? "dynamic-factors") === "dynamic-factors";
  return pileGroupModel({ spec, soil: { shearModulus: soil.shearModulus, density: soil.density, poissonRatio: soil.poissonRatio }, geo: { x, y, zh: 0 }, beta: soil.materialDamping, interaction });
}

/**
 * The least eigenvalue of the group's real dynamic stiffness K(w) at O over its largest (a
 * negative value: K has a negative direction at w). The modes are taken with K at the first
 * rotor's rated speed; a negative direction there has no natural frequency, so the input is
 * refused (input-consistency.ts) rather than given a mode at 0 Hz that would pass the
 * separation check.
 */
export function pilesStiffnessSign(input: PilesImpedanceInput, soil: Pick<SoilProperties, "shearModulus" | "density" | "poissonRatio" | "materialDamping">, origin: [number, number], omega: number): number {
  const K = new Float64Array(36);
  const C = new Float64Array(36);
  groupOf(input, soil, origin).evaluate(omega, K, C);
  const m = new Matrix(6, 6);
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) m.set(i, j, K[i * 6 + j] as number);
  const values = new EigenvalueDecomposition(m, { assumeSymmetric: true }).realEigenvalues;
  return Math.min(...values) / Math.max(...values.map(Math.abs));
}

export function pilesImpedance(ctx: ImpedanceContext, input: PilesImpedanceInput, origin: [number, number]): ImpedanceModel {
  const group = groupOf(input, ctx.soil, origin);
  const s = group.single;
  const warnings: string[] = [
    "Piles: the cap-soil contact is ignored (common practice): the cap's base and sidewalls add no stiffness or damping.",
  ];
  if (s.stiffnessRatio < PILE_STIFFNESS_RATIO_RANGE[0] || s.stiffnessRatio > PILE_STIFFNESS_RATIO_RANGE[1]) {
    warnings.push(
      `Piles: Ep/Es = ${s.stiffnessRatio.toFixed(0)} lies outside ${PILE_STIFFNESS_RATIO_RANGE[0]} to ${PILE_STIFFNESS_RATIO_RANGE[1]}, the range of Gazetas' (1991) flexible-pile fits (recalled); the head stiffnesses are extrapolated.`,
    );
  }
  if (ctx.soil.embedmentDepth > 0) {
    warnings.push("Piles: soil.embedmentDepth is not used (the cap-soil contact is ignored).");
  }
  const K = new Float64Array(36);
  const C = new Float64Array(36);
  // where superposition gives negative radiation directions (set to none, pile-group.ts), say so
  const ranges: [number, number][] = [];
  let previous = false;
  for (let f = CLAMP_PROBE_HZ[0]; f <= CLAMP_PROBE_HZ[1] * 1.0001; f *= CLAMP_PROBE_HZ[2]) {
    group.evaluate(2 * Math.PI * f, K, C);
    const now = group.lastRadiationClamp() < 0;
    if (now && previous) (ranges[ranges.length - 1] as [number, number])[1] = f;
    else if (now) ranges.push([f, f]);
    previous = now;
  }
  if (ranges.length) {
    const hz = (f: number) => f.toPrecision(3);
    const where = ranges.map(([a, b]) => (a === b ? `${hz(a)} Hz` : `${hz(a)} to ${hz(b)} Hz`)).join(", ");
    warnings.push(
      `Piles: at ${where} (probed from ${CLAMP_PROBE_HZ[0]} to ${CLAMP_PROBE_HZ[1]} Hz) the group's radiation dashpots from superposition had negative directions (piles moving out of phase cancel each other's waves); those directions are given no radiation damping, never a negative one (the safe side).`,
    );
  }
  const k0 = new Float64Array(36);
  const c0 = new Float64Array(36);
  group.evaluate(0, k0, c0);
  const n = input.piles.length;
  return {
    method: "piles",
    staticStiffness: Array.from({ length: 6 }, (_, i) => k0[i * 7] as number),
    frequencyDependent: true,
    evaluate(omega, k, c) {
      group.evaluate(omega, K, C);
      for (let i = 0; i < 6; i++) {
        k[i] = K[i * 7] as number;
        c[i] = C[i * 7] as number;
      }
    },
    evaluateMatrix(omega, Kout, Cout) {
      group.evaluate(omega, Kout, Cout);
    },
    details: {
      pileCount: n,
      stiffnessRatio: s.stiffnessRatio,
      activeLength: s.activeLength,
      pileVerticalStiffness: s.kv,
      pileLateralStiffness: s.khh,
      pileRockingStiffness: s.kmm,
      pileCrossStiffness: -s.khm,
      interactionShearWaveVelocity: group.interactionVelocity,
      // static group efficiency: group stiffness over n times the single pile (Dobry & Gazetas factors at w = 0)
      groupEfficiencyVertical: (k0[2 * 7] as number) / (n * s.kv),
      groupEfficiencyLateral: (k0[0] as number) / (n * s.khh),
    },
    warnings,
  };
}
