// Gazetas (1991), "Formulas and charts for impedances of surface and embedded foundations",
// J. Geotech. Eng. ASCE 117(9): static stiffness of the base enclosed in a 2L x 2B rectangle
// (L >= B, x along L, y along B), embedment factors, dynamic multipliers and radiation dashpots.
// Chart-only coefficients are NOT digitised: k_z, k_y = 1 and the dashpot coefficients c = 1
// (the Lysmer-analog limit), each reported in the warnings.
import { GAZETAS_A0_LIMIT, GAZETAS_MULTIPLIER_FLOOR } from "./criteria-defaults";
import { type ImpedanceContext, type ImpedanceModel } from "./impedance-model";

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
 * K_x,emb uses (1 + 0.15 (D/B)^0.5)(1 + 0.52 (h A_w / (L B^2))^0.4) (recalled from memory);
 * K_ry,emb uses (1 + 0.92 (d/L)^0.6 (1.5 + (d/L)^1.9 (d/D)^-0.6)) (recalled from memory:
 * published forms differ between sources); K_t,emb is recalled from memory too.
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

/**
 * Dynamic stiffness multipliers k(a0), a0 = w B / Vs: k_x = 1, k_rx = 1 - 0.20 a0,
 * k_ry = 1 - 0.30 a0 (nu < 0.45), k_t = 1 - 0.14 a0 (recalled from memory). k_z and k_y exist
 * only as charts: taken as 1. Each is floored at a small positive value.
 */
export function gazetasDynamicMultipliers(a0: number): GazetasStiffness {
  const floor = (v: number) => Math.max(v, GAZETAS_MULTIPLIER_FLOOR);
  return { x: 1, y: 1, z: 1, rx: floor(1 - 0.2 * a0), ry: floor(1 - 0.3 * a0), t: floor(1 - 0.14 * a0) };
}

/** Lysmer's analog velocity V_La = 3.4 Vs / (pi (1 - nu)) (Gazetas 1991). */
export const lysmerAnalogVelocity = (Vs: number, nu: number) => (3.4 * Vs) / (Math.PI * (1 - nu));

/**
 * Radiation dashpots, Gazetas (1991): C_z = rho V_La A_b c_z, C_y = rho Vs A_b c_y,
 * C_x = rho Vs A_b, C_rx = rho V_La I_bx c_rx, C_ry = rho V_La I_by c_ry, C_t = rho Vs J_t c_t,
 * with every chart coefficient c taken at its Lysmer-analog limit 1.
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

export function gazetasImpedance(ctx: ImpedanceContext): ImpedanceModel {
  const { shearModulus: G, poissonRatio: nu, density: rho, shearWaveVelocity: Vs } = ctx.soil;
  const { base, longAlongX } = gazetasBaseFromContact(ctx);
  const surface = gazetasSurfaceStiffness(G, nu, base);
  const emb = gazetasEmbedmentFactors(base, ctx.soil.embedmentDepth, ctx.soil.sidewallContactHeight);
  const dash = gazetasDashpots(rho, Vs, nu, base);
  const map = axisMap(longAlongX);
  const staticStiffness = map.map((key) => surface[key] * emb[key]);
  const dashpot = map.map((key) => dash[key]);
  const warnings = [
    "Gazetas (1991): the dynamic stiffness multipliers k_z and k_y exist only as charts and are taken as 1.",
    "Gazetas (1991): the radiation dashpot coefficients c_z, c_y, c_rx, c_ry, c_t exist only as charts and are taken at their Lysmer-analog limit 1 (rocking damping is overestimated at low a0).",
  ];
  if (ctx.soil.embedmentDepth > 0) {
    warnings.push(
      "Gazetas (1991): embedment raises the static stiffness by the embedment factors (K_x,emb, K_ry,emb and K_t,emb forms recalled from memory); the dashpots are taken as those of the surface base (sidewall radiation ignored).",
    );
  }
  if (nu > 0.45) {
    warnings.push("Gazetas (1991): k_ry = 1 - 0.30 a0 is stated for nu < 0.45; the soil's nu is above that.");
  }
  return {
    method: "gazetas",
    staticStiffness,
    frequencyDependent: true,
    evaluate(omega, k, c) {
      const mult = gazetasDynamicMultipliers((omega * base.B) / Vs);
      for (let i = 0; i < 6; i++) {
        const key = map[i] as keyof GazetasStiffness;
        k[i] = (staticStiffness[i] as number) * mult[key];
        c[i] = dashpot[i] as number;
      }
    },
    details: {
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
    },
    warnings,
  };
}
