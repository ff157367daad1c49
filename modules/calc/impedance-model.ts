// Common shape of the impedance methods: springs and dashpots at O. The engine carries a full
// real symmetric 6 x 6 stiffness K(w) and dashpot C(w) (support impedance K(w) + i w C(w) at
// O); the methods of a diagonal impedance fill six values (`evaluate`), a coupled method (the
// pile group) also the off-diagonal terms (`evaluateMatrix`). `evaluateImpedanceMatrix` wraps
// the two at the assembly level.
import type { ContactArea } from "./geometry";
import type { SoilProperties } from "./soil";
import type { BaseBlockModel, TwoStageParts } from "./two-stage";

export interface ImpedanceContext {
  soil: SoilProperties;
  /** Base contact area, centroid at O. */
  base: ContactArea;
  /** Diagonal of the mass matrix about O: m, m, m, I_xx,O, I_yy,O, I_zz,O. */
  massDiagonal: number[];
  /** O in plan in the input's coordinates (springs are placed in input coordinates). */
  origin?: [number, number];
  /** Springs on a base block (two-stage.ts): the base, the soil under it (band factor in G, its own material damping) and the upper block's mass matrix about O. */
  baseBlock?: { model: BaseBlockModel; soil: SoilProperties; upperMass: Float64Array };
}

export interface ImpedanceModel {
  method: "equivalent-radius" | "gazetas" | "user" | "springs" | "piles";
  /** Static stiffness per DOF (embedment included), order x, y, z, rx, ry, rz. */
  staticStiffness: number[];
  frequencyDependent: boolean;
  /** Real dynamic stiffness K(w) and dashpot C(w) per DOF at circular frequency w (rad/s). */
  evaluate(omega: number, k: Float64Array, c: Float64Array): void;
  /**
   * Coupled methods only: the full K(w) and C(w), row-major 6 x 6, symmetric, diagonal equal
   * to what `evaluate` gives. Absent: the impedance is diagonal (off-diagonal terms zero).
   */
  evaluateMatrix?(omega: number, K: Float64Array, C: Float64Array): void;
  /**
   * Springs on a base block only: the parts of the exact condensation (two-stage.ts); the
   * harmonic solver then assembles the complex Z(w) itself (K = Re Z, C = Im Z / w otherwise).
   */
  twoStage?: TwoStageParts;
  /** Method-specific intermediate values shown in the result. */
  details: Record<string, number>;
  warnings: string[];
}

/** Dashpot from a damping ratio: c = 2 D sqrt(k M_ii) (viscous damping of an oscillator). */
export function dashpotFromRatio(dampingRatio: number, stiffness: number, massTerm: number): number {
  return 2 * dampingRatio * Math.sqrt(stiffness * massTerm);
}

/** Damping ratio of a dashpot: D = c / (2 sqrt(k M_ii)). */
export function ratioFromDashpot(dashpot: number, stiffness: number, massTerm: number): number {
  return dashpot / (2 * Math.sqrt(stiffness * massTerm));
}

/** A frequency-independent model from fixed springs and dashpots. */
export function constantImpedance(
  method: ImpedanceModel["method"],
  stiffness: number[],
  dashpot: number[],
  details: Record<string, number>,
  warnings: string[],
): ImpedanceModel {
  return {
    method,
    staticStiffness: stiffness,
    frequencyDependent: false,
    evaluate(_omega, k, c) {
      for (let i = 0; i < 6; i++) {
        k[i] = stiffness[i] as number;
        c[i] = dashpot[i] as number;
      }
    },
    details,
    warnings,
  };
}

/**
 * Full 6 x 6 K(w), C(w) (row-major, 36 values each) of any method into K and C. A diagonal
 * method writes its six values onto the diagonal; its off-diagonal entries are set to zero
 * here only when `clearOffDiagonal` (a caller that reuses K, C for one diagonal model clears
 * them once). kDiag, cDiag receive the diagonal in every case.
 */
export function evaluateImpedanceMatrix(
  model: ImpedanceModel,
  omega: number,
  K: Float64Array,
  C: Float64Array,
  kDiag: Float64Array,
  cDiag: Float64Array,
  clearOffDiagonal: boolean,
): void {
  if (model.evaluateMatrix) {
    model.evaluateMatrix(omega, K, C);
    for (let i = 0; i < 6; i++) {
      kDiag[i] = K[i * 7] as number;
      cDiag[i] = C[i * 7] as number;
    }
    return;
  }
  if (clearOffDiagonal) {
    K.fill(0);
    C.fill(0);
  }
  model.evaluate(omega, kDiag, cDiag);
  for (let i = 0; i < 6; i++) {
    K[i * 7] = kDiag[i] as number;
    C[i * 7] = cDiag[i] as number;
  }
}

/** Row-major 6 x 6 with `diag` on the diagonal (the diagonal methods' matrix). */
export function diagonalMatrix6(diag: ArrayLike<number>): Float64Array {
  const out = new Float64Array(36);
  for (let i = 0; i < 6; i++) out[i * 7] = diag[i] as number;
  return out;
}

/** The upper off-diagonal terms i < j that are not zero, for the result (coupled methods). */
export function offDiagonalTerms(K: Float64Array, C: Float64Array): { i: number; j: number; stiffness: number; dashpot: number }[] {
  const out: { i: number; j: number; stiffness: number; dashpot: number }[] = [];
  for (let i = 0; i < 6; i++) {
    for (let j = i + 1; j < 6; j++) {
      const k = K[i * 6 + j] as number;
      const c = C[i * 6 + j] as number;
      if (k !== 0 || c !== 0) out.push({ i, j, stiffness: k, dashpot: c });
    }
  }
  return out;
}
