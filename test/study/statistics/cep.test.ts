import { describe, expect, it } from 'vitest';
import { cep } from '../../../estimator/study/statistics/cep.js';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('cep(missDistances, level)', () => {
  it('cep of a seeded circular Gaussian matches sigma sqrt(2 ln 2) and sigma sqrt(-2 ln 0.05)', () => {
    // Closed form: the radial miss of a circular Gaussian is Rayleigh; its median is
    // sigma sqrt(2 ln 2) = 1.1774 sigma (Rayleigh distribution median, common practice).
    const sigma = 0.4;
    const n = 20_000;
    const stream = RandomStream.fromKey([2026, 12, 1]);
    const distances = new Float64Array(n);
    for (let i = 0; i < n; i++) distances[i] = Math.hypot(stream.normal(0, sigma), stream.normal(0, sigma));
    // Standard error of a sample quantile q: sqrt(q(1-q)/n) / f(r_q), f the Rayleigh density.
    // At the median: 0.5/sqrt(n) / (1.1774/sigma · 0.5) = 0.0060 sigma; allow 4 standard errors.
    const median = sigma * Math.sqrt(2 * Math.log(2));
    expectClose(cep(distances, 0.5)!, median, { abs: 4 * (0.5 / Math.sqrt(n)) / ((median / sigma ** 2) * 0.5) }, 'CEP50');
    // At 0.95: sqrt(0.95·0.05/n) / (r95/sigma² · 0.05) = 0.0126 sigma; 4 standard errors.
    const r95 = sigma * Math.sqrt(-2 * Math.log(0.05));
    expectClose(cep(distances, 0.95)!, r95, { abs: (4 * Math.sqrt((0.95 * 0.05) / n)) / ((r95 / sigma ** 2) * 0.05) }, 'CEP95');
  });
  it('cep is null without any contact and refuses negative or NaN distances', () => {
    expect(cep([], 0.5)).toBeNull();
    expect(() => cep([0.2, -1], 0.5)).toThrow(/miss distance 1/);
    expect(() => cep([Number.NaN], 0.5)).toThrow(/miss distance 0/);
  });
});
