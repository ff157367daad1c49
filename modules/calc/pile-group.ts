// Impedance at O of a rigid cap on a group of vertical piles (method "piles", issue 16).
//
// Pile-to-pile interaction: the dynamic interaction factors of Dobry, R. & Gazetas, G. (1988),
// "Simple method for dynamic stiffness and damping of floating pile groups", Geotechnique 38(4),
// 557-574 (cylindrical waves from each shaft, recalled):
//   vertical    alpha_v(S)     = (S / r0)^(-1/2) exp(-beta w S / Vs) exp(-i w S / Vs)
//   horizontal  alpha(S, 0)    = the same with V_La = 3.4 Vs / (pi (1 - nu)) (along the load)
//               alpha(S, 90)   = the same with Vs (across the load)
//               alpha(S, th)  ~= alpha(S, 0) cos^2 th + alpha(S, 90) sin^2 th,
// th the angle between the load and the line of the two piles (Makris & Gazetas 1992 use the
// same directional rule; their refinement of the lateral factor is not applied). The engine
// writes the directional rule as the tensor alpha(90) I + (alpha(0) - alpha(90)) n n^T (n the
// unit vector between the piles), which gives the cos^2 / sin^2 rule along the load and the
// cross component the same rule implies. Superposition (the standard procedure, Kaynia &
// Kausel 1982; Dobry & Gazetas 1988): the head displacements are u = (1/Z) A P with A_ii = 1,
// A_ij = alpha(S_ij); a rigid cap imposes u = T U, so the group impedance at O is
// Z T^T A^-1 T. The head rotations and moments (K_MM, K_HM) take no interaction (their
// interaction factors are small, Gazetas et al. 1993, recalled), and pile torsion is neglected:
// the cap's torsion comes from the piles' lateral stiffness times their lever arms.
//
// Below a0 = w d / Vs = 0.2 the vertical factor's static limit is raised to Randolph & Wroth's
// (1979) elastic static interaction where that is larger, faded out linearly by a0 = 0.2
// (staticInteractionExcess; CONVENTIONS.md "Group at O").
//
// Pile heads lie at the base plane of O (z = 0): the cap's underside. The kinematics of each
// head, u_i = U + Theta x p_i with p_i = (x_i, y_i, z_h), keep the lever arm z_h for generality;
// with z_h = 0 it adds nothing, and the sway-rocking coupling at O is the piles' own -K_HM.
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import {
  pileHeadDynamic,
  pileHeadStatic,
  randolphInfluenceRadius,
  type ImpedanceTerm,
  type PileHeadStatic,
  type PileSoil,
  type PileSpec,
} from "./pile-single";

export interface PileGroupGeometry {
  /** Pile head positions relative to O, m. */
  x: Float64Array;
  y: Float64Array;
  /** Head level relative to O (0: the cap's underside). */
  zh: number;
}

/** Solves A X = B in place for a dense complex n x n A (row-major) and m right-hand sides (n x m, row-major). */
export function complexSolveInPlace(n: number, aRe: Float64Array, aIm: Float64Array, m: number, bRe: Float64Array, bIm: Float64Array): void {
  for (let col = 0; col < n; col++) {
    let p = col;
    let best = -1;
    for (let r = col; r < n; r++) {
      const mag = (aRe[r * n + col] as number) ** 2 + (aIm[r * n + col] as number) ** 2;
      if (mag > best) {
        best = mag;
        p = r;
      }
    }
    if (!(best > 0)) throw new Error("internal error: the pile interaction matrix is singular");
    if (p !== col) {
      for (let j = 0; j < n; j++) {
        const a = col * n + j;
        const b = p * n + j;
        const tr = aRe[a] as number;
        aRe[a] = aRe[b] as number;
        aRe[b] = tr;
        const ti = aIm[a] as number;
        aIm[a] = aIm[b] as number;
        aIm[b] = ti;
      }
      for (let j = 0; j < m; j++) {
        const a = col * m + j;
        const b = p * m + j;
        const tr = bRe[a] as number;
        bRe[a] = bRe[b] as number;
        bRe[b] = tr;
        const ti = bIm[a] as number;
        bIm[a] = bIm[b] as number;
        bIm[b] = ti;
      }
    }
    const dr = aRe[col * n + col] as number;
    const di = aIm[col * n + col] as number;
    const den = dr * dr + di * di;
    const ir = dr / den;
    const ii = -di / den;
    for (let r = col + 1; r < n; r++) {
      const ar = aRe[r * n + col] as number;
      const ai = aIm[r * n + col] as number;
      const lr = ar * ir - ai * ii;
      const li = ar * ii + ai * ir;
      if (lr === 0 && li === 0) continue;
      for (let j = col + 1; j < n; j++) {
        const ur = aRe[col * n + j] as number;
        const ui = aIm[col * n + j] as number;
        aRe[r * n + j] = (aRe[r * n + j] as number) - (lr * ur - li * ui);
        aIm[r * n + j] = (aIm[r * n + j] as number) - (lr * ui + li * ur);
      }
      for (let j = 0; j < m; j++) {
        const ur = bRe[col * m + j] as number;
        const ui = bIm[col * m + j] as number;
        bRe[r * m + j] = (bRe[r * m + j] as number) - (lr * ur - li * ui);
        bIm[r * m + j] = (bIm[r * m + j] as number) - (lr * ui + li * ur);
      }
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    const dr = aRe[i * n + i] as number;
    const di = aIm[i * n + i] as number;
    const den = dr * dr + di * di;
    const ir = dr / den;
    const ii = -di / den;
    for (let j = 0; j < m; j++) {
      let sr = bRe[i * m + j] as number;
      let si = bIm[i * m + j] as number;
      for (let k = i + 1; k < n; k++) {
        const ar = aRe[i * n + k] as number;
        const ai = aIm[i * n + k] as number;
        const xr = bRe[k * m + j] as number;
        const xi = bIm[k * m + j] as number;
        sr -= ar * xr - ai * xi;
        si -= ar * xi + ai * xr;
      }
      bRe[i * m + j] = sr * ir - si * ii;
      bIm[i * m + j] = sr * ii + si * ir;
    }
  }
}

/** Dobry & Gazetas (1988) interaction factor at spacing S for waves of velocity V: (S/r0)^-1/2 e^(-beta w S/V) e^(-i w S/V). */
export function interactionFactor(spacing: number, r0: number, omega: number, velocity: number, beta: number): [number, number] {
  const amp = Math.sqrt(r0 / spacing) * Math.exp((-beta * omega * spacing) / velocity);
  const phase = (omega * spacing) / velocity;
  return [amp * Math.cos(phase), -amp * Math.sin(phase)];
}

/**
 * Static vertical interaction of two piles at spacing S: Randolph & Wroth (1979), "An analysis of
 * the vertical deformation of pile groups", Geotechnique 29(4) (recalled): the shaft's
 * logarithmic settlement field gives alpha = ln(r_m / S) / ln(r_m / r0) for S < r_m, 0 beyond,
 * with the single pile's radius of influence r_m (randolphInfluenceRadius).
 */
export function randolphStaticInteraction(spacing: number, r0: number, rm: number): number {
  if (!(spacing < rm)) return 0;
  return Math.log(rm / spacing) / Math.log(rm / r0);
}

/** Upper a0 = w d / Vs of the fade from the static interaction to Dobry & Gazetas' factor (engine choice). */
export const STATIC_INTERACTION_FADE_A0 = 0.2;

/**
 * What the vertical interaction factor gains at low frequency: (alpha_R - (S/r0)^(-1/2)) (1 - a0 / 0.2)
 * where Randolph's static factor alpha_R exceeds Dobry & Gazetas' static limit, 0 elsewhere and
 * for a0 >= 0.2 (see CONVENTIONS.md "Group at O"). Real: it moves the static limit, not the waves.
 */
export function staticInteractionExcess(spacing: number, r0: number, rm: number, a0: number): number {
  const fade = 1 - a0 / STATIC_INTERACTION_FADE_A0;
  if (!(fade > 0)) return 0;
  return Math.max(0, randolphStaticInteraction(spacing, r0, rm) - Math.sqrt(r0 / spacing)) * fade;
}

/** Lysmer's analog velocity V_La = 3.4 Vs / (pi (1 - nu)). */
export function lysmerVelocity(vs: number, nu: number): number {
  return (3.4 * vs) / (Math.PI * (1 - nu));
}

/**
 * Q = T^T A^-1 T (complex 6 x 6, row-major, re and im) of the vertical and the lateral head
 * systems at w: the group at O is sum_t Z_t Q_t, Z_t the single-pile impedance of the term.
 * Without interaction (one pile, or `interaction` false) A = I.
 */
export interface GroupInfluence {
  vRe: Float64Array;
  vIm: Float64Array;
  hRe: Float64Array;
  hIm: Float64Array;
}

/** Randolph's radius of influence r_m and the pile diameter, for the static floor of the vertical factor (none: Dobry & Gazetas alone). */
export interface StaticVerticalInteraction {
  rm: number;
  diameter: number;
}

export function groupInfluence(
  geo: PileGroupGeometry,
  r0: number,
  vsInteraction: number,
  nu: number,
  beta: number,
  omega: number,
  interaction: boolean,
  staticVertical?: StaticVerticalInteraction,
): GroupInfluence {
  const n = geo.x.length;
  const { x, y, zh } = geo;
  // rows of T for the head's uz (vertical) and ux, uy (lateral) from U = [Ux, Uy, Uz, tx, ty, tz]
  // u_p = U_t + Theta x p, p = (x, y, zh)
  const tv = new Float64Array(n * 6);
  const th = new Float64Array(2 * n * 6);
  for (let i = 0; i < n; i++) {
    const xi = x[i] as number;
    const yi = y[i] as number;
    tv.set([0, 0, 1, yi, -xi, 0], i * 6);
    th.set([1, 0, 0, 0, zh, -yi], 2 * i * 6);
    th.set([0, 1, 0, -zh, 0, xi], (2 * i + 1) * 6);
  }
  const av = new Float64Array(n * n);
  const avi = new Float64Array(n * n);
  const ah = new Float64Array(4 * n * n);
  const ahi = new Float64Array(4 * n * n);
  const n2 = 2 * n;
  const vla = lysmerVelocity(vsInteraction, nu);
  for (let i = 0; i < n; i++) {
    av[i * n + i] = 1;
    ah[2 * i * n2 + 2 * i] = 1;
    ah[(2 * i + 1) * n2 + 2 * i + 1] = 1;
    if (!interaction) continue;
    for (let j = 0; j < n; j++) {
      if (j === i) continue;
      const dx = (x[i] as number) - (x[j] as number);
      const dy = (y[i] as number) - (y[j] as number);
      const s = Math.hypot(dx, dy);
      const [vr, vi] = interactionFactor(s, r0, omega, vsInteraction, beta);
      const excess = staticVertical ? staticInteractionExcess(s, r0, staticVertical.rm, (omega * staticVertical.diameter) / vsInteraction) : 0;
      av[i * n + j] = vr + excess;
      avi[i * n + j] = vi;
      const [pr, pi] = interactionFactor(s, r0, omega, vla, beta);
      const nx = dx / s;
      const ny = dy / s;
      // alpha(90) I + (alpha(0) - alpha(90)) n n^T; alpha(90) travels at Vs, alpha(0) at V_La
      const dr = pr - vr;
      const di = pi - vi;
      const put = (a: number, b: number, re: number, im: number) => {
        ah[(2 * i + a) * n2 + 2 * j + b] = re;
        ahi[(2 * i + a) * n2 + 2 * j + b] = im;
      };
      put(0, 0, vr + dr * nx * nx, vi + di * nx * nx);
      put(1, 1, vr + dr * ny * ny, vi + di * ny * ny);
      put(0, 1, dr * nx * ny, di * nx * ny);
      put(1, 0, dr * nx * ny, di * nx * ny);
    }
  }
  const project = (size: number, aRe: Float64Array, aIm: Float64Array, t: Float64Array): [Float64Array, Float64Array] => {
    const bRe = Float64Array.from(t);
    const bIm = new Float64Array(size * 6);
    if (interaction && n > 1) complexSolveInPlace(size, aRe, aIm, 6, bRe, bIm);
    const qRe = new Float64Array(36);
    const qIm = new Float64Array(36);
    for (let r = 0; r < size; r++) {
      for (let a = 0; a < 6; a++) {
        const ta = t[r * 6 + a] as number;
        if (ta === 0) continue;
        for (let b = 0; b < 6; b++) {
          qRe[a * 6 + b] = (qRe[a * 6 + b] as number) + ta * (bRe[r * 6 + b] as number);
          qIm[a * 6 + b] = (qIm[a * 6 + b] as number) + ta * (bIm[r * 6 + b] as number);
        }
      }
    }
    return [qRe, qIm];
  };
  const [vRe, vIm] = project(n, av, avi, tv);
  const [hRe, hIm] = project(n2, ah, ahi, th);
  return { vRe, vIm, hRe, hIm };
}

export interface PileGroupModelInput {
  spec: PileSpec;
  soil: PileSoil;
  geo: PileGroupGeometry;
  beta: number;
  interaction: boolean;
}

export interface PileGroupModel {
  single: PileHeadStatic;
  /** Vs used by the interaction factors (uniform: Vs; linear: Vs at mid-length). */
  interactionVelocity: number;
  /** K(w), C(w) at O, row-major 6 x 6 (before the engine's (1 + 2 i beta) on K). */
  evaluate(omega: number, K: Float64Array, C: Float64Array): void;
  /** Of the last evaluate: the most negative eigenvalue of the radiation dashpot matrix that was set to 0 (0: none). */
  lastRadiationClamp(): number;
}

/** Exact symmetry (round-off in the sums). */
function symmetrise(K: Float64Array, C: Float64Array): void {
  for (let i = 0; i < 6; i++) {
    for (let j = i + 1; j < 6; j++) {
      const k = ((K[i * 6 + j] as number) + (K[j * 6 + i] as number)) / 2;
      const c = ((C[i * 6 + j] as number) + (C[j * 6 + i] as number)) / 2;
      K[i * 6 + j] = k;
      K[j * 6 + i] = k;
      C[i * 6 + j] = c;
      C[j * 6 + i] = c;
    }
  }
}

/** C += (-2 beta lambda / w) v v^T for each eigenpair of K with lambda < 0: 2 beta K + w C has no negative material part. */
function cancelNegativeMaterial(K: Float64Array, C: Float64Array, beta: number, omega: number): boolean {
  const m = new Matrix(6, 6);
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) m.set(i, j, K[i * 6 + j] as number);
  const evd = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const values = evd.realEigenvalues;
  if (!values.some((v) => v < 0)) return false;
  const V = evd.eigenvectorMatrix;
  values.forEach((lambda, e) => {
    if (!(lambda < 0)) return;
    const f = (-2 * beta * lambda) / omega;
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) C[i * 6 + j] = (C[i * 6 + j] as number) + f * V.get(i, e) * V.get(j, e);
  });
  return true;
}

/**
 * The nearest positive semidefinite matrix (Frobenius norm) of a symmetric 6 x 6 in place: its
 * negative eigenvalues set to 0 (Higham 1988, "Computing a nearest symmetric positive
 * semidefinite matrix", Linear Algebra Appl. 103). Eigenvalues above -1e-12 of the largest are
 * round-off and left. Returns the most negative eigenvalue removed (0: C unchanged).
 */
export function clampPositiveSemidefinite(C: Float64Array): number {
  const m = new Matrix(6, 6);
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) m.set(i, j, C[i * 6 + j] as number);
  const evd = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const values = evd.realEigenvalues;
  const top = Math.max(...values.map(Math.abs));
  const least = Math.min(...values);
  if (!(least < -1e-12 * top)) return 0;
  const V = evd.eigenvectorMatrix;
  for (let i = 0; i < 6; i++) {
    for (let j = 0; j < 6; j++) {
      let sum = 0;
      for (let e = 0; e < 6; e++) {
        const lambda = values[e] as number;
        if (lambda > 0) sum += V.get(i, e) * lambda * V.get(j, e);
      }
      C[i * 6 + j] = sum;
    }
  }
  return least;
}

/** Adds Z Q (Z = k + i w c; Q = qRe + i qIm) into K + i w C: K += k qRe - w c qIm, C += k qIm / w + c qRe. */
function addTerm(K: Float64Array, C: Float64Array, z: ImpedanceTerm, sign: number, qRe: Float64Array, qIm: Float64Array, qImOverOmega: Float64Array, omega: number): void {
  for (let i = 0; i < 36; i++) {
    K[i] = (K[i] as number) + sign * (z.k * (qRe[i] as number) - omega * z.c * (qIm[i] as number));
    C[i] = (C[i] as number) + sign * (z.k * (qImOverOmega[i] as number) + z.c * (qRe[i] as number));
  }
}

export function pileGroupModel({ spec, soil, geo, beta, interaction }: PileGroupModelInput): PileGroupModel {
  const single = pileHeadStatic(spec, soil);
  const r0 = spec.diameter / 2;
  const vsD = Math.sqrt(soil.shearModulus / soil.density);
  // linear profile: G(z) = G_d z/d, so Vs(z) = Vs_d sqrt(z/d); the interaction waves are taken at mid-length (engine choice)
  const vsInteraction = spec.profile === "uniform" ? vsD : vsD * Math.sqrt(spec.length / 2 / spec.diameter);
  const staticVertical: StaticVerticalInteraction = { rm: randolphInfluenceRadius(spec, soil.poissonRatio), diameter: spec.diameter };
  const n = geo.x.length;
  // rotations of each head: sum over piles of T_i^T S T_i, S the head's rotational and cross terms (no interaction)
  const rot = new Float64Array(36); // K_MM pattern: rx-rx and ry-ry, n each
  const cross = new Float64Array(36); // K_HM pattern: x-ry = -1, y-rx = +1 per pile, with the kinematics of u_x, u_y
  for (let i = 0; i < n; i++) {
    const xi = geo.x[i] as number;
    const yi = geo.y[i] as number;
    rot[3 * 7] = (rot[3 * 7] as number) + 1;
    rot[4 * 7] = (rot[4 * 7] as number) + 1;
    // head ux = Ux + zh ty - y tz couples with ty (-1); head uy = Uy - zh tx + x tz couples with tx (+1)
    const ux = [1, 0, 0, 0, geo.zh, -yi];
    const uy = [0, 1, 0, -geo.zh, 0, xi];
    for (let a = 0; a < 6; a++) {
      const ua = ux[a] as number;
      const va = uy[a] as number;
      // energy terms -ux ty and + uy tx, symmetric
      cross[a * 6 + 4] = (cross[a * 6 + 4] as number) - ua;
      cross[4 * 6 + a] = (cross[4 * 6 + a] as number) - ua;
      cross[a * 6 + 3] = (cross[a * 6 + 3] as number) + va;
      cross[3 * 6 + a] = (cross[3 * 6 + a] as number) + va;
    }
  }
  const zero36 = new Float64Array(36);
  // Q at a tiny frequency gives Im(Q)/w at w = 0 (the limit is finite: Im alpha ~ -w S / V)
  const qImOverOmega = (q: Float64Array, omega: number, out: Float64Array) => {
    for (let i = 0; i < 36; i++) out[i] = (q[i] as number) / omega;
  };
  const vOver = new Float64Array(36);
  const hOver = new Float64Array(36);
  let cacheOmega = Number.NaN;
  let cache: GroupInfluence | null = null;
  const influence = (omega: number): GroupInfluence => {
    if (cache && omega === cacheOmega) return cache;
    cache = groupInfluence(geo, r0, vsInteraction, soil.poissonRatio, beta, omega, interaction, staticVertical);
    cacheOmega = omega;
    return cache;
  };
  let lastClamp = 0;
  return {
    single,
    interactionVelocity: vsInteraction,
    lastRadiationClamp: () => lastClamp,
    evaluate(omega, K, C) {
      K.fill(0);
      C.fill(0);
      const z = pileHeadDynamic(spec, soil, single, beta, omega);
      const wq = omega > 0 ? omega : (1e-9 * vsInteraction) / spec.diameter;
      const q = influence(wq);
      qImOverOmega(q.vIm, wq, vOver);
      qImOverOmega(q.hIm, wq, hOver);
      // at w = 0 the imaginary parts themselves vanish: use Q's real part and the Im/w limit only
      const vIm = omega > 0 ? q.vIm : zero36;
      const hIm = omega > 0 ? q.hIm : zero36;
      // radiation first (the single piles' radiation dashpots and the interaction's wave terms)
      const rad = (t: ImpedanceTerm): ImpedanceTerm => ({ k: t.k, c: t.c - t.cMaterial, cMaterial: 0 });
      addTerm(K, C, rad(z.v), 1, q.vRe, vIm, vOver, omega);
      addTerm(K, C, rad(z.hh), 1, q.hRe, hIm, hOver, omega);
      addTerm(K, C, rad(z.mm), 1, rot, zero36, zero36, omega);
      addTerm(K, C, rad(z.hm), 1, cross, zero36, zero36, omega);
      symmetrise(K, C);
      // passivity: the superposition can give a radiation dashpot matrix with negative directions
      // (rocking and torsion of a close group at low frequency, where the piles' waves cancel);
      // a support cannot radiate negative energy, so those directions get none (the safe side:
      // less damping, never a negative dashpot)
      lastClamp = clampPositiveSemidefinite(C);
      if (lastClamp !== 0) symmetrise(K, C);
      // then the lateral terms' material-damping correction (Gazetas' m beta instead of the engine's beta)
      const mat = (t: ImpedanceTerm): ImpedanceTerm => ({ k: 0, c: t.cMaterial, cMaterial: t.cMaterial });
      addTerm(K, C, mat(z.hh), 1, q.hRe, hIm, zero36, omega);
      addTerm(K, C, mat(z.mm), 1, rot, zero36, zero36, omega);
      addTerm(K, C, mat(z.hm), 1, cross, zero36, zero36, omega);
      symmetrise(K, C);
      // the engine's material damping K (1 + 2 i beta): where the group's dynamic stiffness has a
      // negative direction (near a group resonance of the interaction waves) it would be a negative
      // dashpot; that direction gets no material damping (the safe side, passive)
      if (beta > 0 && omega > 0 && cancelNegativeMaterial(K, C, beta, omega)) symmetrise(K, C);
    },
  };
}
