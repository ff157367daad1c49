// Head impedance of one vertical, circular, flexible pile (method "piles", issue 16).
//
// Published method, used throughout: Gazetas, G. (1991), "Foundation vibrations", ch. 15 of
// Foundation Engineering Handbook, 2nd ed. (Fang, ed.), Van Nostrand Reinhold: the closed forms
// for the head stiffness of flexible piles (lateral K_HH, rocking K_MM, cross K_HM) in soil of
// uniform modulus Es or of modulus increasing linearly with depth Es(z) = Es z / d, with the
// active length and the damping ratios he gives. The forms are recalled from memory except where
// a second statement was found (noted per value): a public implementation of the same
// handbook's pile forms (K_HH = d Es (Ep/Es)^0.21; lateral damping 0.8 beta + 0.175 a0
// (Ep/Es)^0.17, i.e. 1.10 f d / Vs; vertical K_V = 1.9 d Es (L/d)^(2/3), the vertical dynamic
// factor and damping ratio).
//
// Vertical: Randolph, M. F. & Wroth, C. P. (1978), "Analysis of deformation of vertically loaded
// piles", J. Geotech. Eng. Div. ASCE 104(GT12), closed form as given in Fleming, Weltman,
// Randolph & Elson, Piling Engineering (recalled). It covers floating and end-bearing tips and
// both soil profiles, which Gazetas' vertical form (floating, uniform) does not. Their closed
// form is the exact solution of a compressible rod on shaft springs k_s = 2 pi G / zeta with a
// Boussinesq tip spring 4 G r0 / (1 - nu); the engine makes it dynamic on the same rod
// (choice, since Gazetas' vertical damping ratio could not be checked against a source and, as
// recalled, gives a group rocking dashpot below zero for close spacings): shaft dashpot
// c_s = pi d rho_s Vs per unit length (the high-frequency plane-strain limit of Novak 1974,
// recalled), tip dashpot 3.4 r0^2 rho_s Vs / (1 - nu) (Lysmer's analog, as in the equivalent-
// radius method), the pile's own mass. Its static limit equals the Randolph & Wroth form for
// uniform soil (tested), and a rigid pile (Boussinesq punch plus shaft) and a compressible pile
// on a rigid stratum (rod fixed at the tip) are checked as limits. Soil linear with depth: the
// springs and dashpots vary along the shaft and the rod is solved by finite elements
// (verticalRodLinear); R&W's closed form, which puts the tip's G_L in mu L, is not used there
// (for the example it gives about 1.8 times the springs' own solution, checked against the
// Airy-function solution of a long pile).
//
// Sign: the engine's DOFs are right-handed at the pile head, z up; a pile hangs below its head,
// so a head displacement +x with the rotation held makes a moment -x about y: K_x,ry = -K_HM,
// K_y,rx = +K_HM (K_HM > 0 here, the magnitude of Gazetas' cross term).

export type ShaftProfile = "uniform" | "linear";
export type TipCondition = "floating" | "end-bearing";

export interface PileSoil {
  /** Shear modulus (uniform), or at depth z = d below the head (linear) (Pa). */
  shearModulus: number;
  density: number;
  poissonRatio: number;
}

export interface PileSpec {
  diameter: number;
  length: number;
  youngsModulus: number;
  /** Density of the pile material (kg/m^3), for its mass in the vertical rod. */
  density: number;
  tip: TipCondition;
  profile: ShaftProfile;
}

/** Gazetas (1991) lateral closed forms: K = a d^n Es (Ep/Es)^e (recalled; HH uniform also in the second statement). */
export const GAZETAS_LATERAL = {
  uniform: { hh: [1.0, 0.21], mm: [0.15, 0.75], hm: [0.22, 0.5] },
  linear: { hh: [0.6, 0.35], mm: [0.14, 0.8], hm: [0.17, 0.6] },
} as const;

/**
 * Gazetas (1991) damping ratios of the head, xi = m beta + c (f d / Vs) (Ep/Es)^e, f in Hz:
 * [m, c, e] (recalled; HH uniform also in the second statement).
 */
export const GAZETAS_DAMPING = {
  uniform: { hh: [0.8, 1.1, 0.17], mm: [0.35, 0.35, 0.2], hm: [0.5, 0.85, 0.18] },
  linear: { hh: [0.7, 1.2, 0.08], mm: [0.35, 0.35, 0.22], hm: [0.5, 1.0, 0.4] },
} as const;

/** Young's modulus of the soil, Es = 2 G (1 + nu). */
export function soilYoungsModulus(soil: PileSoil): number {
  return 2 * soil.shearModulus * (1 + soil.poissonRatio);
}

/**
 * Active length La beyond which a flexible pile's lateral head stiffness does not depend on its
 * length: Gazetas (1991) La = 2 d (Ep/Es)^(1/4) uniform, 2 d (Ep/Es)^(1/5) linear (recalled).
 */
export function activeLength(d: number, stiffnessRatio: number, profile: ShaftProfile): number {
  return 2 * d * stiffnessRatio ** (profile === "uniform" ? 0.25 : 0.2);
}

export interface PileHeadStatic {
  /** Ep / Es, Es uniform or at depth d. */
  stiffnessRatio: number;
  activeLength: number;
  /** Static head stiffnesses: vertical (N/m), lateral (N/m), rocking (N m/rad), cross magnitude (N/rad). */
  kv: number;
  khh: number;
  kmm: number;
  khm: number;
}

/**
 * Randolph & Wroth (1978) static vertical head stiffness of a solid circular pile:
 *   P / (w r0 G_L) = [4 eta/((1 - nu) xi) + (2 pi rho / zeta) (tanh(mu L)/(mu L)) (L/r0)]
 *                  / [1 + (1/(pi lambda)) (4 eta/((1 - nu) xi)) (tanh(mu L)/(mu L)) (L/r0)]
 * eta = 1 (no enlarged base), xi = G_L / G_base, rho = mean G over the shaft / G_L,
 * lambda = Ep / G_L, zeta = ln(r_m / r0), r_m = (0.25 + xi (2.5 rho (1 - nu) - 0.25)) L,
 * mu L = sqrt(2 / (zeta lambda)) (L / r0). Floating: xi = 1 (the soil below the tip as at the
 * tip). End-bearing: the tip on a rigid stratum, xi -> 0, whose limit is the rod on shaft
 * springs fixed at the tip, P / w = Ep A mu coth(mu L) (G_L r0 pi lambda mu L / ((L/r0) tanh(mu L))).
 */
/** Randolph & Wroth's (1978) radius of influence r_m = (0.25 + xi (2.5 rho (1 - nu) - 0.25)) L (xi = 1 floating, 0 end-bearing; rho 1 uniform, 1/2 linear). */
export function randolphInfluenceRadius(spec: PileSpec, nu: number): number {
  const rho = spec.profile === "uniform" ? 1 : 0.5;
  const xi = spec.tip === "floating" ? 1 : 0;
  return (0.25 + xi * (2.5 * rho * (1 - nu) - 0.25)) * spec.length;
}

export function randolphWrothVertical(spec: PileSpec, soil: PileSoil): number {
  const r0 = spec.diameter / 2;
  const L = spec.length;
  const nu = soil.poissonRatio;
  // G at the tip and the shaft's mean over G at the tip
  const gL = spec.profile === "uniform" ? soil.shearModulus : (soil.shearModulus * L) / spec.diameter;
  const rho = spec.profile === "uniform" ? 1 : 0.5;
  const lambda = spec.youngsModulus / gL;
  const xi = spec.tip === "floating" ? 1 : 0;
  const rm = randolphInfluenceRadius(spec, nu);
  const zeta = Math.log(rm / r0);
  const muL = Math.sqrt(2 / (zeta * lambda)) * (L / r0);
  const t = Math.tanh(muL) / muL;
  if (spec.tip === "end-bearing") return (gL * r0 * Math.PI * lambda) / (t * (L / r0));
  const base = (4 * 1) / ((1 - nu) * xi);
  const num = base + ((2 * Math.PI * rho) / zeta) * t * (L / r0);
  const den = 1 + (1 / (Math.PI * lambda)) * base * t * (L / r0);
  return gL * r0 * (num / den);
}

export function pileHeadStatic(spec: PileSpec, soil: PileSoil): PileHeadStatic {
  const d = spec.diameter;
  const es = soilYoungsModulus(soil);
  const ratio = spec.youngsModulus / es;
  const c = GAZETAS_LATERAL[spec.profile];
  return {
    stiffnessRatio: ratio,
    activeLength: activeLength(d, ratio, spec.profile),
    kv: verticalRodImpedance(spec, soil, 0)[0],
    khh: c.hh[0] * d * es * ratio ** c.hh[1],
    kmm: c.mm[0] * d ** 3 * es * ratio ** c.mm[1],
    khm: c.hm[0] * d ** 2 * es * ratio ** c.hm[1],
  };
}

/** Complex helpers for the vertical rod (pairs [re, im]). */
type Cx = [number, number];
const cmul = (a: Cx, b: Cx): Cx => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const cdiv = (a: Cx, b: Cx): Cx => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const csqrt = (a: Cx): Cx => {
  const r = Math.hypot(a[0], a[1]);
  const re = Math.sqrt((r + a[0]) / 2);
  const im = Math.sign(a[1] === 0 ? 1 : a[1]) * Math.sqrt(Math.max((r - a[0]) / 2, 0));
  return [re, im];
};
/** tanh(z) = (1 - e^-2z) / (1 + e^-2z), for Re z >= 0 (no overflow for a long pile). */
const ctanh = (z: Cx): Cx => {
  const e = Math.exp(-2 * z[0]);
  const ez: Cx = [e * Math.cos(-2 * z[1]), e * Math.sin(-2 * z[1])];
  return cdiv([1 - ez[0], -ez[1]], [1 + ez[0], ez[1]]);
};

/** Shaft and tip of the vertical rod: zeta = ln(r_m / r0), shaft G (mean over the shaft), tip G (at the tip). */
export function verticalRodSoil(spec: PileSpec, soil: PileSoil): { zeta: number; shaftG: number; tipG: number } {
  const r0 = spec.diameter / 2;
  const L = spec.length;
  const gL = spec.profile === "uniform" ? soil.shearModulus : (soil.shearModulus * L) / spec.diameter;
  const rho = spec.profile === "uniform" ? 1 : 0.5;
  const rm = randolphInfluenceRadius(spec, soil.poissonRatio);
  return { zeta: Math.log(rm / r0), shaftG: rho * gL, tipG: gL };
}

/**
 * Vertical head impedance Z = k + i w c of the rod (see the header): EA u'' = (k_s + i w c_s
 * - w^2 m) u, head force EA mu (Z_b + EA mu tanh(mu L)) / (EA mu + Z_b tanh(mu L)),
 * Z_b the tip (4 G r0 / (1 - nu) + i w 3.4 r0^2 rho Vs / (1 - nu) floating; fixed, Z_b -> inf,
 * end-bearing: EA mu / tanh(mu L)). Returns [Re Z, Im Z].
 */
export function verticalRodImpedance(spec: PileSpec, soil: PileSoil, omega: number): Cx {
  if (spec.profile === "linear") return verticalRodLinear(spec, soil, omega);
  const r0 = spec.diameter / 2;
  const area = Math.PI * r0 * r0;
  const ea = spec.youngsModulus * area;
  const { zeta, shaftG, tipG } = verticalRodSoil(spec, soil);
  const nu = soil.poissonRatio;
  const ks = (2 * Math.PI * shaftG) / zeta;
  const cs = Math.PI * spec.diameter * soil.density * Math.sqrt(shaftG / soil.density);
  const m = spec.density * area;
  const mu = csqrt([(ks - omega * omega * m) / ea, (omega * cs) / ea]);
  const eaMu: Cx = [ea * mu[0], ea * mu[1]];
  const t = ctanh([mu[0] * spec.length, mu[1] * spec.length]);
  if (spec.tip === "end-bearing") return cdiv(eaMu, t);
  const vsTip = Math.sqrt(tipG / soil.density);
  const zb: Cx = [(4 * tipG * r0) / (1 - nu), (omega * 3.4 * r0 * r0 * soil.density * vsTip) / (1 - nu)];
  return cmul(eaMu, cdiv([zb[0] + eaMu[0] * t[0] - eaMu[1] * t[1], zb[1] + eaMu[0] * t[1] + eaMu[1] * t[0]], [eaMu[0] + zb[0] * t[0] - zb[1] * t[1], eaMu[1] + zb[0] * t[1] + zb[1] * t[0]]));
}

/** Elements of the discretised rod (linear profile): the head stiffness converges as 1/n^2; 400 is within 0.01 % of the Airy-function solution for the example (tested). */
export const LINEAR_ROD_ELEMENTS = 400;

/**
 * The same rod for soil whose modulus grows linearly with depth, G(z) = G_d z / d: shaft
 * springs and dashpots vary along it (k_s(z) = 2 pi G(z) / zeta, c_s(z) = pi d rho Vs(z)), so
 * there is no closed form; it is solved by finite elements (linear elements, springs, dashpots
 * and the pile's mass lumped at the nodes by the trapezoid rule, which integrates the linear
 * k_s exactly; a complex tridiagonal solve). The tip as for the uniform rod with G at the tip
 * (floating) or fixed (end-bearing). A rod with the mean G would overstate a compressible
 * pile's head stiffness about twice here (the soil near the head is far softer than the mean).
 */
function verticalRodLinear(spec: PileSpec, soil: PileSoil, omega: number): Cx {
  const r0 = spec.diameter / 2;
  const area = Math.PI * r0 * r0;
  const ea = spec.youngsModulus * area;
  const { zeta, tipG } = verticalRodSoil(spec, soil);
  const nu = soil.poissonRatio;
  const n = LINEAR_ROD_ELEMENTS;
  const h = spec.length / n;
  const m = spec.density * area;
  const ke = ea / h;
  // nodes 0..n (n fixed when end-bearing); diagonal d_i (complex), off-diagonal -ke (real)
  const last = spec.tip === "end-bearing" ? n - 1 : n;
  const dRe = new Float64Array(last + 1);
  const dIm = new Float64Array(last + 1);
  for (let i = 0; i <= last; i++) {
    const z = i * h;
    const g = (soil.shearModulus * z) / spec.diameter;
    const w = i === 0 || i === n ? h / 2 : h;
    dRe[i] = (i === 0 || i === n ? ke : 2 * ke) + ((2 * Math.PI * g) / zeta - omega * omega * m) * w;
    dIm[i] = omega * Math.PI * spec.diameter * Math.sqrt(g * soil.density) * w;
  }
  if (spec.tip === "floating") {
    const vsTip = Math.sqrt(tipG / soil.density);
    dRe[n] = (dRe[n] as number) + (4 * tipG * r0) / (1 - nu);
    dIm[n] = (dIm[n] as number) + (omega * 3.4 * r0 * r0 * soil.density * vsTip) / (1 - nu);
  }
  // condense from the tip up: S_i = d_i - ke^2 / S_{i+1}; the head impedance is S_0
  let sRe = dRe[last] as number;
  let sIm = dIm[last] as number;
  for (let i = last - 1; i >= 0; i--) {
    const den = sRe * sRe + sIm * sIm;
    const k2 = ke * ke;
    sRe = (dRe[i] as number) - (k2 * sRe) / den;
    sIm = (dIm[i] as number) + (k2 * sIm) / den;
  }
  return [sRe, sIm];
}

/** One term of the single-pile head impedance Z = k + i w c, split into its parts (c in N s/m ...). */
export interface ImpedanceTerm {
  k: number;
  c: number;
  /** The part of c that corrects the engine's material damping (lateral terms; 0 otherwise), included in c. */
  cMaterial: number;
}

export interface PileHeadDynamic {
  v: ImpedanceTerm;
  hh: ImpedanceTerm;
  mm: ImpedanceTerm;
  hm: ImpedanceTerm;
}

/**
 * The head impedance at circular frequency w. Radiation dashpots from Gazetas' damping ratios,
 * c = 2 K xi_rad / w (for the lateral terms xi_rad is proportional to f, so c does not depend
 * on w). Material damping: the engine multiplies K by (1 + 2 i beta) on every term; Gazetas'
 * lateral material parts are m beta with m < 1, so the lateral dashpots carry
 * -2 (1 - m) beta K / w to give exactly m beta (the engine's full beta would overstate the
 * damping, the unsafe side); at w = 0 that term is 0 (w c -> 0). The vertical term is the rod's.
 */
export function pileHeadDynamic(spec: PileSpec, soil: PileSoil, stat: PileHeadStatic, beta: number, omega: number): PileHeadDynamic {
  const d = spec.diameter;
  const vs = Math.sqrt(soil.shearModulus / soil.density);
  const dmp = GAZETAS_DAMPING[spec.profile];
  const lateral = (k: number, [m, cf, e]: readonly [number, number, number]): ImpedanceTerm => {
    // 2 K xi / w with xi = cf (f d / Vs) Lambda^e, f = w / 2 pi
    const radiation = (k * cf * d * stat.stiffnessRatio ** e) / (Math.PI * vs);
    const material = omega > 0 ? (-2 * (1 - m) * beta * k) / omega : 0;
    return { k, c: radiation + material, cMaterial: material };
  };
  // vertical rod: c = Im Z / w, at w = 0 its limit (Im Z is proportional to w there)
  const zv = verticalRodImpedance(spec, soil, omega);
  const wc = omega > 0 ? omega : (1e-9 * vs) / d;
  const kv = zv[0];
  const cv = (omega > 0 ? zv[1] : (verticalRodImpedance(spec, soil, wc)[1] as number)) / wc;
  return {
    v: { k: kv, c: cv, cMaterial: 0 },
    hh: lateral(stat.khh, dmp.hh),
    mm: lateral(stat.kmm, dmp.mm),
    hm: lateral(stat.khm, dmp.hm),
  };
}
