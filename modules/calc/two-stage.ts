// Two-stage isolation (issue 16, engine 1.8.0): the inertia block (the "upper" block, DOFs at O)
// on steel springs that stand on a second concrete block (the "base", DOFs at B, the centre of
// its underside) resting on the soil. Twelve DOFs; in the frequency domain the base is condensed
// out exactly at each frequency, so the upper block keeps the engine's six-DOF solver:
//
//   [ S_s - w^2 M_U      -S_s T        ] [u_U]   [F]
//   [ -T^T S_s     T^T S_s T + D_b(w)  ] [q_B] = [0]
//
//   S_s = K_s + i w C_s                     springs at O (relative motion u_U - T q_B)
//   D_b = K_b(w) (1 + 2 i beta) + i w C_b(w) - w^2 M_B    soil under the base at B, base mass
//   q_O = T q_B, T = [[I, [b]x], [0, I]]     rigid-body transfer, b = B - O
//
// Static condensation of the second row (exact for the harmonic steady state; e.g. Chopra,
// Dynamics of Structures, static condensation, applied here to the complex dynamic stiffness):
//   q_B = G u_U,   G = (T^T S_s T + D_b)^-1 T^T S_s
//   Z(w) = S_s - S_s T G                     support impedance seen by the upper block at O
//   force into the soil = (K_b (1 + 2 i beta) + i w C_b) q_B   (translational rows)
// The spring is a zero-length element at its top (z = 0 of O): the base takes the spring's force
// at the spring's top, so a horizontal spring force acts on the base with the spring height as
// lever arm (statics of the rigid base), and the upper block sees exactly the springs of the
// rigid-floor method.
import { CholeskyDecomposition, EigenvalueDecomposition, Matrix, inverse } from "ml-matrix";
import { ComplexSystem6 } from "./complex-lu";
import { DOF_KEYS, dofFromArray, type DofKey } from "./dof";
import { contactArea, type Box, type ContactArea } from "./geometry";
import { evaluateImpedanceMatrix, type ImpedanceModel } from "./impedance-model";
import { concreteParts } from "./mass-properties";
import { massMatrixAboutO } from "./mass-matrix";
import type { Mode } from "./eigen";
import type { SpringBaseInput } from "./schema";
import type { Vec3 } from "./vec3";

export interface BaseBlockModel {
  /** B, the centre of the base's underside, relative to O (m). */
  offset: Vec3;
  /** B in the input's coordinates. */
  position: Vec3;
  /** The base's box relative to B. */
  box: Box;
  mass: number;
  /** Rigid-body mass matrix of the base about B, row-major 6 x 6. */
  massMatrix: Float64Array;
  /** Footprint on the soil, centroid at B (0, 0), level 0. */
  area: ContactArea;
  thickness: number;
  /** Height of the springs: from the base's top face up to the block's underside (m). */
  springHeight: number;
  /** q_O = T q_B, row-major 6 x 6. */
  transfer: Float64Array;
}

/** T = [[I, [b]x], [0, I]]: the base's motion about B expressed about O (u_O = U_B + b x Theta). */
export function transferMatrix(b: Vec3): Float64Array {
  const T = new Float64Array(36);
  for (let i = 0; i < 6; i++) T[i * 7] = 1;
  const [bx, by, bz] = b;
  // [b]x = [[0, -bz, by], [bz, 0, -bx], [-by, bx, 0]] in rows 0..2, columns 3..5
  T[0 * 6 + 4] = -bz;
  T[0 * 6 + 5] = by;
  T[1 * 6 + 3] = bz;
  T[1 * 6 + 5] = -bx;
  T[2 * 6 + 3] = -by;
  T[2 * 6 + 4] = bx;
  return T;
}

/** The base block of the input: mass about B, footprint, spring height and the transfer T. */
export function baseBlockModel(base: SpringBaseInput, blockDensity: number, origin: Vec3): BaseBlockModel {
  const position: Vec3 = [(base.x[0] + base.x[1]) / 2, (base.y[0] + base.y[1]) / 2, base.z[0]];
  const offset: Vec3 = [position[0] - origin[0], position[1] - origin[1], position[2] - origin[2]];
  const box: Box = {
    x: [base.x[0] - position[0], base.x[1] - position[0]],
    y: [base.y[0] - position[1], base.y[1] - position[1]],
    z: [base.z[0] - position[2], base.z[1] - position[2]],
  };
  const parts = concreteParts([{ ...box, void: false }], base.concreteDensity ?? blockDensity);
  const area = contactArea([box], []);
  if (!area) throw new Error("internal error: the base block has no footprint");
  return {
    offset,
    position,
    box,
    mass: parts.reduce((s, p) => s + p.mass, 0),
    massMatrix: massMatrixAboutO(parts),
    area,
    thickness: base.z[1] - base.z[0],
    springHeight: origin[2] - base.z[1],
    transfer: transferMatrix(offset),
  };
}

/** A^T B C for real row-major 6 x 6 matrices (A^T B C with A = C = T gives the transfer of a stiffness). */
export function congruence(T: ArrayLike<number>, S: ArrayLike<number>): Float64Array {
  const ST = new Float64Array(36);
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
    let s = 0;
    for (let m = 0; m < 6; m++) s += (S[i * 6 + m] as number) * (T[m * 6 + j] as number);
    ST[i * 6 + j] = s;
  }
  const out = new Float64Array(36);
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
    let s = 0;
    for (let m = 0; m < 6; m++) s += (T[m * 6 + i] as number) * (ST[m * 6 + j] as number);
    out[i * 6 + j] = s;
  }
  return out;
}

export interface TwoStageParts {
  base: BaseBlockModel;
  /** The springs' own constant impedance at O (diagonal values; the rigid-floor model). */
  springs: ImpedanceModel;
  /** Full 6 x 6 springs' stiffness and dashpot at O (band factor applied). */
  springK: Float64Array;
  springC: Float64Array;
  /** The soil under the base, at B (a soil method for the base's footprint). */
  soil: ImpedanceModel;
  /** Material damping of the soil under the base. */
  beta: number;
  /** Mass matrix of the base and the upper block together about B (M_B + T^T M_U T): the mass on the soil. */
  massOnSoil: Float64Array;
}

/** Per-frequency operators of the condensation. */
export interface TwoStageOperators {
  /** Z(w) = S_s - S_s T G, row-major 6 x 6, real and imaginary parts. */
  Zre: Float64Array;
  Zim: Float64Array;
  /** q_B = G u_U. */
  Gre: Float64Array;
  Gim: Float64Array;
  /** Force into the soil per unit upper motion: rows 0..2 of (K_b (1 + 2 i beta) + i w C_b) G (3 x 6). */
  Rre: Float64Array;
  Rim: Float64Array;
  /** The soil's K_b(w), C_b(w) at B (6 x 6) at the last evaluation. */
  Kb: Float64Array;
  Cb: Float64Array;
}

export function twoStageOperators(): TwoStageOperators {
  return {
    Zre: new Float64Array(36),
    Zim: new Float64Array(36),
    Gre: new Float64Array(36),
    Gim: new Float64Array(36),
    Rre: new Float64Array(18),
    Rim: new Float64Array(18),
    Kb: new Float64Array(36),
    Cb: new Float64Array(36),
  };
}

const scratch = {
  system: new ComplexSystem6(),
  Pre: new Float64Array(36),
  Pim: new Float64Array(36),
  kd: new Float64Array(6),
  cd: new Float64Array(6),
  cols: Array.from({ length: 6 }, () => new Float64Array(6)),
  colsIm: Array.from({ length: 6 }, () => new Float64Array(6)),
  offsets: Int32Array.from([0, 6, 12, 18, 24, 30]),
  xr: new Float64Array(36),
  xi: new Float64Array(36),
};

/** Fills `out` with the condensation's operators at circular frequency omega; `beta` overrides the soil's material damping. */
export function evaluateTwoStage(parts: TwoStageParts, omega: number, out: TwoStageOperators, beta: number = parts.beta): void {
  const T = parts.base.transfer;
  const Ks = parts.springK;
  const Cs = parts.springC;
  const { Pre, Pim, system, cols, colsIm, offsets, xr, xi } = scratch;
  // P = T^T S_s (S_s = Ks + i w Cs)
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
    let r = 0;
    let m = 0;
    for (let k = 0; k < 6; k++) {
      const t = T[k * 6 + i] as number;
      r += t * (Ks[k * 6 + j] as number);
      m += t * omega * (Cs[k * 6 + j] as number);
    }
    Pre[i * 6 + j] = r;
    Pim[i * 6 + j] = m;
  }
  evaluateImpedanceMatrix(parts.soil, omega, out.Kb, out.Cb, scratch.kd, scratch.cd, true);
  const Mb = parts.base.massMatrix;
  const w2 = omega * omega;
  // A = P T + D_b
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
    let r = 0;
    let m = 0;
    for (let k = 0; k < 6; k++) {
      const t = T[k * 6 + j] as number;
      r += (Pre[i * 6 + k] as number) * t;
      m += (Pim[i * 6 + k] as number) * t;
    }
    const kb = out.Kb[i * 6 + j] as number;
    system.re[i * 6 + j] = r + kb - w2 * (Mb[i * 6 + j] as number);
    system.im[i * 6 + j] = m + 2 * beta * kb + omega * (out.Cb[i * 6 + j] as number);
  }
  system.factorise();
  // G = A^-1 P, column by column (column k of G lands at xr[6 k ..])
  for (let k = 0; k < 6; k++) {
    const cr = cols[k] as Float64Array;
    const ci = colsIm[k] as Float64Array;
    for (let i = 0; i < 6; i++) {
      cr[i] = Pre[i * 6 + k] as number;
      ci[i] = Pim[i * 6 + k] as number;
    }
  }
  system.solveMany(cols, colsIm, offsets, xr, xi);
  for (let i = 0; i < 6; i++) for (let k = 0; k < 6; k++) {
    out.Gre[i * 6 + k] = xr[6 * k + i] as number;
    out.Gim[i * 6 + k] = xi[6 * k + i] as number;
  }
  // Z = S_s - S_s T G, with S_s T = P^T (S_s symmetric, T real)
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
    let r = 0;
    let m = 0;
    for (let k = 0; k < 6; k++) {
      const ar = Pre[k * 6 + i] as number;
      const ai = Pim[k * 6 + i] as number;
      const gr = out.Gre[k * 6 + j] as number;
      const gi = out.Gim[k * 6 + j] as number;
      r += ar * gr - ai * gi;
      m += ar * gi + ai * gr;
    }
    out.Zre[i * 6 + j] = (Ks[i * 6 + j] as number) - r;
    out.Zim[i * 6 + j] = omega * (Cs[i * 6 + j] as number) - m;
  }
  // R = rows 0..2 of (K_b (1 + 2 i beta) + i w C_b) G
  for (let i = 0; i < 3; i++) for (let j = 0; j < 6; j++) {
    let r = 0;
    let m = 0;
    for (let k = 0; k < 6; k++) {
      const dr = out.Kb[i * 6 + k] as number;
      const di = 2 * beta * dr + omega * (out.Cb[i * 6 + k] as number);
      const gr = out.Gre[k * 6 + j] as number;
      const gi = out.Gim[k * 6 + j] as number;
      r += dr * gr - di * gi;
      m += dr * gi + di * gr;
    }
    out.Rre[i * 6 + j] = r;
    out.Rim[i * 6 + j] = m;
  }
}

/** The two-stage support as an impedance model of the upper block: K = Re Z, C = Im Z / w (0 at w = 0). */
export function twoStageImpedance(parts: TwoStageParts, details: Record<string, number>, warnings: string[]): ImpedanceModel {
  const ops = twoStageOperators();
  const fill = (omega: number, K: Float64Array, C: Float64Array) => {
    evaluateTwoStage(parts, omega, ops);
    for (let i = 0; i < 36; i++) {
      K[i] = ops.Zre[i] as number;
      C[i] = omega > 0 ? (ops.Zim[i] as number) / omega : 0;
    }
  };
  const K0 = new Float64Array(36);
  evaluateTwoStage(parts, 0, ops, 0);
  K0.set(ops.Zre);
  const K = new Float64Array(36);
  const C = new Float64Array(36);
  return {
    method: "springs",
    staticStiffness: Array.from({ length: 6 }, (_, i) => K0[i * 7] as number),
    frequencyDependent: true,
    evaluate(omega, k, c) {
      fill(omega, K, C);
      for (let i = 0; i < 6; i++) {
        k[i] = K[i * 7] as number;
        c[i] = C[i * 7] as number;
      }
    },
    evaluateMatrix(omega, Kout, Cout) {
      fill(omega, Kout, Cout);
    },
    twoStage: parts,
    details,
    warnings,
  };
}

/**
 * The twelve undamped modes: K12 phi = w^2 M12 phi with
 * K12 = [[K_s, -K_s T], [-T^T K_s, T^T K_s T + K_b]], M12 = diag(M_U, M_B), K_b the soil's real
 * stiffness at `omega` (the caller states which). Shapes mass-normalised over the twelve DOFs,
 * largest component positive; `shape` is the upper block's part (six values, as for every
 * method), `baseShape` the base's; participation per DOF key sums both blocks' kinetic energy
 * shares (diagonal masses); `upperShare` the upper block's share, `block` the one that dominates.
 */
export function twoStageModes(upperMass: ArrayLike<number>, parts: TwoStageParts, omega: number): Mode[] {
  const T = parts.base.transfer;
  const Ks = parts.springK;
  const Kb = new Float64Array(36);
  const Cb = new Float64Array(36);
  evaluateImpedanceMatrix(parts.soil, omega, Kb, Cb, new Float64Array(6), new Float64Array(6), true);
  const TtKsT = congruence(T, Ks);
  const K = Matrix.zeros(12, 12);
  const M = Matrix.zeros(12, 12);
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
    K.set(i, j, Ks[i * 6 + j] as number);
    let ksT = 0;
    for (let m = 0; m < 6; m++) ksT += (Ks[i * 6 + m] as number) * (T[m * 6 + j] as number);
    K.set(i, 6 + j, -ksT);
    K.set(6 + j, i, -ksT);
    K.set(6 + i, 6 + j, (TtKsT[i * 6 + j] as number) + (Kb[i * 6 + j] as number));
    M.set(i, j, upperMass[i * 6 + j] as number);
    M.set(6 + i, 6 + j, parts.base.massMatrix[i * 6 + j] as number);
  }
  const sym = (A: Matrix) => A.add(A.transpose()).mul(0.5);
  const Ms = sym(M);
  const chol = new CholeskyDecomposition(Ms);
  if (!chol.isPositiveDefinite()) throw new Error("mass matrix is not positive definite");
  const Linv = inverse(chol.lowerTriangularMatrix);
  const A = sym(Linv.mmul(sym(K)).mmul(Linv.transpose()));
  const evd = new EigenvalueDecomposition(A, { assumeSymmetric: true });
  const Phi = Linv.transpose().mmul(evd.eigenvectorMatrix);
  const massDiag = Array.from({ length: 12 }, (_, i) => Ms.get(i, i));
  const modes = evd.realEigenvalues.map((lambda, col) => {
    let shape = Phi.getColumn(col);
    const v = Matrix.columnVector(shape);
    const norm = Math.sqrt(Math.max(v.transpose().mmul(Ms).mmul(v).get(0, 0), 0));
    shape = shape.map((x) => x / norm);
    let big = 0;
    for (let i = 1; i < 12; i++) if (Math.abs(shape[i] as number) > Math.abs(shape[big] as number)) big = i;
    if ((shape[big] as number) < 0) shape = shape.map((x) => -x);
    const energy = shape.map((x, i) => (massDiag[i] as number) * x * x);
    const total = energy.reduce((s, e) => s + e, 0);
    const perDof = DOF_KEYS.map((_, i) => ((energy[i] as number) + (energy[6 + i] as number)) / total);
    const upperShare = energy.slice(0, 6).reduce((s, e) => s + e, 0) / total;
    let dominant = 0;
    for (let i = 1; i < 6; i++) if ((perDof[i] as number) > (perDof[dominant] as number)) dominant = i;
    const eigenvalue = Math.max(lambda, 0);
    const mode: Mode = {
      eigenvalue,
      frequencyHz: Math.sqrt(eigenvalue) / (2 * Math.PI),
      dominant: DOF_KEYS[dominant] as DofKey,
      participation: dofFromArray(perDof),
      shape: shape.slice(0, 6),
      baseShape: shape.slice(6),
      upperShare,
      block: upperShare >= 0.5 ? "upper" : "base",
    };
    return mode;
  });
  return modes.sort((a, b) => a.eigenvalue - b.eigenvalue);
}

/**
 * Closed-form undamped two-mass vertical system (m1 on k1 on m2 on k2 to ground):
 * det [[k1 - w^2 m1, -k1], [-k1, k1 + k2 - w^2 m2]] = 0, i.e.
 * m1 m2 w^4 - (k1 m2 + (k1 + k2) m1) w^2 + k1 k2 = 0 (Den Hartog, Mechanical Vibrations; Chopra,
 * Dynamics of Structures, two-DOF systems). Returns both frequencies in Hz, ascending.
 */
export function twoMassFrequenciesHz(m1: number, k1: number, m2: number, k2: number): [number, number] {
  const a = m1 * m2;
  const b = k1 * m2 + (k1 + k2) * m1;
  const c = k1 * k2;
  const disc = Math.sqrt(Math.max(b * b - 4 * a * c, 0));
  const lo = (b - disc) / (2 * a);
  const hi = (b + disc) / (2 * a);
  return [Math.sqrt(lo) / (2 * Math.PI), Math.sqrt(hi) / (2 * Math.PI)];
}

/**
 * The twelve-DOF time-domain model of a speed ramp (transient.ts): M12 = diag(M_U, M_B),
 * K12 = [[K_s, -K_s T], [-T^T K_s, T^T K_s T + K_b]], C12 the same with C_s and
 * C_b + 2 beta K_b / w_ref, the soil under the base frozen at w_ref and its material damping
 * made viscous there (the convention of the six-DOF ramp, transient.ts), row-major 12 x 12.
 */
export function twoStageTimeDomain(upperMass: ArrayLike<number>, parts: TwoStageParts, omegaRef: number): { M: Float64Array; K: Float64Array; C: Float64Array } {
  const T = parts.base.transfer;
  const Kb = new Float64Array(36);
  const Cb = new Float64Array(36);
  evaluateImpedanceMatrix(parts.soil, omegaRef, Kb, Cb, new Float64Array(6), new Float64Array(6), true);
  const n = 12;
  const M = new Float64Array(n * n);
  const K = new Float64Array(n * n);
  const C = new Float64Array(n * n);
  const fill = (out: Float64Array, S: Float64Array, soil: (i: number) => number) => {
    const StS = congruence(T, S);
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
      out[i * n + j] = S[i * 6 + j] as number;
      let sT = 0;
      for (let m = 0; m < 6; m++) sT += (S[i * 6 + m] as number) * (T[m * 6 + j] as number);
      out[i * n + 6 + j] = -sT;
      out[(6 + j) * n + i] = -sT;
      out[(6 + i) * n + 6 + j] = (StS[i * 6 + j] as number) + soil(i * 6 + j);
    }
  };
  fill(K, parts.springK, (ij) => Kb[ij] as number);
  fill(C, parts.springC, (ij) => (Cb[ij] as number) + (omegaRef > 0 ? (2 * parts.beta * (Kb[ij] as number)) / omegaRef : 0));
  for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
    M[i * n + j] = upperMass[i * 6 + j] as number;
    M[(6 + i) * n + 6 + j] = parts.base.massMatrix[i * 6 + j] as number;
  }
  return { M, K, C };
}

/** Solves the dense complex n x n system (Ar + i Ai) x = b by Gaussian elimination with partial pivoting (once per run: no hot loop). */
export function solveComplexDense(n: number, Ar: ArrayLike<number>, Ai: ArrayLike<number>, br: ArrayLike<number>, bi: ArrayLike<number>): { re: Float64Array; im: Float64Array } {
  const ar = Float64Array.from(Ar);
  const ai = Float64Array.from(Ai);
  const xr = Float64Array.from(br);
  const xi = Float64Array.from(bi);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.hypot(ar[r * n + c] as number, ai[r * n + c] as number) > Math.hypot(ar[p * n + c] as number, ai[p * n + c] as number)) p = r;
    if (p !== c) {
      for (let j = 0; j < n; j++) {
        const t = ar[c * n + j] as number;
        ar[c * n + j] = ar[p * n + j] as number;
        ar[p * n + j] = t;
        const u = ai[c * n + j] as number;
        ai[c * n + j] = ai[p * n + j] as number;
        ai[p * n + j] = u;
      }
      const t = xr[c] as number;
      xr[c] = xr[p] as number;
      xr[p] = t;
      const u = xi[c] as number;
      xi[c] = xi[p] as number;
      xi[p] = u;
    }
    const dr = ar[c * n + c] as number;
    const di = ai[c * n + c] as number;
    const den = dr * dr + di * di;
    if (!(den > 0)) throw new Error("internal error: singular system");
    for (let r = c + 1; r < n; r++) {
      const er = ar[r * n + c] as number;
      const ei = ai[r * n + c] as number;
      // f = e / d
      const fr = (er * dr + ei * di) / den;
      const fi = (ei * dr - er * di) / den;
      for (let j = c; j < n; j++) {
        const cr = ar[c * n + j] as number;
        const ci = ai[c * n + j] as number;
        ar[r * n + j] = (ar[r * n + j] as number) - (fr * cr - fi * ci);
        ai[r * n + j] = (ai[r * n + j] as number) - (fr * ci + fi * cr);
      }
      const cr = xr[c] as number;
      const ci = xi[c] as number;
      xr[r] = (xr[r] as number) - (fr * cr - fi * ci);
      xi[r] = (xi[r] as number) - (fr * ci + fi * cr);
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let sr = xr[i] as number;
    let si = xi[i] as number;
    for (let j = i + 1; j < n; j++) {
      const a = ar[i * n + j] as number;
      const b = ai[i * n + j] as number;
      sr -= a * (xr[j] as number) - b * (xi[j] as number);
      si -= a * (xi[j] as number) + b * (xr[j] as number);
    }
    const dr = ar[i * n + i] as number;
    const di = ai[i * n + i] as number;
    const den = dr * dr + di * di;
    xr[i] = (sr * dr + si * di) / den;
    xi[i] = (si * dr - sr * di) / den;
  }
  return { re: xr, im: xi };
}
