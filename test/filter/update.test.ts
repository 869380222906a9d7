import { describe, expect, it } from 'vitest';
import { createRequire } from 'node:module';
import { predictCovariance, predictState } from '../../estimator/filter/predict.js';
import { assertPositiveDefinite, innovationCovariance, normalizedInnovationSquared, NotPositiveDefiniteError, updateJoseph } from '../../estimator/filter/update.js';
import { UpdateWorkspace } from '../../estimator/filter/UpdateWorkspace.js';
import { cholesky } from '../../estimator/filter/cholesky.js';
import { averagedChiSquareInterval } from '../../estimator/stats/chiSquare.js';
import { RandomStream, streamId } from '../../estimator/random/RandomStream.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';
import { constantVelocity } from './linearModels.js';

// kalman-filter is CommonJS without types: load it through require and type the two calls we use.
const { KalmanFilter } = createRequire(import.meta.url)('kalman-filter') as { KalmanFilter: new (options: object) => { predict(o: object): KfState; correct(o: object): KfState } };
interface KfState { mean: number[][]; covariance: number[][] }

describe('updateJoseph', () => {
  it('agrees to 1e-9 with the npm kalman-filter package on a linear constant-velocity problem (independent implementation)', () => {
    // kalman-filter 2.x: updates P as (I - K H) P, and its first predict starts from `init`:
    // so we start from the same x0, P0 and predict before every correct.
    const T = 0.1;
    const { F, Q } = constantVelocity(T, 0.7);
    const R = 0.25;
    const x0 = [0.5, -1.2], P0 = [4, 0.3, 0.3, 1];
    const reference = new KalmanFilter({
      observation: { dimension: 1, stateProjection: [[1, 0]], covariance: [[R]] },
      dynamic: { dimension: 2, transition: [[1, T], [0, 1]], covariance: [[Q[0], Q[1]], [Q[2], Q[3]]], init: { mean: [[x0[0]], [x0[1]]], covariance: [[P0[0], P0[1]], [P0[2], P0[3]]] } },
    });
    const x = Float64Array.from(x0), P = Float64Array.from(P0);
    const H = new Float64Array([1, 0]), Rm = new Float64Array([R]);
    const ws = new UpdateWorkspace(2, 1), work = new Float64Array(4);
    const stream = RandomStream.fromKey([7, streamId('kalman-filter agreement')]);
    let previous: KfState | null = null;
    for (let k = 0; k < 60; k++) {
      const z = 0.5 + 0.3 * k * T + stream.normal(0, 0.5);
      const predicted = reference.predict({ previousCorrected: previous });
      previous = reference.correct({ predicted, observation: [z] });
      predictState(x, F, 2, work);
      predictCovariance(P, F, Q, 2, work);
      innovationCovariance(P, H, Rm, 2, 1, ws);
      ws.y[0] = z - x[0]!;
      updateJoseph(x, P, H, Rm, 2, 1, ws);
      // 1e-9 as the issue demands; Joseph vs (I - K H) P differ only by round-off.
      expectAllClose(x, [previous.mean[0]![0]!, previous.mean[1]![0]!], { abs: 1e-9 }, `x at step ${k}`);
      expectAllClose(P, previous.covariance.flat(), { abs: 1e-9 }, `P at step ${k}`);
    }
  });

  it('Joseph form equals (I - K H) P for the optimal gain and keeps P symmetric', () => {
    const n = 3, m = 2;
    const P = new Float64Array([2, 0.3, -0.1, 0.3, 1.5, 0.2, -0.1, 0.2, 0.8]);
    const H = new Float64Array([1, 0, 0.5, 0, 1, -0.2]);
    const R = new Float64Array([0.4, 0.05, 0.05, 0.3]);
    const ws = new UpdateWorkspace(n, m);
    innovationCovariance(P, H, R, n, m, ws);
    ws.y.set([0.2, -0.1]);
    const simple = new Float64Array(9);
    const x = new Float64Array(3);
    const P0 = P.slice();
    updateJoseph(x, P, H, R, n, m, ws);
    const K = ws.K;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      let s = P0[i * n + j]!;
      for (let a = 0; a < m; a++) for (let k = 0; k < n; k++) s -= K[i * m + a]! * H[a * n + k]! * P0[k * n + j]!;
      simple[i * n + j] = s;
    }
    // 1e-14: the two forms agree algebraically for the optimal K; only round-off differs.
    expectAllClose(P, simple, { abs: 1e-14 }, 'P');
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(P[i * n + j]).toBe(P[j * n + i]);
  });

  it('normalizedInnovationSquared is yᵀ S⁻¹ y (worked by hand for a diagonal S)', () => {
    const ws = new UpdateWorkspace(2, 2);
    innovationCovariance(new Float64Array([1, 0, 0, 3]), new Float64Array([1, 0, 0, 1]), new Float64Array([1, 0, 0, 1]), 2, 2, ws);
    ws.y.set([2, 4]);
    // S = diag(2, 4): NIS = 4/2 + 16/4 = 6 exactly.
    expectClose(normalizedInnovationSquared(ws, 2), 6, { abs: 1e-15 }, 'NIS');
  });

  it('refuses a non-positive-definite R with a named error', () => {
    expect(() => assertPositiveDefinite(new Float64Array([1, 2, 2, 1]), 2, 'R', new Float64Array(4))).toThrow(NotPositiveDefiniteError);
    expect(() => assertPositiveDefinite(new Float64Array([1, 0.1, 0.3, 1]), 2, 'R', new Float64Array(4))).toThrow(/R is not symmetric positive definite/);
    expect(() => assertPositiveDefinite(new Float64Array([1, 0.1, 0.1, 1]), 2, 'R', new Float64Array(4))).not.toThrow();
  });

  it('innovationCovariance reports a non-positive-definite S instead of inverting it', () => {
    const ws = new UpdateWorkspace(1, 1);
    expect(innovationCovariance(new Float64Array([1]), new Float64Array([1]), new Float64Array([-2]), 1, 1, ws)).toBe(false);
    expect(innovationCovariance(new Float64Array([Number.NaN]), new Float64Array([1]), new Float64Array([1]), 1, 1, ws)).toBe(false);
  });
});

/** Monte Carlo NEES of a constant-velocity filter; R assumed = rFactor x the true R. */
function neesPerStep(runs: number, steps: number, rFactor: number): number[] {
  const T = 0.1, sigmaV = 0.5, sigmaW = 0.3;
  const { F, Q } = constantVelocity(T, sigmaV);
  const H = new Float64Array([1, 0]);
  const Rtrue = sigmaW * sigmaW;
  const R = new Float64Array([Rtrue * rFactor]);
  const LQ = new Float64Array(4);
  cholesky(Q, 2, LQ);
  const P0 = new Float64Array([1, 0, 0, 0.25]);
  const sums = new Array<number>(steps).fill(0);
  const ws = new UpdateWorkspace(2, 1), work = new Float64Array(4);
  for (let run = 0; run < runs; run++) {
    const stream = RandomStream.fromKey([2001, run, streamId('nees')]);
    const x = new Float64Array([0, 1]), P = P0.slice();
    // Truth drawn from the filter's own prior: consistent start.
    const truth = new Float64Array([x[0]! + stream.gaussian(), x[1]! + 0.5 * stream.gaussian()]);
    for (let k = 0; k < steps; k++) {
      const w0 = stream.gaussian(), w1 = stream.gaussian();
      predictState(truth, F, 2, work);
      truth[0] = truth[0]! + LQ[0]! * w0;
      truth[1] = truth[1]! + LQ[2]! * w0 + LQ[3]! * w1;
      const z = truth[0]! + sigmaW * stream.gaussian();
      predictState(x, F, 2, work);
      predictCovariance(P, F, Q, 2, work);
      innovationCovariance(P, H, R, 2, 1, ws);
      ws.y[0] = z - x[0]!;
      updateJoseph(x, P, H, R, 2, 1, ws);
      const e0 = truth[0]! - x[0]!, e1 = truth[1]! - x[1]!;
      const det = P[0]! * P[3]! - P[1]! * P[2]!;
      sums[k]! += (P[3]! * e0 * e0 - 2 * P[1]! * e0 * e1 + P[0]! * e1 * e1) / det;
    }
  }
  return sums.map((s) => s / runs);
}

describe('Monte Carlo NEES (Bar-Shalom, Li, Kirubarajan 2001, chapter 5, section 5.4)', () => {
  const runs = 50, steps = 100;
  const [lo, hi] = averagedChiSquareInterval(runs, 2, 0.95);

  it('a correctly tuned linear-Gaussian filter: averaged NEES inside the 95 % chi-square interval at about 95 % of the steps', () => {
    const nees = neesPerStep(runs, steps, 1);
    const inside = nees.filter((v) => v >= lo && v <= hi).length / steps;
    // Each step is a 95 % test; over 100 correlated steps at least 88 % inside is the pass mark
    // (binomial with p = 0.95: P(< 88) is below 1 %).
    expect(inside).toBeGreaterThanOrEqual(0.88);
    const grand = nees.reduce((a, b) => a + b, 0) / steps;
    // Grand mean over 5000 filter-steps: expected 2 (state dimension); ±0.2 covers time correlation.
    expectClose(grand, 2, { abs: 0.2 }, 'mean NEES');
  });

  it('the same test catches an overconfident filter (R assumed 10x too small)', () => {
    const nees = neesPerStep(runs, steps, 0.1);
    const inside = nees.filter((v) => v >= lo && v <= hi).length / steps;
    expect(inside).toBeLessThan(0.2);
  });
});
