// Soil constants used by the impedance methods.
import type { SoilInput } from "./schema";

export interface SoilProperties {
  /** Shear modulus G (Pa). */
  shearModulus: number;
  /** Shear-wave velocity Vs = sqrt(G / rho) (m/s). */
  shearWaveVelocity: number;
  poissonRatio: number;
  density: number;
  materialDamping: number;
  /** Depth of the underside below grade, D (m). */
  embedmentDepth: number;
  /** Height of effective sidewall contact, d (m). */
  sidewallContactHeight: number;
}

/** G from the input, or G = rho Vs^2 (elasticity); `factor` scales G for the soil band. */
export function soilProperties(soil: SoilInput, factor = 1): SoilProperties {
  const g0 = soil.shearModulus ?? soil.density * (soil.shearWaveVelocity ?? 0) ** 2;
  const shearModulus = g0 * factor;
  return {
    shearModulus,
    shearWaveVelocity: Math.sqrt(shearModulus / soil.density),
    poissonRatio: soil.poissonRatio,
    density: soil.density,
    materialDamping: soil.materialDamping,
    embedmentDepth: soil.embedmentDepth,
    sidewallContactHeight: soil.sidewallContactHeight,
  };
}
