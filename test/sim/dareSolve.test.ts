import { Matrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { DareError, dareResidual, dareSolve } from '../../estimator/sim/dareSolve.js';
import { expectClose } from '../helpers/expectClose.js';

/** Plain Riccati value iteration, the slow second implementation (symmetrized each step:
 * the recursion amplifies round-off asymmetry otherwise). */
function riccatiIteration(A: Matrix, B: Matrix, Q: Matrix, R: Matrix, steps: number): Matrix {
  let X = Q.clone();
  for (let k = 0; k < steps; k++) {
    const BtXA = B.transpose().mmul(X).mmul(A);
    const S = R.clone().add(B.transpose().mmul(X).mmul(B));
    X = A.transpose().mmul(X).mmul(A).sub(BtXA.transpose().mmul(inverse(S)).mmul(BtXA)).add(Q);
    X = X.add(X.transpose()).mul(0.5);
  }
  return X;
}

describe('dareSolve', () => {
  it('solves the scalar case a = b = q = r = 1: x^2 - x - 1 = 0, x = golden ratio (derived here)', () => {
    const one = new Matrix([[1]]);
    const { X, K } = dareSolve(one, one, one, one);
    // x = a^2 x - a^2 b^2 x^2 / (r + b^2 x) + q  ->  x^2 - q x - q r = 0  ->  x = (1 + sqrt 5) / 2
    expectClose(X.get(0, 0), (1 + Math.sqrt(5)) / 2, { rel: 1e-12 }, 'X (round-off only)');
    expectClose(K.get(0, 0), (1 + Math.sqrt(5)) / 2 / (1 + (1 + Math.sqrt(5)) / 2), { rel: 1e-12 }, 'K (round-off only)');
  });

  it('leaves a DARE residual of ~0 and a stable closed loop on a 3-state system', () => {
    const A = new Matrix([[1.02, 0.1, 0], [0, 0.97, 0.2], [0.05, 0, 1.01]]);
    const B = new Matrix([[0, 0.1], [0.1, 0], [0, 0.05]]);
    const Q = new Matrix([[2, 0, 0], [0, 1, 0], [0, 0, 0.5]]);
    const R = new Matrix([[0.3, 0], [0, 0.7]]);
    const { X, K, iterations } = dareSolve(A, B, Q, R);
    expect(iterations).toBeLessThan(30);
    expect(dareResidual(A, B, Q, R, X)).toBeLessThan(1e-9 * X.max()); // round-off level
    const closed = A.clone().sub(B.mmul(K));
    let v = Matrix.ones(3, 1);
    for (let k = 0; k < 2000; k++) v = closed.mmul(v);
    expect(v.norm()).toBeLessThan(1e-6); // spectral radius < 1
  });

  it('agrees with plain Riccati value iteration on the 3-state system and a double integrator', () => {
    const A3 = new Matrix([[1.02, 0.1, 0], [0, 0.97, 0.2], [0.05, 0, 1.01]]);
    const B3 = new Matrix([[0, 0.1], [0.1, 0], [0, 0.05]]);
    const Q3 = new Matrix([[2, 0, 0], [0, 1, 0], [0, 0, 0.5]]);
    const R3 = new Matrix([[0.3, 0], [0, 0.7]]);
    const fast3 = dareSolve(A3, B3, Q3, R3).X;
    const slow3 = riccatiIteration(A3, B3, Q3, R3, 3000);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expectClose(fast3.get(i, j), slow3.get(i, j), { rel: 1e-8, abs: 1e-9 }, `X3 ${i}${j} (iteration converged)`);
    const dt = 0.05;
    const A = new Matrix([[1, dt], [0, 1]]);
    const B = new Matrix([[dt * dt / 2], [dt]]);
    const Q = new Matrix([[1, 0], [0, 0.2]]);
    const R = new Matrix([[0.5]]);
    const fast = dareSolve(A, B, Q, R).X;
    const slow = riccatiIteration(A, B, Q, R, 20000);
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expectClose(fast.get(i, j), slow.get(i, j), { rel: 1e-8 }, `X${i}${j} (iteration converged)`);
  });

  it('throws a named error when no stabilizing solution exists', () => {
    // unstable and uncontrollable: a = 2, b = 0
    expect(() => dareSolve(new Matrix([[2]]), new Matrix([[0]]), new Matrix([[1]]), new Matrix([[1]]))).toThrow(DareError);
  });
});
