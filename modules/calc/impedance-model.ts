// Common shape of the three impedance methods: diagonal springs and dashpots at O.
import type { ContactArea } from "./geometry";
import type { SoilProperties } from "./soil";

export interface ImpedanceContext {
  soil: SoilProperties;
  /** Base contact area, centroid at O. */
  base: ContactArea;
  /** Diagonal of the mass matrix about O: m, m, m, I_xx,O, I_yy,O, I_zz,O. */
  massDiagonal: number[];
  /** O in plan in the input's coordinates (springs are placed in input coordinates). */
  origin?: [number, number];
}

export interface ImpedanceModel {
  method: "equivalent-radius" | "gazetas" | "user" | "springs";
  /** Static stiffness per DOF (embedment included), order x, y, z, rx, ry, rz. */
  staticStiffness: number[];
  frequencyDependent: boolean;
  /** Real dynamic stiffness K(w) and dashpot C(w) per DOF at circular frequency w (rad/s). */
  evaluate(omega: number, k: Float64Array, c: Float64Array): void;
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
