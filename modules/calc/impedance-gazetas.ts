// Gazetas (1991), "Formulas and charts for impedances of surface and embedded foundations",
// J. Geotech. Eng. ASCE 117(9): static stiffness of the base enclosed in a 2L x 2B rectangle
// (L >= B, x along L, y along B), embedment factors, dynamic multipliers and radiation dashpots.
// The coefficients Gazetas gives only as charts are read from his charts (digitised, see
// gazetas-charts.ts) by default; the closed forms of Pais & Kausel (1988, NIST GCR 12-917-21
// 2012 Table 2-3a) stay as the named option impedance.gazetasDynamic = "pais-kausel", and the
// old simplified variant (k = 1, c = 1) as "simplified", warned.
import { GAZETAS_A0_LIMIT, GAZETAS_MULTIPLIER_FLOOR } from "./criteria-defaults";
import { CHART_A0_MAX, chartDashpotCoefficients, chartStiffnessCoefficients, chartsBeyondAspect } from "./gazetas-charts";
import { type ImpedanceContext, type ImpedanceModel } from "./impedance-model";
import {
  cutoffPerDof,
  lysmerAnalogVelocity,
  stratumCutoffs,
  stratumFactorHorizontal,
  stratumFactorRocking,
  stratumFactorVertical,
} from "./soil-stratum";

/** Base quantities in Gazetas' notation. */
export interface GazetasBase {
  /** Half-length (long side) and half-width (short side), m. */
  L: number;
  B: number;
  /** Actual contact area A_b (m^2). */
  area: number;
  /** Moment of area about the long (x) axis, about the short (y) axis, and polar (m^4). */
  Ibx: number;
  Iby: number;
  Jt: number;
}

/** Gazetas' static stiffness in his own axes (x along L): x, y, z, rx, ry, t. */
export interface GazetasStiffness {
  x: number;
  y: number;
  z: number;
  rx: number;
  ry: number;
  t: number;
}

/** Surface static stiffness, Gazetas (1991) Table 1. */
export function gazetasSurfaceStiffness(G: number, nu: number, b: GazetasBase): GazetasStiffness {
  const { L, B } = b;
  const chi = b.area / (4 * L * L);
  const z = ((2 * G * L) / (1 - nu)) * (0.73 + 1.54 * chi ** 0.75);
  const y = ((2 * G * L) / (2 - nu)) * (2 + 2.5 * chi ** 0.85);
  const x = y - (0.2 / (0.75 - nu)) * G * L * (1 - B / L);
  const rx = (G / (1 - nu)) * b.Ibx ** 0.75 * (L / B) ** 0.25 * (2.4 + 0.5 * (B / L));
  const ry = ((3 * G) / (1 - nu)) * b.Iby ** 0.75 * (L / B) ** 0.15;
  // Torsion (recalled from memory).
  const t = G * b.Jt ** 0.75 * (4 + 11 * (1 - B / L) ** 10);
  return { x, y, z, rx, ry, t };
}

/**
 * Embedment factors, Gazetas (1991) Table 2; D depth of the underside below grade, d sidewall
 * contact height, h = D - d/2, A_w = sidewall contact area of the 2L x 2B rectangle.
 * Each form below is the one stated the same way by a second published statement (an
 * open-source geotechnical library, geofound, that cites Gazetas 1991 and ATC-40); the paper's
 * own table is recalled, not read. Where statements differ, CONVENTIONS.md gives the other:
 * - K_x,emb (swaying along the long side): (1 + 0.15 (D/B)^0.5)(1 + 0.52 (h A_w / (L B^2))^0.4);
 *   the y form uses B L^2 in that ratio (not the same factor for x and y).
 * - K_ry,emb first term 0.92 (d/L)^0.6 and inner term (d/L)^1.9 (d/D)^-0.6: the paper's form
 *   (also in ATC-40, per that library); geofound itself uses (d/B)^0.6 and Mylonakis et al.
 *   (2006) state (d/D)^1.9 (B/L)^-0.6 inside: both in gazetasRyEmbedmentAlternatives.
 * - K_t,emb: recalled from memory (no second statement found).
 */
export function gazetasEmbedmentFactors(b: GazetasBase, D: number, d: number): GazetasStiffness {
  const { L, B } = b;
  const chi = b.area / (4 * L * L);
  const h = D - d / 2;
  const Aw = 4 * (L + B) * d;
  const hasWall = d > 0 && D > 0;
  const z = (1 + (D / (21 * B)) * (1 + 1.3 * chi)) * (1 + 0.2 * (Aw / b.area) ** (2 / 3));
  const y = (1 + 0.15 * Math.sqrt(D / B)) * (1 + 0.52 * ((h * Aw) / (B * L * L)) ** 0.4);
  const x = (1 + 0.15 * Math.sqrt(D / B)) * (1 + 0.52 * ((h * Aw) / (L * B * B)) ** 0.4);
  const rx = hasWall ? 1 + 1.26 * (d / B) * (1 + (d / B) * (d / D) ** -0.2 * Math.sqrt(B / L)) : 1;
  const ry = hasWall ? 1 + 0.92 * (d / L) ** 0.6 * (1.5 + (d / L) ** 1.9 * (d / D) ** -0.6) : 1;
  const t = hasWall ? 1 + 1.4 * (1 + B / L) * (d / B) ** 0.9 : 1;
  return { x, y, z, rx, ry, t };
}

/** The two other published statements of K_ry,emb (see gazetasEmbedmentFactors), for comparison only. */
export function gazetasRyEmbedmentAlternatives(b: GazetasBase, D: number, d: number): { firstTermOverB: number; mylonakis2006: number } {
  const { L, B } = b;
  if (!(d > 0 && D > 0)) return { firstTermOverB: 1, mylonakis2006: 1 };
  return {
    firstTermOverB: 1 + 0.92 * (d / B) ** 0.6 * (1.5 + (d / L) ** 1.9 * (d / D) ** -0.6),
    mylonakis2006: 1 + 0.92 * (d / B) ** 0.6 * (1.5 + (d / D) ** 1.9 * (B / L) ** -0.6),
  };
}

/**
 * Source of the chart-only coefficients k_z, k_y, c_z, c_y, c_rx, c_ry, c_t:
 * "published" (default) Gazetas' own charts, digitised; "pais-kausel" the closed forms of Pais &
 * Kausel (1988); "simplified" k = 1, c = 1 (warned).
 */
export type GazetasDynamic = "published" | "pais-kausel" | "simplified";

/** Where the dynamic coefficients of each variant come from, in the words shown on the desk and in the package. */
export const GAZETAS_DYNAMIC_SOURCES: Record<GazetasDynamic, string> = {
  published:
    "Gazetas (1991) charts (Table 1 graphs of k_z, k_y, c_z, c_y, c_rx, c_ry, c_t), as digitised in the open-source geofound library (MIT licence); k_x, k_rx, k_ry, k_t and c_x from Gazetas' Table 1 formulas",
  "pais-kausel":
    "Closed forms of Pais & Kausel (1988) as reprinted in NIST GCR 12-917-21 (2012) Table 2-3a for k_z, k_y, c_rx, c_ry, c_t (c_z = c_y = 1); k_x, k_rx, k_ry, k_t from Gazetas (1991) Table 1",
  simplified: "Simplified: k_z = k_y = 1 and every radiation dashpot coefficient 1 (Lysmer-analog limit; overstates rocking damping at low a0, warned)",
};

/**
 * Dynamic stiffness multipliers k(a0), a0 = w B / Vs, of the surface base (L/B = aspect >= 1).
 * - k_x = 1, k_rx = 1 - 0.20 a0, k_ry = 1 - 0.30 a0 (nu < 0.45) or 1 - 0.25 a0 (L/B)^0.3
 *   (nu >= 0.45), k_t = 1 - 0.14 a0: Gazetas (1991) Table 1 closed forms (the nu >= 0.45 form
 *   also stated by geofound); the charts have no graph for these.
 * - "published": k_z and k_y read from Gazetas' (1991) Table 1 graphs (gazetas-charts.ts).
 * - "pais-kausel": k_y = 1 and k_z = 1 - (0.4 + 0.2/(L/B)) a0^2 / (10/(1 + 3(L/B - 1)) + a0^2),
 *   the closed forms of Pais & Kausel (1988), reprinted in NIST GCR 12-917-21 (2012) Table 2-3a.
 * - "simplified": k_z = k_y = 1 and k_ry = 1 - 0.30 a0 for every nu (the engine before issue 13).
 * Each is floored at a small positive value.
 */
export function gazetasDynamicMultipliers(a0: number, aspect = 1, nu = 0.3, variant: GazetasDynamic = "published"): GazetasStiffness {
  const floor = (v: number) => Math.max(v, GAZETAS_MULTIPLIER_FLOOR);
  if (variant === "simplified") {
    return { x: 1, y: 1, z: 1, rx: floor(1 - 0.2 * a0), ry: floor(1 - 0.3 * a0), t: floor(1 - 0.14 * a0) };
  }
  const ry = nu < 0.45 ? 1 - 0.3 * a0 : 1 - 0.25 * a0 * aspect ** 0.3;
  const common = { x: 1, rx: floor(1 - 0.2 * a0), ry: floor(ry), t: floor(1 - 0.14 * a0) };
  if (variant === "pais-kausel") {
    const a2 = a0 * a0;
    const z = 1 - ((0.4 + 0.2 / aspect) * a2) / (10 / (1 + 3 * (aspect - 1)) + a2);
    return { ...common, y: 1, z: floor(z) };
  }
  const chart = chartStiffnessCoefficients(a0, aspect, nu);
  return { ...common, y: floor(chart.y), z: floor(chart.z) };
}

/**
 * Vertical dynamic stiffness multiplier of the embedded base over the surface base's k_z(a0),
 * Gazetas (1991) Table 2 (recalled; the same forms are stated by eng-tools/geofound,
 * calc_vert_via_gazetas_1991): fully embedded (sidewall contact over the whole depth)
 * 1 - 0.09 (D/B)^(3/4) a0^2, in a trench (no sidewall contact) 1 + 0.09 (D/B)^(3/4) a0^2, linear
 * in d/D between (as geofound interpolates). B is the half-width. 1 at the surface (D = 0).
 * Held at a0 = 2 beyond (CHART_A0_MAX, where the charts are held too): the quadratic fit is not
 * extrapolated past the range it was drawn for.
 */
export function gazetasEmbeddedVerticalFactor(a0: number, D: number, B: number, d: number): number {
  if (!(D > 0)) return 1;
  const a = Math.min(a0, CHART_A0_MAX);
  const t = 0.09 * (D / B) ** 0.75 * a * a;
  const contact = Math.min(Math.max(d / D, 0), 1);
  return 1 + t - 2 * t * contact;
}

/**
 * Radiation dashpot coefficients c(a0) of the surface base, C = rho V A c.
 * "published" (default): c_z, c_y, c_rx, c_ry, c_t read from Gazetas' (1991) Table 1 graphs
 * (gazetas-charts.ts; c_z between its nu <= 0.4 and nu -> 0.5 graphs), c_x = 1 (Gazetas gives
 * C_x = rho Vs A_b without a graph).
 * "pais-kausel": the frequency functions of the Pais & Kausel (1988) radiation damping ratios,
 * NIST GCR 12-917-21 (2012) Table 2-3a, written as Gazetas' c (C = 2 beta K / w, K cancels):
 * c_z = c_x = c_y = 1; c_rx = a0^2 / (2.2 - 0.4/(L/B)^3 + a0^2);
 * c_ry = a0^2 / (1.8/(1 + 1.75 (L/B - 1)) + a0^2); c_t = a0^2 / (1.4/(1 + 3 (L/B - 1)^0.7) + a0^2).
 * The rocking and torsion coefficients vanish as a0 -> 0 (little rocking radiation at low
 * frequency). Pais & Kausel radiate the vertical and rocking waves at psi Vs, psi =
 * sqrt(2(1 - nu)/(1 - 2 nu)) <= 2.5; the engine keeps Gazetas' V_La, lower for every nu (less
 * damping: the safe side). "simplified": every c = 1 (Lysmer-analog limit).
 */
export function gazetasRadiationCoefficients(a0: number, aspect: number, variant: GazetasDynamic = "published", nu = 0.3): GazetasStiffness {
  if (variant === "simplified") return { x: 1, y: 1, z: 1, rx: 1, ry: 1, t: 1 };
  if (variant === "published") return { x: 1, ...chartDashpotCoefficients(a0, aspect, nu) };
  const a2 = a0 * a0;
  return {
    x: 1,
    y: 1,
    z: 1,
    rx: a2 / (2.2 - 0.4 / aspect ** 3 + a2),
    ry: a2 / (1.8 / (1 + 1.75 * (aspect - 1)) + a2),
    t: a2 / (1.4 / (1 + 3 * (aspect - 1) ** 0.7) + a2),
  };
}

/** Pais & Kausel's radiation velocity factor psi = sqrt(2(1 - nu)/(1 - 2 nu)) <= 2.5 (NIST 2012 Table 2-3a). */
export const paisKauselPsi = (nu: number) => Math.min(Math.sqrt((2 * (1 - nu)) / (1 - 2 * nu)), 2.5);

export { lysmerAnalogVelocity };

/**
 * Radiation dashpots at their high-frequency (Lysmer-analog) values, Gazetas (1991):
 * C_z = rho V_La A_b, C_y = C_x = rho Vs A_b, C_rx = rho V_La I_bx, C_ry = rho V_La I_by,
 * C_t = rho Vs J_t; the coefficient c(a0) multiplies each.
 */
export function gazetasDashpots(rho: number, Vs: number, nu: number, b: GazetasBase): GazetasStiffness {
  const vla = lysmerAnalogVelocity(Vs, nu);
  return {
    x: rho * Vs * b.area,
    y: rho * Vs * b.area,
    z: rho * vla * b.area,
    rx: rho * vla * b.Ibx,
    ry: rho * vla * b.Iby,
    t: rho * Vs * b.Jt,
  };
}

/**
 * Sidewall dashpots of an embedded base, Gazetas (1991) Table 2 (recalled; the same forms are
 * stated by geofound), d = sidewall contact height, D = embedment depth:
 * - vertical: rho Vs A_w, A_w = 4 (L + B) d (all four walls in shear);
 * - swaying along y: rho Vs A_ws + rho V_La A_wc with the shear walls A_ws = 4 B d (the short
 *   walls, parallel to the motion) and the compression walls A_wc = 4 L d; along x the other way;
 * - rocking about x: rho V_La I_wce c1, I_wce = 4 L d^3 / 3 (the two long walls, 2L wide, about
 *   the base axis), c1 = 0.25 + 0.65 sqrt(a0) (d/D)^(-a0/2) (D/B)^(-1/4); about y: I_wce =
 *   4 B d^3 / 3 and (D/L)^(-1/4); c1 held at a0 = 2 beyond (the charts' range). The shear walls' rocking term and a torsion wall term are NOT
 *   added (less damping than the paper: the safe side; stated in CONVENTIONS.md).
 */
export function gazetasSidewallDashpots(rho: number, Vs: number, nu: number, b: GazetasBase, D: number, d: number, a0: number): GazetasStiffness {
  if (!(d > 0 && D > 0)) return { x: 0, y: 0, z: 0, rx: 0, ry: 0, t: 0 };
  const { L, B } = b;
  const vla = lysmerAnalogVelocity(Vs, nu);
  // c1 is held at its value at the charts' largest a0 (CHART_A0_MAX = 2) beyond it, as the
  // charts' coefficients are (engine 1.9.0): for a wall far thinner than the embedment
  // I_wce (d/D)^(-a0/2) ~ d^(3 - a0/2) grows without bound once a0 passes 6, which gave
  // dashpots of 1e288 and a singular solve (found by the property test); held, it is at most
  // ~ d^2 D, and the damping beyond a0 = 2 is never more than the paper's (the safe side).
  // I_wce c1 in log form: (d/D)^(-a/2) alone can overflow while the product with I_wce stays
  // small; a term that still overflows is dropped, leaving 0.25 I (less damping).
  const a = Math.min(a0, CHART_A0_MAX);
  const wallTerm = (I: number, span: number) => {
    if (I === 0) return 0;
    const dynamic = 0.65 * Math.sqrt(a) * (D / span) ** -0.25 * Math.exp(Math.log(I) - (a / 2) * Math.log(d / D));
    return 0.25 * I + (Number.isFinite(dynamic) ? dynamic : 0);
  };
  return {
    x: rho * Vs * 4 * L * d + rho * vla * 4 * B * d,
    y: rho * Vs * 4 * B * d + rho * vla * 4 * L * d,
    z: rho * Vs * 4 * (L + B) * d,
    rx: rho * vla * wallTerm((4 * L * d ** 3) / 3, B),
    ry: rho * vla * wallTerm((4 * B * d ** 3) / 3, L),
    t: 0,
  };
}

/**
 * Stratum factors for the Gazetas method: Kausel's circular-footing factors (soil-stratum.ts)
 * with the equivalent radii of the 2L x 2B rectangle (area for x, y, z; moment of area for rx,
 * ry); torsion 1. Engine choice, stated in CONVENTIONS.md: Gazetas' own rectangular stratum fits
 * were not in hand.
 */
export function gazetasStratumFactors(b: GazetasBase, H: number): GazetasStiffness {
  const rA = Math.sqrt(b.area / Math.PI);
  const rRx = ((4 * b.Ibx) / Math.PI) ** 0.25;
  const rRy = ((4 * b.Iby) / Math.PI) ** 0.25;
  return {
    x: stratumFactorHorizontal(rA, H),
    y: stratumFactorHorizontal(rA, H),
    z: stratumFactorVertical(rA, H),
    rx: stratumFactorRocking(rRx, H),
    ry: stratumFactorRocking(rRy, H),
    t: 1,
  };
}

/** Relative difference of the half-sides below which the base counts as square (L along x). */
const SQUARE_TOLERANCE = 1e-9;

/** Gazetas' axes onto ours: index into [x, y, z, rx, ry, t] for each of our x, y, z, rx, ry, rz. */
function axisMap(longAlongX: boolean): (keyof GazetasStiffness)[] {
  return longAlongX ? ["x", "y", "z", "rx", "ry", "t"] : ["y", "x", "z", "ry", "rx", "t"];
}

export function gazetasBaseFromContact(ctx: ImpedanceContext): { base: GazetasBase; longAlongX: boolean } {
  const hx = (ctx.base.bounds.x[1] - ctx.base.bounds.x[0]) / 2;
  const hy = (ctx.base.bounds.y[1] - ctx.base.bounds.y[0]) / 2;
  // A square base has no long side; a relative tolerance keeps the choice (L along x) stable
  // under round-off, since Gazetas' K_rx and K_ry differ by about 3 % even when L = B.
  const longAlongX = hx >= hy * (1 - SQUARE_TOLERANCE);
  const L = Math.max(hx, hy);
  const B = Math.min(hx, hy);
  // Rectangle formulas of the enclosing 2L x 2B rectangle (Gazetas 1991).
  const Ibx = (2 * L * (2 * B) ** 3) / 12;
  const Iby = (2 * B * (2 * L) ** 3) / 12;
  return { base: { L, B, area: ctx.base.area, Ibx, Iby, Jt: Ibx + Iby }, longAlongX };
}

export function gazetasImpedance(ctx: ImpedanceContext, variant: GazetasDynamic = "published"): ImpedanceModel {
  const { shearModulus: G, poissonRatio: nu, density: rho, shearWaveVelocity: Vs } = ctx.soil;
  const D = ctx.soil.embedmentDepth;
  const d = ctx.soil.sidewallContactHeight;
  const { base, longAlongX } = gazetasBaseFromContact(ctx);
  const aspect = base.L / base.B;
  const surface = gazetasSurfaceStiffness(G, nu, base);
  const emb = gazetasEmbedmentFactors(base, D, d);
  const stratum = ctx.soil.stratum;
  const strat = stratum ? gazetasStratumFactors(base, stratum.thickness) : { x: 1, y: 1, z: 1, rx: 1, ry: 1, t: 1 };
  const dash = gazetasDashpots(rho, Vs, nu, base);
  const map = axisMap(longAlongX);
  const staticStiffness = map.map((key) => surface[key] * emb[key] * strat[key]);
  const cutoffHz = stratum ? cutoffPerDof(stratumCutoffs(Vs, nu, stratum.thickness)) : undefined;
  const warnings: string[] = [];
  if (variant === "simplified") {
    warnings.push(
      "Gazetas (1991), simplified dynamic coefficients (impedance.gazetasDynamic = \"simplified\"): the dynamic stiffness multipliers k_z and k_y are taken as 1.",
      "Gazetas (1991), simplified dynamic coefficients: the radiation dashpot coefficients c_z, c_y, c_rx, c_ry, c_t are taken at their Lysmer-analog limit 1 (rocking damping is overestimated at low a0: the unsafe side).",
    );
  }
  if (variant === "published") {
    const beyond = chartsBeyondAspect(aspect, nu);
    if (beyond.length) {
      warnings.push(
        `Gazetas (1991) charts: L/B = ${aspect.toFixed(2)} lies beyond the largest digitised curve of ${beyond.map((b) => `${b.name} (L/B = ${b.largest})`).join(", ")}; those coefficients are taken on that curve.`,
      );
    }
  }
  if (D > 0) {
    warnings.push(
      variant !== "simplified"
        ? "Gazetas (1991): embedment raises the static stiffness by the embedment factors (K_t,emb recalled from memory) and adds the sidewall dashpots of Table 2 for x, y, z, rx, ry (no torsion wall term); the vertical dynamic multiplier is the surface k_z times Table 2's embedded factor 1 - 0.09 (D/B)^(3/4) a0^2 with the sidewall in contact, 1 + 0.09 (D/B)^(3/4) a0^2 in a trench, linear in d/D between; the other multipliers are those of the surface base."
        : "Gazetas (1991): embedment raises the static stiffness by the embedment factors (K_t,emb recalled from memory); the dashpots are taken as those of the surface base (sidewall radiation ignored).",
    );
  }
  if (nu > 0.45 && variant === "simplified") {
    warnings.push("Gazetas (1991): k_ry = 1 - 0.30 a0 is stated for nu < 0.45; the soil's nu is above that.");
  }
  if (stratum) warnings.push(...stratumWarnings(stratum.thickness, Math.sqrt(base.area / Math.PI), D, "Gazetas"));
  const mapped = (g: GazetasStiffness) => map.map((key) => g[key]);
  const details: Record<string, number> = {
    L: base.L,
    B: base.B,
    chi: base.area / (4 * base.L * base.L),
    Ibx: base.Ibx,
    Iby: base.Iby,
    Jt: base.Jt,
    longSideAlongX: longAlongX ? 1 : 0,
    lysmerAnalogVelocity: lysmerAnalogVelocity(Vs, nu),
    a0Limit: GAZETAS_A0_LIMIT,
    hzAtA0Limit: (GAZETAS_A0_LIMIT * Vs) / (2 * Math.PI * base.B),
    publishedDynamicCoefficients: variant === "simplified" ? 0 : 1,
    // 1: k_z, k_y and the dashpot coefficients read from Gazetas' charts; 0: closed forms or simplified
    chartDynamicCoefficients: variant === "published" ? 1 : 0,
    chartA0Max: CHART_A0_MAX,
    ...prefixed("embedmentFactor", mapped(emb)),
    ...(stratum ? { ...prefixed("stratumFactor", mapped(strat)), ...stratumDetails(ctx, cutoffHz as number[]) } : {}),
  };
  return {
    method: "gazetas",
    staticStiffness,
    frequencyDependent: true,
    evaluate(omega, k, c) {
      const a0 = (omega * base.B) / Vs;
      const mult = gazetasDynamicMultipliers(a0, aspect, nu, variant);
      // embedded base: Gazetas' Table 2 vertical factor on the surface k_z (floored like the others)
      if (D > 0 && variant !== "simplified") mult.z = Math.max(mult.z * gazetasEmbeddedVerticalFactor(a0, D, base.B, d), GAZETAS_MULTIPLIER_FLOOR);
      const coef = gazetasRadiationCoefficients(a0, aspect, variant, nu);
      const wall = variant !== "simplified" ? gazetasSidewallDashpots(rho, Vs, nu, base, D, d, a0) : undefined;
      const hz = omega / (2 * Math.PI);
      for (let i = 0; i < 6; i++) {
        const key = map[i] as keyof GazetasStiffness;
        k[i] = (staticStiffness[i] as number) * mult[key];
        const below = cutoffHz !== undefined && hz < (cutoffHz[i] as number);
        c[i] = below ? 0 : dash[key] * coef[key] + (wall ? wall[key] : 0);
      }
    },
    details,
    warnings,
  };
}

/** Result keys per DOF in our axes, e.g. embedmentFactorX ... embedmentFactorRz. */
export function prefixed(prefix: string, values: number[]): Record<string, number> {
  const names = ["X", "Y", "Z", "Rx", "Ry", "Rz"];
  return Object.fromEntries(values.map((v, i) => [`${prefix}${names[i]}`, v]));
}

/** Stratum values shown in the result: depth to rock, cutoffs, equivalent profile. */
export function stratumDetails(ctx: ImpedanceContext, cutoffHz: number[]): Record<string, number> {
  const s = ctx.soil;
  const p = s.profile;
  return {
    stratumThickness: s.stratum?.thickness ?? 0,
    cutoffHzCompression: cutoffHz[2] as number,
    cutoffHzShear: cutoffHz[0] as number,
    ...prefixed("cutoffHz", cutoffHz),
    ...(p
      ? {
          profileShearWaveVelocity: p.shearWaveVelocity,
          profileDensity: p.density,
          profilePoissonRatio: p.poissonRatio,
          profileShearModulus: p.shearModulus,
        }
      : {}),
  };
}

/** Warnings common to both soil methods on a stratum. */
export function stratumWarnings(H: number, r: number, D: number, method: string): string[] {
  const w = [
    `${method}: the soil is a stratum ${H} m deep over a rigid base: static stiffness raised by Kausel's stratum factors (recalled from memory), radiation dashpots 0 below the cutoff frequencies (material damping only).`,
  ];
  // Kausel's fits are stated for moderately deep layers; H < 2 R is an engine threshold.
  if (H < 2 * r) w.push(`${method}: the stratum (${H} m) is shallower than twice the base's equivalent radius (${r.toFixed(2)} m): the stratum factors are extrapolated.`);
  if (D > 0) w.push(`${method}: the stratum factors are those of a surface base, applied to the embedded base unchanged.`);
  return w;
}
