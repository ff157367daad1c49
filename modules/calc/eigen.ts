// Undamped natural modes: the generalised symmetric eigenproblem K phi = w^2 M phi, solved with
// ml-matrix (Cholesky M = L L^T, then the symmetric eigen-decomposition of L^-1 K L^-T).
import { CholeskyDecomposition, EigenvalueDecomposition, Matrix, inverse } from "ml-matrix";
import { DOF_KEYS, dofFromArray, type DofKey } from "./dof";
import type { ModeResult } from "./result-types";

export interface Mode extends ModeResult {
  /** Eigenvalue w^2 (rad^2/s^2). */
  eigenvalue: number;
}

function toMatrix(rowMajor: ArrayLike<number>): Matrix {
  const m = new Matrix(6, 6);
  for (let i = 0; i < 6; i++) {
    for (let j = 0; j < 6; j++) {
      // symmetric part, guarding against round-off asymmetry
      m.set(i, j, ((rowMajor[i * 6 + j] as number) + (rowMajor[j * 6 + i] as number)) / 2);
    }
  }
  return m;
}

/**
 * Modes ascending by frequency. Shapes are mass-normalised (phi^T M phi = 1) with the
 * largest-magnitude component positive; participation_i = M_ii phi_i^2 / sum_j M_jj phi_j^2
 * (share of each DOF in the diagonal kinetic energy); dominant = the largest share.
 */
export function naturalModes(massRowMajor: ArrayLike<number>, stiffness: ArrayLike<number>): Mode[] {
  const M = toMatrix(massRowMajor);
  // `stiffness`: the six diagonal values, or the full row-major 6 x 6 (a coupled support)
  let K: Matrix;
  if (stiffness.length === 36) {
    K = toMatrix(stiffness);
  } else {
    K = Matrix.zeros(6, 6);
    for (let i = 0; i < 6; i++) K.set(i, i, stiffness[i] as number);
  }
  const chol = new CholeskyDecomposition(M);
  if (!chol.isPositiveDefinite()) throw new Error("mass matrix is not positive definite");
  const Linv = inverse(chol.lowerTriangularMatrix);
  const A = Linv.mmul(K).mmul(Linv.transpose());
  const As = A.add(A.transpose()).mul(0.5);
  const evd = new EigenvalueDecomposition(As, { assumeSymmetric: true });
  const values = evd.realEigenvalues;
  const Y = evd.eigenvectorMatrix;
  const Phi = Linv.transpose().mmul(Y);
  const massDiag = DOF_KEYS.map((_, i) => M.get(i, i));
  const modes: Mode[] = values.map((lambda, col) => {
    let shape = Phi.getColumn(col);
    const norm = Math.sqrt(Math.max(Matrix.columnVector(shape).transpose().mmul(M).mmul(Matrix.columnVector(shape)).get(0, 0), 0));
    shape = shape.map((v) => v / norm);
    let big = 0;
    for (let i = 1; i < 6; i++) if (Math.abs(shape[i] as number) > Math.abs(shape[big] as number)) big = i;
    if ((shape[big] as number) < 0) shape = shape.map((v) => -v);
    const energy = shape.map((v, i) => (massDiag[i] as number) * v * v);
    const total = energy.reduce((s, e) => s + e, 0);
    const share = energy.map((e) => e / total);
    let dominant = 0;
    for (let i = 1; i < 6; i++) if ((share[i] as number) > (share[dominant] as number)) dominant = i;
    const eigenvalue = Math.max(lambda, 0);
    return {
      eigenvalue,
      frequencyHz: Math.sqrt(eigenvalue) / (2 * Math.PI),
      dominant: DOF_KEYS[dominant] as DofKey,
      participation: dofFromArray(share),
      shape,
    };
  });
  return modes.sort((a, b) => a.eigenvalue - b.eigenvalue);
}
