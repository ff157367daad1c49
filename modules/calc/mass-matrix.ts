// 6 x 6 rigid-body mass matrix about O, DOF order x, y, z, rx, ry, rz.
// Each part (mass m, cg r relative to O, inertia I_cg):
//   [[ m I3,     -m [r]x                         ],
//    [ m [r]x,    I_cg + m (|r|^2 I3 - r r^T)    ]]
// with [r]x a = r x a (kinetic energy of a rigid body whose point O moves with u_t and
// rotates with theta: the velocity of a point p is u_t + theta x p).
import type { MassPart } from "./mass-properties";

/** Row-major 6 x 6 mass matrix about O. */
export function massMatrixAboutO(parts: MassPart[]): Float64Array {
  const M = new Float64Array(36);
  for (const p of parts) {
    const [x, y, z] = p.cg;
    const m = p.mass;
    // [r]x = [[0, -z, y], [z, 0, -x], [-y, x, 0]]
    const skew = [
      [0, -z, y],
      [z, 0, -x],
      [-y, x, 0],
    ];
    const rr = x * x + y * y + z * z;
    const r = [x, y, z];
    for (let i = 0; i < 3; i++) {
      M[i * 6 + i] = (M[i * 6 + i] as number) + m;
      for (let j = 0; j < 3; j++) {
        const s = (skew[i] as number[])[j] as number;
        // upper right block -m [r]x, lower left block m [r]x
        M[i * 6 + 3 + j] = (M[i * 6 + 3 + j] as number) - m * s;
        M[(3 + i) * 6 + j] = (M[(3 + i) * 6 + j] as number) + m * s;
        const own = i === j ? (p.inertiaAtCg[i] as number) : 0;
        const parallel = m * ((i === j ? rr : 0) - (r[i] as number) * (r[j] as number));
        M[(3 + i) * 6 + 3 + j] = (M[(3 + i) * 6 + 3 + j] as number) + own + parallel;
      }
    }
  }
  return M;
}

/** Diagonal of a row-major 6 x 6 matrix. */
export function diagonal6(M: Float64Array): number[] {
  return [0, 1, 2, 3, 4, 5].map((i) => M[i * 7] as number);
}
