// Newmark's average-acceleration method (Newmark, N. M. 1959, "A method of computation for
// structural dynamics", J. Eng. Mech. Div. ASCE 85(EM3), gamma = 1/2, beta = 1/4; also Chopra,
// Dynamics of Structures, sec. 5.4) for
//   M u'' + C u' + K u = f(t),
// M symmetric positive definite (the full mass matrix about O), K and C symmetric, given as
// their n diagonal values (the diagonal supports) or as full n x n row-major matrices (a pile
// group couples sway and rocking at O). The scheme is unconditionally stable and, for an undamped system,
// conserves the energy 1/2 v^T M v + 1/2 u^T K u exactly; its only error on a free vibration is
// a period elongation: the amplification matrix of a mode of frequency w has the eigenvalues
// (1 - W^2/4 +- i W) / (1 + W^2/4), W = w dt, of modulus 1 and argument 2 atan(W / 2), so the
// computed period is T W / (2 atan(W / 2)) (derived from the update formulas below).
//
// Total (not incremental) form: the effective stiffness K^ = K + (2/dt) C + (4/dt^2) M is constant,
// factorised once (Cholesky, hand-written for n <= 6 so that the step loop allocates nothing):
//   K^ u1 = f1 + M (4/dt^2 u0 + 4/dt v0 + a0) + C (2/dt u0 + v0)
//   a1 = 4/dt^2 (u1 - u0) - 4/dt v0 - a0,   v1 = v0 + dt/2 (a0 + a1)

/** Cholesky A = L L^T of a symmetric positive-definite n x n row-major matrix; L written to `out`. */
export function choleskyFactor(A: ArrayLike<number>, n: number, out: Float64Array): void {
  out.fill(0);
  for (let j = 0; j < n; j++) {
    let d = A[j * n + j] as number;
    for (let k = 0; k < j; k++) {
      const l = out[j * n + k] as number;
      d -= l * l;
    }
    if (!(d > 0)) throw new Error("internal error: matrix is not positive definite");
    const ljj = Math.sqrt(d);
    out[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = A[i * n + j] as number;
      for (let k = 0; k < j; k++) s -= (out[i * n + k] as number) * (out[j * n + k] as number);
      out[i * n + j] = s / ljj;
    }
  }
}

/** Solves L L^T x = b (x may alias b). */
export function choleskySolve(L: Float64Array, n: number, b: Float64Array, x: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = b[i] as number;
    for (let k = 0; k < i; k++) s -= (L[i * n + k] as number) * (x[k] as number);
    x[i] = s / (L[i * n + i] as number);
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i] as number;
    for (let k = i + 1; k < n; k++) s -= (L[k * n + i] as number) * (x[k] as number);
    x[i] = s / (L[i * n + i] as number);
  }
}

export class NewmarkAverageAcceleration {
  readonly n: number;
  readonly dt: number;
  /** Displacement, velocity and acceleration at the current time. */
  readonly u: Float64Array;
  readonly v: Float64Array;
  readonly a: Float64Array;
  private readonly M: Float64Array;
  /** Full K and C, n x n row-major. */
  private readonly K: Float64Array;
  private readonly C: Float64Array;
  /** Diagonal of C, and whether C has off-diagonal terms (the step's fast path skips them). */
  private readonly c: Float64Array;
  private readonly cFull: boolean;
  private readonly L: Float64Array;
  private readonly w: Float64Array;
  private readonly rhs: Float64Array;
  private readonly tmp: Float64Array;

  /**
   * @param mass n x n row-major, symmetric positive definite
   * @param stiffness K: its n diagonal values, or n x n row-major (symmetric)
   * @param damping C: its n diagonal values, or n x n row-major (symmetric)
   */
  constructor(mass: ArrayLike<number>, stiffness: ArrayLike<number>, damping: ArrayLike<number>, dt: number) {
    const n = Math.round(Math.sqrt(mass.length));
    const full = (a: ArrayLike<number>): Float64Array => {
      if (a.length === n * n) return Float64Array.from(a);
      if (a.length !== n) throw new Error("internal error: matrix sizes differ");
      const out = new Float64Array(n * n);
      for (let i = 0; i < n; i++) out[i * n + i] = a[i] as number;
      return out;
    };
    if (n * n !== mass.length) throw new Error("internal error: matrix sizes differ");
    if (!(dt > 0)) throw new Error("internal error: the time step must be positive");
    this.n = n;
    this.dt = dt;
    this.M = Float64Array.from(mass);
    this.K = full(stiffness);
    this.C = full(damping);
    this.c = new Float64Array(n);
    let off = false;
    for (let i = 0; i < n; i++) {
      this.c[i] = this.C[i * n + i] as number;
      for (let j = 0; j < n; j++) if (i !== j && this.C[i * n + j] !== 0) off = true;
    }
    this.cFull = off;
    this.u = new Float64Array(n);
    this.v = new Float64Array(n);
    this.a = new Float64Array(n);
    this.w = new Float64Array(n);
    this.rhs = new Float64Array(n);
    this.tmp = new Float64Array(n);
    // K^ = 4/dt^2 M + K + 2/dt C, entry by entry (the diagonal supports add zeros off the diagonal)
    const Khat = new Float64Array(n * n);
    for (let i = 0; i < n * n; i++) Khat[i] = (4 / (dt * dt)) * (this.M[i] as number) + (this.K[i] as number) + (2 / dt) * (this.C[i] as number);
    this.L = new Float64Array(n * n);
    choleskyFactor(Khat, n, this.L);
  }

  /** Initial state: u0, v0 given, a0 from the equation of motion M a0 = f0 - C v0 - K u0. */
  start(u0: ArrayLike<number>, v0: ArrayLike<number>, f0: ArrayLike<number>): void {
    const n = this.n;
    const Lm = new Float64Array(n * n);
    choleskyFactor(this.M, n, Lm);
    for (let i = 0; i < n; i++) {
      this.u[i] = u0[i] as number;
      this.v[i] = v0[i] as number;
    }
    for (let i = 0; i < n; i++) {
      // diagonal terms first (as for a diagonal support), then the coupling terms
      let s = (f0[i] as number) - (this.C[i * n + i] as number) * (this.v[i] as number) - (this.K[i * n + i] as number) * (this.u[i] as number);
      for (let j = 0; j < n; j++) {
        if (j !== i) s -= (this.C[i * n + j] as number) * (this.v[j] as number) + (this.K[i * n + j] as number) * (this.u[j] as number);
      }
      this.rhs[i] = s;
    }
    choleskySolve(Lm, n, this.rhs, this.a);
  }

  /** Advances one step dt to the state under the force f at the end of the step. Allocates nothing. */
  step(f: ArrayLike<number>): void {
    const n = this.n;
    const dt = this.dt;
    const c4 = 4 / (dt * dt);
    const c3 = 4 / dt;
    const c2 = 2 / dt;
    // K enters through the factor of K^ only
    const { u, v, a, M, c, w, rhs, tmp } = this;
    for (let i = 0; i < n; i++) w[i] = c4 * (u[i] as number) + c3 * (v[i] as number) + (a[i] as number);
    if (!this.cFull) {
      for (let i = 0; i < n; i++) {
        let s = (f[i] as number) + (c[i] as number) * (c2 * (u[i] as number) + (v[i] as number));
        for (let j = 0; j < n; j++) s += (M[i * n + j] as number) * (w[j] as number);
        rhs[i] = s;
      }
    } else {
      const C = this.C;
      for (let i = 0; i < n; i++) tmp[i] = c2 * (u[i] as number) + (v[i] as number);
      for (let i = 0; i < n; i++) {
        let s = f[i] as number;
        for (let j = 0; j < n; j++) s += (C[i * n + j] as number) * (tmp[j] as number);
        for (let j = 0; j < n; j++) s += (M[i * n + j] as number) * (w[j] as number);
        rhs[i] = s;
      }
    }
    choleskySolve(this.L, n, rhs, rhs);
    for (let i = 0; i < n; i++) {
      const u0 = u[i] as number;
      const v0 = v[i] as number;
      const a0 = a[i] as number;
      const u1 = rhs[i] as number;
      const a1 = c4 * (u1 - u0) - c3 * v0 - a0;
      u[i] = u1;
      a[i] = a1;
      v[i] = v0 + 0.5 * dt * (a0 + a1);
    }
  }
}
