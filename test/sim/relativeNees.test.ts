import { Matrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { relativeNees } from '../../estimator/sim/relativeNees.js';
import { RandomStream } from '../../estimator/random/RandomStream.js';
import { expectClose } from '../helpers/expectClose.js';

describe('relativeNees', () => {
  it('equals eᵀ (T P Tᵀ)⁻¹ e computed with ml-matrix (second implementation)', () => {
    const n = 12;
    const rand = RandomStream.fromKey([7]);
    const G = Matrix.zeros(n, n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) G.set(i, j, rand.gaussian());
    const P = G.mmul(G.transpose()).add(Matrix.eye(n).mul(0.5));
    const x = Array.from({ length: n }, () => rand.gaussian());
    const r = [0.1, -0.2, 0.3], vC = [1, 2, 0], vL = [0.5, 2.2, -0.1];
    const T = Matrix.zeros(6, n);
    for (let i = 0; i < 3; i++) {
      T.set(i, i, 1);
      T.set(3 + i, 3 + i, 1);
      T.set(3 + i, 6 + i, -1);
    }
    const e = new Matrix([[...[0, 1, 2].map((i) => x[i]! - r[i]!), ...[0, 1, 2].map((i) => x[3 + i]! - x[6 + i]! - (vC[i]! - vL[i]!))]]).transpose();
    const expected = e.transpose().mmul(inverse(T.mmul(P).mmul(T.transpose()))).mmul(e).get(0, 0);
    const got = relativeNees(x, P.to1DArray(), n, r, vC, vL);
    expectClose(got, expected, { rel: 1e-9 }, 'NEES (round-off of two solvers)');
  });

  it('is NaN when the block is not positive definite', () => {
    expect(relativeNees(new Float64Array(12), new Float64Array(144), 12, [1, 0, 0], [0, 0, 0], [0, 0, 0])).toBeNaN();
  });
});
