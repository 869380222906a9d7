// Discrete algebraic Riccati equation by the structure-preserving doubling algorithm.
//   X = A' X A - A' X B (R + B' X B)^-1 B' X A + Q
// Doubling (Chu, Fan, Lin, Wang 2004, "Structure-preserving algorithms for periodic
// discrete-time algebraic Riccati equations", Int. J. Control 77(8)): with
// A0 = A, G0 = B R^-1 B', H0 = Q and W = I + G_k H_k,
//   A_{k+1} = A_k W^-1 A_k,  G_{k+1} = G_k + A_k W^-1 G_k A_k',  H_{k+1} = H_k + A_k' H_k W^-1 A_k,
// H_k -> X quadratically (each step doubles the horizon). No Schur form needed.
// Setup-time code (ml-matrix objects); not for hot loops.
import { Matrix, inverse } from 'ml-matrix';

export interface DareSolution {
  /** X: stabilizing solution (n x n). */
  X: Matrix;
  /** K = (R + B' X B)^-1 B' X A, so u = -K x (m x n). */
  K: Matrix;
  /** Doubling steps taken. */
  iterations: number;
}

export class DareError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DareError';
  }
}

/** Largest |entry| (ml-matrix's abs() works in place, so not used on live matrices). */
function maxAbs(M: Matrix): number {
  let m = 0;
  for (const row of M.to2DArray()) for (const v of row) m = Math.max(m, Math.abs(v));
  return m;
}

/** Max-abs entry of the DARE residual A'XA - A'XB (R + B'XB)^-1 B'XA + Q - X. */
export function dareResidual(A: Matrix, B: Matrix, Q: Matrix, R: Matrix, X: Matrix): number {
  const At = A.transpose();
  const XA = X.mmul(A);
  const BtXA = B.transpose().mmul(XA);
  const S = R.clone().add(B.transpose().mmul(X).mmul(B));
  const res = At.mmul(XA).sub(BtXA.transpose().mmul(inverse(S)).mmul(BtXA)).add(Q).sub(X);
  return maxAbs(res);
}

/**
 * Solve the DARE for (A, B, Q, R), Q symmetric >= 0, R symmetric > 0, (A, B) stabilizable.
 * @throws DareError when the doubling does not converge in `maxIterations`.
 * @example dareSolve(new Matrix([[1]]), new Matrix([[1]]), new Matrix([[1]]), new Matrix([[1]])).X.get(0, 0) // 1.618...
 */
export function dareSolve(A: Matrix, B: Matrix, Q: Matrix, R: Matrix, maxIterations = 60, tolerance = 1e-13): DareSolution {
  const n = A.rows;
  const I = Matrix.eye(n);
  let Ak = A.clone();
  let G = B.mmul(inverse(R)).mmul(B.transpose());
  let H = Q.clone();
  for (let k = 1; k <= maxIterations; k++) {
    const Winv = inverse(I.clone().add(G.mmul(H)));
    const AW = Ak.mmul(Winv);
    const nextA = AW.mmul(Ak);
    const nextG = G.clone().add(AW.mmul(G).mmul(Ak.transpose()));
    const nextH = H.clone().add(Ak.transpose().mmul(H).mmul(Winv).mmul(Ak));
    const change = maxAbs(nextH.clone().sub(H));
    Ak = nextA;
    G = nextG.add(nextG.transpose()).mul(0.5); // keep symmetric against round-off
    H = nextH.add(nextH.transpose()).mul(0.5);
    if (!Number.isFinite(change)) break;
    if (change <= tolerance * Math.max(1, maxAbs(H))) {
      const K = inverse(R.clone().add(B.transpose().mmul(H).mmul(B))).mmul(B.transpose()).mmul(H).mmul(A);
      return { X: H, K, iterations: k };
    }
  }
  throw new DareError(`Riccati doubling did not converge in ${maxIterations} steps (is (A, B) stabilizable and R > 0?)`);
}
