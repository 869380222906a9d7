import { describe, expect, it } from 'vitest';
import { predictCovariance, predictState } from '../../estimator/filter/predict.js';
import { innovationCovariance, updateJoseph } from '../../estimator/filter/update.js';
import { UpdateWorkspace } from '../../estimator/filter/UpdateWorkspace.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';
import { constantVelocity } from './linearModels.js';

/** Run predict + update (dense core) until the gain settles; return K and the prior/posterior P. */
function steadyState(F: Float64Array, Q: Float64Array, H: Float64Array, R: Float64Array, n: number, m: number, steps: number) {
  const x = new Float64Array(n);
  const P = new Float64Array(n * n);
  for (let i = 0; i < n; i++) P[i * n + i] = 100;
  const ws = new UpdateWorkspace(n, m);
  const work = new Float64Array(n * n);
  let prior = new Float64Array(n * n);
  for (let k = 0; k < steps; k++) {
    predictState(x, F, n, work);
    predictCovariance(P, F, Q, n, work);
    prior = P.slice();
    expect(innovationCovariance(P, H, R, n, m, ws)).toBe(true);
    ws.y.fill(0);
    updateJoseph(x, P, H, R, n, m, ws);
  }
  return { K: ws.K.slice(0, n * m), prior, posterior: P };
}

describe('predict + update reach published steady states', () => {
  // Kalata 1984, "The tracking index: a generalized parameter for alpha-beta and alpha-beta-gamma
  // target trackers", IEEE Trans. AES 20(2); Bar-Shalom, Li, Kirubarajan 2001, section 6.5
  // [section number from memory]: with lambda = sigma_v T² / sigma_w and the discrete white-noise
  // acceleration Q, the steady gain is K = [alpha, beta / T].
  const cases = [
    { lambda: 1, alpha: 0.75, beta: 0.5, source: 'exact' },
    { lambda: 0.1, alpha: 0.36, beta: 0.08, source: 'exact' },
    { lambda: 2, alpha: 0.8541019662, beta: 0.7639320225, source: '10 decimals' },
  ];
  for (const c of cases) {
    it(`alpha-beta gains for tracking index ${c.lambda} (Kalata 1984): alpha ${c.alpha}, beta ${c.beta}`, () => {
      const T = 0.5, sigmaW = 1.3;
      const { F, Q } = constantVelocity(T, (c.lambda * sigmaW) / (T * T));
      const { K } = steadyState(F, Q, new Float64Array([1, 0]), new Float64Array([sigmaW * sigmaW]), 2, 1, 400);
      // 1e-9: the Riccati recursion converges geometrically; the reference values are exact or
      // printed to 10 decimals.
      expectClose(K[0]!, c.alpha, { abs: 1e-9 }, 'alpha');
      expectClose(K[1]! * T, c.beta, { abs: 1e-9 }, 'beta');
    });
  }

  it('scalar random walk, Q = R = 1: prior P = golden ratio 1.6180340, K = 0.6180340 (scalar Riccati p² - Qp - QR = 0; common practice)', () => {
    const { K, prior, posterior } = steadyState(new Float64Array([1]), new Float64Array([1]), new Float64Array([1]), new Float64Array([1]), 1, 1, 100);
    // 1e-12: closed form (Q + sqrt(Q² + 4QR)) / 2, reached to round-off.
    expectClose(prior[0]!, (1 + Math.sqrt(5)) / 2, { abs: 1e-12 }, 'prior P');
    expectClose(K[0]!, (Math.sqrt(5) - 1) / 2, { abs: 1e-12 }, 'K');
    expectClose(posterior[0]!, K[0]! * 1, { abs: 1e-12 }, 'posterior P = K R');
  });

  it('scalar random walk, Q = 0.5, R = 2: steady prior (Q + sqrt(Q² + 4QR)) / 2 (scalar Riccati closed form; common practice)', () => {
    const { prior } = steadyState(new Float64Array([1]), new Float64Array([0.5]), new Float64Array([1]), new Float64Array([2]), 1, 1, 200);
    expectClose(prior[0]!, (0.5 + Math.sqrt(0.25 + 4)) / 2, { abs: 1e-12 }, 'prior P');
  });

  it('Welch & Bishop random constant: R = 0.01, Q = 1e-5, P0 = 1 -> P = 3.392e-4 after 50 steps (Welch & Bishop, "An Introduction to the Kalman Filter", UNC TR 95-041; value from the recursion)', () => {
    const x = new Float64Array([0]);
    const P = new Float64Array([1]);
    const F = new Float64Array([1]), Q = new Float64Array([1e-5]), H = new Float64Array([1]), R = new Float64Array([0.01]);
    const ws = new UpdateWorkspace(1, 1), work = new Float64Array(1);
    for (let k = 0; k < 50; k++) {
      predictCovariance(P, F, Q, 1, work);
      innovationCovariance(P, H, R, 1, 1, ws);
      ws.y[0] = -0.37727 - x[0]!;
      updateJoseph(x, P, H, R, 1, 1, ws);
    }
    // 5e-8: the reference is quoted to four significant figures.
    expectClose(P[0]!, 3.392e-4, { abs: 5e-8 }, 'P after 50 steps');
  });

  it('predictCovariance keeps P exactly symmetric and equals F P Fᵀ + Q', () => {
    const F = new Float64Array([1, 0.1, 0.005, 0, 1, 0.1, 0, 0, 1]);
    const P = new Float64Array([2, 0.3, -0.1, 0.3, 1.5, 0.2, -0.1, 0.2, 0.8]);
    const Q = new Float64Array([1e-3, 0, 0, 0, 2e-3, 0, 0, 0, 3e-3]);
    const expected = new Float64Array(9);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
      let s = Q[3 * i + j]!;
      for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) s += F[3 * i + a]! * P[3 * a + b]! * F[3 * j + b]!;
      expected[3 * i + j] = s;
    }
    predictCovariance(P, F, Q, 3, new Float64Array(9));
    // 1e-15: same products, different summation order.
    expectAllClose(P, expected, { abs: 1e-15 }, 'P');
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(P[3 * i + j]).toBe(P[3 * j + i]);
  });
});
