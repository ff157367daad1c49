// Lean complex 6 x 6 solver for the harmonic steady state: the dynamic stiffness
//   S(w) = K(w) (1 + 2 i beta) + i w C(w) - w^2 M
// is assembled into Float64Arrays, factorised once per frequency by Gaussian elimination with
// partial pivoting (LU), and the factors are reused for every load vector (solved together). No allocation per
// frequency: this is the hot loop of the sweep.

export class ComplexSystem6 {
  readonly re = new Float64Array(36);
  readonly im = new Float64Array(36);
  /** Row order after all pivoting: row i of the factors came from row perm[i] of S. */
  private readonly perm = new Int32Array(6);
  /** Reciprocals of the U diagonal, so a solve multiplies instead of dividing. */
  private readonly invRe = new Float64Array(6);
  private readonly invIm = new Float64Array(6);

  /**
   * S(w) from the row-major mass matrix M and the row-major 6 x 6 K(w), C(w) (symmetric; the
   * diagonal methods have zeros off the diagonal); beta = material damping on every entry of K.
   */
  assemble(omega: number, M: Float64Array, K: Float64Array, C: Float64Array, beta: number): void {
    const w2 = omega * omega;
    const re = this.re;
    const im = this.im;
    const b2 = 2 * beta;
    for (let i = 0; i < 36; i++) {
      const ki = K[i] as number;
      re[i] = -w2 * (M[i] as number) + ki;
      im[i] = b2 * ki + omega * (C[i] as number);
    }
  }

  /** In-place LU factorisation with partial pivoting (largest modulus in the column). */
  factorise(): void {
    const re = this.re;
    const im = this.im;
    const perm = this.perm;
    for (let i = 0; i < 6; i++) perm[i] = i;
    for (let col = 0; col < 6; col++) {
      let p = col;
      let best = -1;
      for (let r = col; r < 6; r++) {
        const a = re[r * 6 + col] as number;
        const b = im[r * 6 + col] as number;
        const mag = a * a + b * b;
        if (mag > best) {
          best = mag;
          p = r;
        }
      }
      if (p !== col) {
        const t = perm[col] as number;
        perm[col] = perm[p] as number;
        perm[p] = t;
        for (let j = 0; j < 6; j++) {
          const t1 = re[col * 6 + j] as number;
          re[col * 6 + j] = re[p * 6 + j] as number;
          re[p * 6 + j] = t1;
          const t2 = im[col * 6 + j] as number;
          im[col * 6 + j] = im[p * 6 + j] as number;
          im[p * 6 + j] = t2;
        }
      }
      const dr = re[col * 7] as number;
      const di = im[col * 7] as number;
      const den = dr * dr + di * di;
      if (!(den > 0)) throw new Error("dynamic stiffness matrix is singular");
      // 1 / pivot
      const invR = dr / den;
      const invI = -di / den;
      this.invRe[col] = invR;
      this.invIm[col] = invI;
      for (let r = col + 1; r < 6; r++) {
        const ar = re[r * 6 + col] as number;
        const ai = im[r * 6 + col] as number;
        const lr = ar * invR - ai * invI;
        const li = ar * invI + ai * invR;
        re[r * 6 + col] = lr;
        im[r * 6 + col] = li;
        for (let j = col + 1; j < 6; j++) {
          const ur = re[col * 6 + j] as number;
          const ui = im[col * 6 + j] as number;
          re[r * 6 + j] = (re[r * 6 + j] as number) - (lr * ur - li * ui);
          im[r * 6 + j] = (im[r * 6 + j] as number) - (lr * ui + li * ur);
        }
      }
    }
  }

  /**
   * Solves S x_k = b_k for several right-hand sides at once, x_k written to xr, xi at offset
   * offsets[k]. The innermost loop runs over the right-hand sides, so their independent
   * updates pipeline (the single-RHS solve is latency bound).
   */
  solveMany(bRe: Float64Array[], bIm: (Float64Array | null)[], offsets: Int32Array, xr: Float64Array, xi: Float64Array): void {
    const re = this.re;
    const im = this.im;
    const perm = this.perm;
    const n = offsets.length;
    for (let k = 0; k < n; k++) {
      const o = offsets[k] as number;
      const br = bRe[k] as Float64Array;
      const bi = bIm[k] ?? null;
      for (let i = 0; i < 6; i++) {
        const src = perm[i] as number;
        xr[o + i] = br[src] as number;
        xi[o + i] = bi === null ? 0 : (bi[src] as number);
      }
    }
    for (let i = 1; i < 6; i++) {
      for (let j = 0; j < i; j++) {
        const lr = re[i * 6 + j] as number;
        const li = im[i * 6 + j] as number;
        for (let k = 0; k < n; k++) {
          const o = offsets[k] as number;
          const br = xr[o + j] as number;
          const bi = xi[o + j] as number;
          xr[o + i] = (xr[o + i] as number) - (lr * br - li * bi);
          xi[o + i] = (xi[o + i] as number) - (lr * bi + li * br);
        }
      }
    }
    for (let i = 5; i >= 0; i--) {
      for (let j = i + 1; j < 6; j++) {
        const ur = re[i * 6 + j] as number;
        const ui = im[i * 6 + j] as number;
        for (let k = 0; k < n; k++) {
          const o = offsets[k] as number;
          const br = xr[o + j] as number;
          const bi = xi[o + j] as number;
          xr[o + i] = (xr[o + i] as number) - (ur * br - ui * bi);
          xi[o + i] = (xi[o + i] as number) - (ur * bi + ui * br);
        }
      }
      const ir = this.invRe[i] as number;
      const ii = this.invIm[i] as number;
      for (let k = 0; k < n; k++) {
        const o = offsets[k] as number;
        const sr = xr[o + i] as number;
        const si = xi[o + i] as number;
        xr[o + i] = sr * ir - si * ii;
        xi[o + i] = sr * ii + si * ir;
      }
    }
  }
}
