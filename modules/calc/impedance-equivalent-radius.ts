// Equivalent-radius half-space springs (Richart, Hall & Woods 1970, ch. 10) with Lysmer's
// analog damping (Lysmer 1965 vertical; Hall 1967 horizontal and rocking; RHW 1970 ch. 7) and
// the embedment factors of Arya, O'Neill & Pincus (1979) (recalled from memory).
import { prefixed, stratumDetails, stratumWarnings } from "./impedance-gazetas";
import {
  constantImpedance,
  dashpotFromRatio,
  type ImpedanceContext,
  type ImpedanceModel,
} from "./impedance-model";
import {
  cutoffPerDof,
  stratumCutoffs,
  stratumFactorHorizontal,
  stratumFactorRocking,
  stratumFactorVertical,
} from "./soil-stratum";

export interface EquivalentRadii {
  /** Translations: circle of the same area, r0 = sqrt(A / pi). */
  translation: number;
  /** Rocking about x: same moment of area, r0 = (4 I_x / pi)^(1/4). */
  rockingX: number;
  /** Rocking about y: r0 = (4 I_y / pi)^(1/4). */
  rockingY: number;
  /** Torsion: same polar moment, r0 = (2 J / pi)^(1/4). */
  torsion: number;
}

/**
 * Equivalent radii from the contact area and its second moments (RHW 1970). For a B x L
 * rectangle these equal sqrt(B L / pi), (B L^3 / (3 pi))^(1/4) and (B L (B^2 + L^2) / (6 pi))^(1/4).
 */
export function equivalentRadii(area: number, momentAboutX: number, momentAboutY: number): EquivalentRadii {
  return {
    translation: Math.sqrt(area / Math.PI),
    rockingX: ((4 * momentAboutX) / Math.PI) ** 0.25,
    rockingY: ((4 * momentAboutY) / Math.PI) ** 0.25,
    torsion: ((2 * (momentAboutX + momentAboutY)) / Math.PI) ** 0.25,
  };
}

// Rigid circular footing on an elastic half-space (RHW 1970, ch. 10).
export const halfSpaceVertical = (G: number, nu: number, r0: number) => (4 * G * r0) / (1 - nu);
export const halfSpaceHorizontal = (G: number, nu: number, r0: number) => (32 * (1 - nu) * G * r0) / (7 - 8 * nu);
export const halfSpaceRocking = (G: number, nu: number, r0: number) => (8 * G * r0 ** 3) / (3 * (1 - nu));
export const halfSpaceTorsion = (G: number, r0: number) => (16 * G * r0 ** 3) / 3;

// Lysmer's analog mass ratios and damping ratios (Lysmer 1965; Hall 1967; RHW 1970).
export const massRatioVertical = (nu: number, m: number, rho: number, r0: number) => ((1 - nu) * m) / (4 * rho * r0 ** 3);
export const dampingVertical = (Bz: number) => 0.425 / Math.sqrt(Bz);
export const massRatioHorizontal = (nu: number, m: number, rho: number, r0: number) =>
  ((7 - 8 * nu) * m) / (32 * (1 - nu) * rho * r0 ** 3);
export const dampingHorizontal = (Bx: number) => 0.288 / Math.sqrt(Bx);
export const massRatioRocking = (nu: number, I: number, rho: number, r0: number) => (3 * (1 - nu) * I) / (8 * rho * r0 ** 5);
export const dampingRocking = (Bpsi: number) => 0.15 / ((1 + Bpsi) * Math.sqrt(Bpsi));
export const massRatioTorsion = (I: number, rho: number, r0: number) => I / (rho * r0 ** 5);
export const dampingTorsion = (Btheta: number) => 0.5 / (1 + 2 * Btheta);

export interface EmbedmentFactors {
  stiffness: number;
  damping: number;
}

// Embedment factors, Arya, O'Neill & Pincus (1979) (recalled from memory); h = embedment depth.
export function embedmentVertical(nu: number, hOverR: number): EmbedmentFactors {
  const eta = 1 + 0.6 * (1 - nu) * hOverR;
  return { stiffness: eta, damping: (1 + 1.9 * (1 - nu) * hOverR) / Math.sqrt(eta) };
}
export function embedmentHorizontal(nu: number, hOverR: number): EmbedmentFactors {
  const eta = 1 + 0.55 * (2 - nu) * hOverR;
  return { stiffness: eta, damping: (1 + 1.9 * (2 - nu) * hOverR) / Math.sqrt(eta) };
}
export function embedmentRocking(nu: number, hOverR: number): EmbedmentFactors {
  const eta = 1 + 1.2 * (1 - nu) * hOverR + 0.2 * (2 - nu) * hOverR ** 3;
  return { stiffness: eta, damping: (1 + 0.7 * (1 - nu) * hOverR + 0.6 * (2 - nu) * hOverR ** 3) / Math.sqrt(eta) };
}

export function equivalentRadiusImpedance(ctx: ImpedanceContext): ImpedanceModel {
  const { shearModulus: G, poissonRatio: nu, density: rho, embedmentDepth: h } = ctx.soil;
  const r = equivalentRadii(ctx.base.area, ctx.base.momentAboutX, ctx.base.momentAboutY);
  const [m, , , Ixx, Iyy, Izz] = ctx.massDiagonal as [number, number, number, number, number, number];

  const kSurface = [
    halfSpaceHorizontal(G, nu, r.translation),
    halfSpaceHorizontal(G, nu, r.translation),
    halfSpaceVertical(G, nu, r.translation),
    halfSpaceRocking(G, nu, r.rockingX),
    halfSpaceRocking(G, nu, r.rockingY),
    halfSpaceTorsion(G, r.torsion),
  ];
  const massRatio = [
    massRatioHorizontal(nu, m, rho, r.translation),
    massRatioHorizontal(nu, m, rho, r.translation),
    massRatioVertical(nu, m, rho, r.translation),
    massRatioRocking(nu, Ixx, rho, r.rockingX),
    massRatioRocking(nu, Iyy, rho, r.rockingY),
    massRatioTorsion(Izz, rho, r.torsion),
  ] as const;
  const dSurface = [
    dampingHorizontal(massRatio[0]),
    dampingHorizontal(massRatio[1]),
    dampingVertical(massRatio[2]),
    dampingRocking(massRatio[3]),
    dampingRocking(massRatio[4]),
    dampingTorsion(massRatio[5]),
  ];
  // Torsion has no embedment factor in Arya, O'Neill & Pincus (1979): left unfactored.
  const factors: EmbedmentFactors[] = [
    embedmentHorizontal(nu, h / r.translation),
    embedmentHorizontal(nu, h / r.translation),
    embedmentVertical(nu, h / r.translation),
    embedmentRocking(nu, h / r.rockingX),
    embedmentRocking(nu, h / r.rockingY),
    { stiffness: 1, damping: 1 },
  ];
  // A stratum over rigid base: Kausel's circular factors on the static springs (soil-stratum.ts),
  // each with its own equivalent radius; torsion unfactored. The damping ratios keep the
  // half-space dashpots above the cutoffs and drop to 0 below them.
  const stratum = ctx.soil.stratum;
  const H = stratum?.thickness ?? Infinity;
  const strat = stratum
    ? [
        stratumFactorHorizontal(r.translation, H),
        stratumFactorHorizontal(r.translation, H),
        stratumFactorVertical(r.translation, H),
        stratumFactorRocking(r.rockingX, H),
        stratumFactorRocking(r.rockingY, H),
        1,
      ]
    : [1, 1, 1, 1, 1, 1];
  const stiffness = kSurface.map((k, i) => k * (factors[i] as EmbedmentFactors).stiffness * (strat[i] as number));
  const ratio = dSurface.map((d, i) => d * (factors[i] as EmbedmentFactors).damping);
  // The dashpot is that of the half-space base (without the stratum factor on k), so that the
  // stratum raises the stiffness without raising the radiated energy above the cutoff.
  const dashpot = kSurface.map((k, i) =>
    dashpotFromRatio(ratio[i] as number, k * (factors[i] as EmbedmentFactors).stiffness, ctx.massDiagonal[i] as number),
  );
  const warnings: string[] = [];
  if (h > 0) {
    warnings.push(
      "Embedment factors of Arya, O'Neill & Pincus (1979) (recalled from memory) applied to x, y, z, rx, ry; torsion has no embedment factor there and is left unfactored.",
    );
  }
  const details: Record<string, number> = {
    r0Translation: r.translation,
    r0RockingX: r.rockingX,
    r0RockingY: r.rockingY,
    r0Torsion: r.torsion,
    massRatioX: massRatio[0],
    massRatioY: massRatio[1],
    massRatioZ: massRatio[2],
    massRatioRx: massRatio[3],
    massRatioRy: massRatio[4],
    massRatioRz: massRatio[5],
    ...prefixed("embedmentFactor", factors.map((f) => f.stiffness)),
  };
  if (!stratum) return constantImpedance("equivalent-radius", stiffness, dashpot, details, warnings);
  const cutoffHz = cutoffPerDof(stratumCutoffs(ctx.soil.shearWaveVelocity, nu, H));
  warnings.push(...stratumWarnings(H, r.translation, h, "Equivalent radius"));
  return {
    method: "equivalent-radius",
    staticStiffness: stiffness,
    frequencyDependent: true,
    evaluate(omega, k, c) {
      const hz = omega / (2 * Math.PI);
      for (let i = 0; i < 6; i++) {
        k[i] = stiffness[i] as number;
        c[i] = hz < (cutoffHz[i] as number) ? 0 : (dashpot[i] as number);
      }
    },
    details: { ...details, ...prefixed("stratumFactor", strat), ...stratumDetails(ctx, cutoffHz) },
    warnings,
  };
}
