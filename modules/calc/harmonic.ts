// Damped harmonic steady state of the six-DOF block:
//   S(w) U = F,  S(w) = K(w) (1 + 2 i beta) + i w C(w) - w^2 M,  u(t) = Re(U e^{i w t}),
// displacement of a point p relative to O: u_p = U_t + Theta x p; soil reaction at O:
// (K (1 + 2 i beta) + i w C) U (translational part). K and C are full 6 x 6 at O (a pile group
// couples sway and rocking); the diagonal methods have zeros off the diagonal.
import { ComplexSystem6 } from "./complex-lu";
import { evaluateImpedanceMatrix, type ImpedanceModel } from "./impedance-model";
import { evaluateTwoStage, twoStageOperators, type TwoStageOperators } from "./two-stage";
import type { UnitLoad } from "./unbalance";

/** Responses U of a list of loads: load l occupies [6 l, 6 l + 6) of re and im. */
export interface ResponseSet {
  re: Float64Array;
  im: Float64Array;
}

export function responseSet(loadCount: number): ResponseSet {
  return { re: new Float64Array(6 * loadCount), im: new Float64Array(6 * loadCount) };
}

interface SolvePlan {
  re: Float64Array[];
  im: (Float64Array | null)[];
  offsets: Int32Array;
  combined: { l: number; a: number; b: number }[];
}

const plans = new WeakMap<UnitLoad[], SolvePlan>();

/** Which loads need a solve (all at once) and which are combinations of others; cached per list. */
function solvePlan(loads: UnitLoad[]): SolvePlan {
  const cached = plans.get(loads);
  if (cached) return cached;
  const direct = loads.map((load, l) => ({ load, l })).filter(({ load }) => !load.combine);
  const plan: SolvePlan = {
    re: direct.map(({ load }) => load.re),
    im: direct.map(({ load }) => (load.realOnly ? null : load.im)),
    offsets: Int32Array.from(direct, ({ l }) => 6 * l),
    combined: loads.flatMap((load, l) => (load.combine ? [{ l, a: load.combine.a, b: load.combine.b }] : [])),
  };
  plans.set(loads, plan);
  return plan;
}

export class HarmonicSolver {
  readonly system = new ComplexSystem6();
  /** Diagonal of K(w), C(w) at the current frequency. */
  readonly k = new Float64Array(6);
  readonly c = new Float64Array(6);
  /** Full K(w), C(w), row-major 6 x 6 (off-diagonal zeros for a diagonal method). */
  readonly K = new Float64Array(36);
  readonly C = new Float64Array(36);
  omega = 0;
  /** The impedance has off-diagonal terms (pile group); otherwise the diagonal fast path. */
  readonly coupled: boolean;
  /**
   * Springs on a base block: the exact condensation's operators at the current frequency. S(w)
   * is then Z(w) - w^2 M with the complex Z assembled directly, and `transmittedForce` is the
   * force into the soil under the base (two-stage.ts).
   */
  readonly twoStage: TwoStageOperators | null;

  constructor(
    private readonly massMatrix: Float64Array,
    private readonly impedance: ImpedanceModel,
    private readonly beta: number,
  ) {
    this.coupled = impedance.evaluateMatrix !== undefined;
    this.twoStage = impedance.twoStage ? twoStageOperators() : null;
  }

  /** Evaluates K(w), C(w), assembles S(w) and factorises it (once per frequency). */
  setFrequency(omega: number): void {
    this.omega = omega;
    const ts = this.twoStage;
    if (ts && this.impedance.twoStage) {
      evaluateTwoStage(this.impedance.twoStage, omega, ts);
      const re = this.system.re;
      const im = this.system.im;
      const w2 = omega * omega;
      for (let i = 0; i < 36; i++) {
        const z = ts.Zre[i] as number;
        this.K[i] = z;
        this.C[i] = omega > 0 ? (ts.Zim[i] as number) / omega : 0;
        re[i] = z - w2 * (this.massMatrix[i] as number);
        im[i] = ts.Zim[i] as number;
      }
      for (let i = 0; i < 6; i++) {
        this.k[i] = this.K[i * 7] as number;
        this.c[i] = this.C[i * 7] as number;
      }
      this.system.factorise();
      return;
    }
    // K, C start at zero and a diagonal method only writes the diagonal: nothing to clear
    evaluateImpedanceMatrix(this.impedance, omega, this.K, this.C, this.k, this.c, false);
    this.system.assemble(omega, this.massMatrix, this.K, this.C, this.beta);
    this.system.factorise();
  }

  /**
   * Solves every load with the current factors into `out`; a rotating load is formed as
   * U[a] - i U[b] from the two loads it combines (linearity), without a solve.
   */
  solveAll(loads: UnitLoad[], out: ResponseSet): void {
    const plan = solvePlan(loads);
    this.system.solveMany(plan.re, plan.im, plan.offsets, out.re, out.im);
    const re = out.re;
    const im = out.im;
    for (const { l, a, b } of plan.combined) {
      const o = 6 * l;
      const oa = 6 * a;
      const ob = 6 * b;
      for (let j = 0; j < 6; j++) {
        // (ar + i ai) - i (br + i bi) = (ar + bi) + i (ai - br)
        re[o + j] = (re[oa + j] as number) + (im[ob + j] as number);
        im[o + j] = (im[oa + j] as number) - (re[ob + j] as number);
      }
    }
  }

  /**
   * Amplitudes of response l at each point (coords flat, relative to O), scaled by `scale`:
   * per axis |u_p| in out[3 i + axis] when `perAxis`, else only the largest component in out[i]
   * (one square root per point: the sweep's and the envelopes' hot path).
   */
  pointAmplitudes(u: ResponseSet, l: number, coords: Float64Array, scale: number, out: Float64Array, perAxis: boolean): void {
    const o = 6 * l;
    const ur = u.re;
    const ui = u.im;
    const Uxr = ur[o] as number;
    const Uyr = ur[o + 1] as number;
    const Uzr = ur[o + 2] as number;
    const txr = ur[o + 3] as number;
    const tyr = ur[o + 4] as number;
    const tzr = ur[o + 5] as number;
    const Uxi = ui[o] as number;
    const Uyi = ui[o + 1] as number;
    const Uzi = ui[o + 2] as number;
    const txi = ui[o + 3] as number;
    const tyi = ui[o + 4] as number;
    const tzi = ui[o + 5] as number;
    const n = coords.length / 3;
    for (let i = 0; i < n; i++) {
      const px = coords[3 * i] as number;
      const py = coords[3 * i + 1] as number;
      const pz = coords[3 * i + 2] as number;
      // u_p = U_t + Theta x p
      const axr = Uxr + tyr * pz - tzr * py;
      const axi = Uxi + tyi * pz - tzi * py;
      const ayr = Uyr + tzr * px - txr * pz;
      const ayi = Uyi + tzi * px - txi * pz;
      const azr = Uzr + txr * py - tyr * px;
      const azi = Uzi + txi * py - tyi * px;
      const ax = axr * axr + axi * axi;
      const ay = ayr * ayr + ayi * ayi;
      const az = azr * azr + azi * azi;
      if (perAxis) {
        out[3 * i] = Math.sqrt(ax) * scale;
        out[3 * i + 1] = Math.sqrt(ay) * scale;
        out[3 * i + 2] = Math.sqrt(az) * scale;
      } else {
        out[i] = Math.sqrt(ax > ay ? (ax > az ? ax : az) : ay > az ? ay : az) * scale;
      }
    }
  }

  /**
   * Translational soil reaction of response l, scaled: per-axis amplitudes written to out (when
   * given); returns their vector norm.
   */
  transmittedForce(u: ResponseSet, l: number, scale: number, out: Float64Array | null): number {
    let sum = 0;
    const K = this.K;
    const C = this.C;
    const b2 = 2 * this.beta;
    const w = this.omega;
    const o = 6 * l;
    const ts = this.twoStage;
    if (ts) {
      // force into the soil: R U (two-stage.ts)
      for (let j = 0; j < 3; j++) {
        let fr = 0;
        let fi = 0;
        for (let m = 0; m < 6; m++) {
          const rr = ts.Rre[j * 6 + m] as number;
          const ri = ts.Rim[j * 6 + m] as number;
          const ur = u.re[o + m] as number;
          const ui = u.im[o + m] as number;
          fr += rr * ur - ri * ui;
          fi += rr * ui + ri * ur;
        }
        const a2 = fr * fr + fi * fi;
        if (out) out[j] = Math.sqrt(a2) * scale;
        sum += a2;
      }
      return Math.sqrt(sum) * scale;
    }
    if (!this.coupled) {
      for (let j = 0; j < 3; j++) {
        const kj = this.k[j] as number;
        const damp = b2 * kj + w * (this.c[j] as number);
        const ur = u.re[o + j] as number;
        const ui = u.im[o + j] as number;
        const fr = kj * ur - damp * ui;
        const fi = kj * ui + damp * ur;
        const a2 = fr * fr + fi * fi;
        if (out) out[j] = Math.sqrt(a2) * scale;
        sum += a2;
      }
      return Math.sqrt(sum) * scale;
    }
    for (let j = 0; j < 3; j++) {
      // row j of (K (1 + 2 i beta) + i w C) U; the zero terms of a diagonal method add exactly 0
      let fr = 0;
      let fi = 0;
      for (let m = 0; m < 6; m++) {
        const km = K[j * 6 + m] as number;
        const damp = b2 * km + w * (C[j * 6 + m] as number);
        const ur = u.re[o + m] as number;
        const ui = u.im[o + m] as number;
        fr += km * ur - damp * ui;
        fi += km * ui + damp * ur;
      }
      const a2 = fr * fr + fi * fi;
      if (out) out[j] = Math.sqrt(a2) * scale;
      sum += a2;
    }
    return Math.sqrt(sum) * scale;
  }
}

/**
 * Springs on a base block: the base's motion q_B = G U (about B) and the springs' relative
 * motion U - T q_B (about O) of response l, unscaled, into the given 6-arrays. Rigid floor: the
 * relative motion is U itself and the base's motion zero.
 */
export function baseAndRelativeMotion(
  solver: HarmonicSolver,
  transfer: Float64Array | null,
  u: ResponseSet,
  l: number,
  base: { re: Float64Array; im: Float64Array },
  rel: { re: Float64Array; im: Float64Array },
): void {
  const o = 6 * l;
  const ts = solver.twoStage;
  if (!ts || !transfer) {
    for (let j = 0; j < 6; j++) {
      base.re[j] = 0;
      base.im[j] = 0;
      rel.re[j] = u.re[o + j] as number;
      rel.im[j] = u.im[o + j] as number;
    }
    return;
  }
  for (let i = 0; i < 6; i++) {
    let r = 0;
    let m = 0;
    for (let k = 0; k < 6; k++) {
      const gr = ts.Gre[i * 6 + k] as number;
      const gi = ts.Gim[i * 6 + k] as number;
      const ur = u.re[o + k] as number;
      const ui = u.im[o + k] as number;
      r += gr * ur - gi * ui;
      m += gr * ui + gi * ur;
    }
    base.re[i] = r;
    base.im[i] = m;
  }
  for (let i = 0; i < 6; i++) {
    let r = 0;
    let m = 0;
    for (let k = 0; k < 6; k++) {
      const t = transfer[i * 6 + k] as number;
      r += t * (base.re[k] as number);
      m += t * (base.im[k] as number);
    }
    rel.re[i] = (u.re[o + i] as number) - r;
    rel.im[i] = (u.im[o + i] as number) - m;
  }
}

/** Force amplitude at w of a rotor whose amplitude at the rated speed is fRated: F (w / w_r)^2. */
export function forceAt(fRated: number, omegaRated: number, omega: number): number {
  const r = omega / omegaRated;
  return fRated * r * r;
}
