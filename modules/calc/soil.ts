// Soil constants used by the impedance methods.
import type { SoilInput } from "./schema";
import { equivalentProfile, stratumOf, type EquivalentProfile, type Stratum } from "./soil-stratum";

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
  /** A stratum over a rigid base, when the input gives one (else a half-space). */
  stratum?: Stratum;
  /** The equivalent uniform stratum of a layered profile (before the soil-band factor). */
  profile?: EquivalentProfile;
}

/**
 * G from the input, or G = rho Vs^2 (elasticity); with `layers`, G, rho and nu of the
 * equivalent stratum (soil-stratum.ts). `factor` scales G for the soil band.
 */
export function soilProperties(soil: SoilInput, factor = 1): SoilProperties {
  const profile = soil.layers === undefined ? undefined : equivalentProfile(soil.layers, soil.poissonRatio);
  const density = profile?.density ?? soil.density;
  const g0 = profile?.shearModulus ?? soil.shearModulus ?? soil.density * (soil.shearWaveVelocity ?? 0) ** 2;
  const shearModulus = g0 * factor;
  const stratum = stratumOf(soil);
  return {
    shearModulus,
    shearWaveVelocity: Math.sqrt(shearModulus / density),
    poissonRatio: profile?.poissonRatio ?? soil.poissonRatio,
    density,
    materialDamping: soil.materialDamping,
    embedmentDepth: soil.embedmentDepth,
    sidewallContactHeight: soil.sidewallContactHeight,
    ...(stratum ? { stratum } : {}),
    ...(profile ? { profile } : {}),
  };
}
