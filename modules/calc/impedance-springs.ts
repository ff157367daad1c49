// Block on steel springs (inertia block on isolators): the springs' catalogue stiffness kz, kh
// and optional viscous dampers cz, ch, assembled at O. Each spring is a translational spring at
// (x_i, y_i) in the base plane (z = 0 at O, the underside of the block where the spring tops
// bear); u_p = U + Theta x p gives the stiffness about O (rigid-body kinematics, e.g. Chopra,
// Dynamics of Structures, ch. 9 on rigid-body stiffness by direct equilibrium):
//   K_xx = K_yy = sum kh, K_zz = sum kz, K_rxrx = sum kz y^2, K_ryry = sum kz x^2,
//   K_rzrz = sum kh (x^2 + y^2),
//   K_z,rx = sum kz y, K_z,ry = -sum kz x, K_rx,ry = -sum kz x y, K_x,rz = -sum kh y, K_y,rz = sum kh x.
// The engine's impedance is diagonal at O (impedance-model.ts), so the layout must make the
// off-diagonal terms vanish (stiffness and damping centre at O, sum kz x y = 0): the input
// consistency rules refuse any other layout, rather than drop the coupling (which would be an
// unchecked simplification).
import type { ImpedanceContext, ImpedanceModel } from "./impedance-model";
import { constantImpedance, dashpotFromRatio } from "./impedance-model";

export interface SpringInput {
  x: number;
  y: number;
  kz: number;
  kh: number;
  cz?: number | undefined;
  ch?: number | undefined;
}

/** Relative size of an off-diagonal term, against the layout, below which it counts as zero. */
export const SPRING_SYMMETRY_TOLERANCE = 1e-3;

/** Default damping ratio of steel springs without dampers: 0.5 % (recalled from memory, common practice for helical steel springs). */
export const STEEL_SPRING_DAMPING_DEFAULT = 0.005;

/**
 * Full 6 x 6 stiffness (or damping, with "c") of the springs at O, row-major, DOF order
 * x, y, z, rx, ry, rz; positions relative to O.
 */
export function springMatrix(springs: SpringInput[], which: "k" | "c", origin: [number, number] = [0, 0]): number[] {
  const m = new Array<number>(36).fill(0);
  const add = (i: number, j: number, v: number) => {
    m[i * 6 + j] = (m[i * 6 + j] as number) + v;
    if (i !== j) m[j * 6 + i] = (m[j * 6 + i] as number) + v;
  };
  for (const s of springs) {
    const x = s.x - origin[0];
    const y = s.y - origin[1];
    const v = which === "k" ? s.kz : (s.cz ?? 0);
    const h = which === "k" ? s.kh : (s.ch ?? 0);
    add(0, 0, h);
    add(1, 1, h);
    add(2, 2, v);
    add(3, 3, v * y * y);
    add(4, 4, v * x * x);
    add(5, 5, h * (x * x + y * y));
    add(2, 3, v * y);
    add(2, 4, -v * x);
    add(3, 4, -v * x * y);
    add(0, 5, -h * y);
    add(1, 5, h * x);
  }
  return m;
}

/** Off-diagonal terms of the springs' matrix that do not vanish, with a message each. */
export function springCouplingIssues(springs: SpringInput[], origin: [number, number] = [0, 0]): string[] {
  const span = Math.max(1e-9, ...springs.map((s) => Math.max(Math.abs(s.x - origin[0]), Math.abs(s.y - origin[1]))));
  const issues: string[] = [];
  for (const which of ["k", "c"] as const) {
    const m = springMatrix(springs, which, origin);
    const name = which === "k" ? "stiffness" : "damper";
    const sumV = m[2 * 6 + 2] as number;
    const sumH = m[0] as number;
    const test = (value: number, scale: number, what: string) => {
      if (scale > 0 && Math.abs(value) > SPRING_SYMMETRY_TOLERANCE * scale) issues.push(`${what} is ${value.toPrecision(3)}, not 0`);
    };
    test(m[2 * 6 + 3] as number, sumV * span, `the vertical ${name} moment about O, sum ${which}z y,`);
    test(m[2 * 6 + 4] as number, sumV * span, `the vertical ${name} moment about O, sum ${which}z x,`);
    test(m[3 * 6 + 4] as number, sumV * span * span, `the product term sum ${which}z x y`);
    test(m[0 * 6 + 5] as number, sumH * span, `the horizontal ${name} moment about O, sum ${which}h y,`);
    test(m[1 * 6 + 5] as number, sumH * span, `the horizontal ${name} moment about O, sum ${which}h x,`);
  }
  return issues;
}

/**
 * The springs' impedance at O (diagonal; the consistency rules guarantee the coupling vanishes).
 * Dashpots: the dampers' cz, ch assembled like the springs when any is given, else
 * c_i = 2 D sqrt(k_i M_ii) with D = dampingRatio (default STEEL_SPRING_DAMPING_DEFAULT).
 * `factor` scales the stiffness (the band's factor, as for user springs).
 */
export function springsImpedance(
  ctx: ImpedanceContext,
  springs: SpringInput[],
  dampingRatio: number | undefined,
  factor: number,
  origin: [number, number],
): ImpedanceModel {
  const km = springMatrix(springs, "k", origin);
  const k = [0, 1, 2, 3, 4, 5].map((i) => (km[i * 7] as number) * factor);
  const dampers = springs.some((s) => s.cz !== undefined || s.ch !== undefined);
  const cm = springMatrix(springs, "c", origin);
  const ratio = dampingRatio ?? STEEL_SPRING_DAMPING_DEFAULT;
  const c = dampers
    ? [0, 1, 2, 3, 4, 5].map((i) => cm[i * 7] as number)
    : k.map((ki, i) => dashpotFromRatio(ratio, ki, ctx.massDiagonal[i] as number));
  const warnings: string[] = [];
  if (!dampers && dampingRatio === undefined) {
    warnings.push(`Springs: no dampers or damping ratio given; ${(STEEL_SPRING_DAMPING_DEFAULT * 100).toFixed(1)} % of critical is taken for steel springs (common practice, value recalled from memory).`);
  }
  return constantImpedance("springs", k, c, { stiffnessFactor: factor, springCount: springs.length, sumKz: k[2] as number, sumKh: k[0] as number }, warnings);
}

/**
 * Transmissibility of a viscously damped SDOF system under harmonic force at frequency ratio r:
 * TR = sqrt(1 + (2 zeta r)^2) / sqrt((1 - r^2)^2 + (2 zeta r)^2) (Chopra, Dynamics of
 * Structures, §3.6). TR = 1 at r = sqrt 2 for every zeta, TR < 1 above it.
 */
export function transmissibility(r: number, zeta: number): number {
  const d = 2 * zeta * r;
  return Math.sqrt(1 + d * d) / Math.sqrt((1 - r * r) ** 2 + d * d);
}

/** Smallest operating-to-isolator frequency ratio for good isolation: about 3 (common practice). */
export const ISOLATION_MIN_RATIO = 3;
export const ISOLATION_RATIO_SOURCE = "common practice: operating speed at least about 3 times the highest isolator natural frequency for good isolation";
export const TRANSMISSIBILITY_SOURCE = "Chopra, Dynamics of Structures, §3.6: TR = sqrt(1 + (2 zeta r)^2) / sqrt((1 - r^2)^2 + (2 zeta r)^2), vertical mode as SDOF";
