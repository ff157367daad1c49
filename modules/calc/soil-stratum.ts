// A soil layer over a rigid base (issue 13): the equivalent stratum of a layered profile, the
// static stiffness factors of a stratum and the cutoff frequencies below which no radiation
// damping exists.
import type { SoilInput } from "./schema";

/** One equivalent uniform stratum over a rigid base. */
export interface Stratum {
  /** Depth from grade to the rigid base, H (m). */
  thickness: number;
  /** How the values were found: "stratum" (uniform, as given) or "layers" (reduced profile). */
  source: "stratum" | "layers";
}

export interface EquivalentProfile {
  thickness: number;
  /** Travel-time average Vs = sum(h_i) / sum(h_i / Vs_i) (m/s). */
  shearWaveVelocity: number;
  /** Thickness-weighted mean density (kg/m^3). */
  density: number;
  /** Thickness-weighted mean Poisson's ratio (a layer without one takes soil.poissonRatio). */
  poissonRatio: number;
  /** G = rho Vs^2 of the equivalent stratum (Pa). */
  shearModulus: number;
}

/**
 * A layered borehole profile as one uniform stratum over rock. Vs by travel time over the whole
 * depth, Vs = sum h_i / sum (h_i / Vs_i): the averaging rule of the Vs30 site class (ASCE 7-16
 * section 20.4.1, eq. 20.4-1; EN 1998-1 section 3.1.2, eq. 3.1) applied over the depth H to
 * rock instead of 30 m. Density and nu: thickness-weighted means (engine choice; no published
 * rule for these). A layer given by G takes Vs = sqrt(G / rho).
 */
export function equivalentProfile(layers: NonNullable<SoilInput["layers"]>, defaultNu: number): EquivalentProfile {
  let h = 0;
  let travel = 0;
  let rhoH = 0;
  let nuH = 0;
  for (const layer of layers) {
    const vs = layer.shearWaveVelocity ?? Math.sqrt((layer.shearModulus ?? 0) / layer.density);
    h += layer.thickness;
    travel += layer.thickness / vs;
    rhoH += layer.density * layer.thickness;
    nuH += (layer.poissonRatio ?? defaultNu) * layer.thickness;
  }
  const vs = h / travel;
  const density = rhoH / h;
  return { thickness: h, shearWaveVelocity: vs, density, poissonRatio: nuH / h, shearModulus: density * vs * vs };
}

/**
 * Static stiffness factors of a circular footing of radius R on the surface of a stratum of
 * thickness H over a rigid base: Kausel (1974), as tabulated by Gazetas (1983), "Analysis of
 * machine foundation vibrations: state of the art", Soil Dyn. Earthq. Eng. 2(1), Table 1 and
 * Gazetas (1991) ch. 15 (recalled from memory, not read from the source in hand):
 * vertical 1 + 1.28 R/H, horizontal 1 + R/(2H), rocking 1 + R/(6H); torsion: no factor is
 * applied (left at 1, stated in CONVENTIONS.md). H -> infinity gives the half-space (factor 1).
 */
export const stratumFactorVertical = (R: number, H: number) => 1 + (1.28 * R) / H;
export const stratumFactorHorizontal = (R: number, H: number) => 1 + R / (2 * H);
export const stratumFactorRocking = (R: number, H: number) => 1 + R / (6 * H);

/** Lysmer's analog velocity V_La = 3.4 Vs / (pi (1 - nu)) (Gazetas 1991). */
export const lysmerAnalogVelocity = (Vs: number, nu: number) => (3.4 * Vs) / (Math.PI * (1 - nu));

export interface StratumCutoffs {
  /** Cutoff of the vertical and rocking modes, f_c = V_La / (4 H) (Hz). */
  compression: number;
  /** Cutoff of the swaying and torsion modes, f_c = Vs / (4 H) (Hz). */
  shear: number;
}

/**
 * Cutoff frequencies of a stratum over rigid base (Gazetas 1991, ch. 15; Kausel & Roesset): below
 * them no surface or body wave carries energy away, so the radiation dashpot is 0 and only
 * material damping remains. Vertical and rocking: V_La / 4H; swaying and torsion: Vs / 4H.
 */
export function stratumCutoffs(Vs: number, nu: number, H: number): StratumCutoffs {
  return { compression: lysmerAnalogVelocity(Vs, nu) / (4 * H), shear: Vs / (4 * H) };
}

/** Cutoff (Hz) per DOF x, y, z, rx, ry, rz. */
export function cutoffPerDof(c: StratumCutoffs): number[] {
  return [c.shear, c.shear, c.compression, c.compression, c.compression, c.shear];
}

/** The stratum of the input, if any: `stratum` as given, or the total depth of `layers`. */
export function stratumOf(soil: SoilInput): Stratum | undefined {
  if (soil.layers !== undefined) {
    return { thickness: soil.layers.reduce((sum, l) => sum + l.thickness, 0), source: "layers" };
  }
  if (soil.stratum !== undefined) return { thickness: soil.stratum.thickness, source: "stratum" };
  return undefined;
}

/** A frequency counts as near a cutoff when within this fraction of it (engine choice, = the default separation). */
export const CUTOFF_PROXIMITY = 0.2;
