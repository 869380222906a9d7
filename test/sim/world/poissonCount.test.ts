import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { poissonCount } from '../../../estimator/sim/world/poissonCount.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('poissonCount', () => {
  it('poissonCount(stream, 0.7) has mean = variance = 0.7 and P(0) = e^-0.7 (Poisson distribution, 100 000 seeded draws)', () => {
    const stream = RandomStream.fromKey([77]);
    const N = 100_000;
    let sum = 0, sum2 = 0, zeros = 0;
    for (let i = 0; i < N; i++) {
      const k = poissonCount(stream, 0.7);
      sum += k; sum2 += k * k;
      if (k === 0) zeros++;
    }
    const mean = sum / N;
    // standard errors: mean sqrt(0.7/N) = 0.0026; variance ~ sqrt((mu + 2 mu^2)/N) = 0.0041; P(0) 0.0015. 4 se each.
    expectClose(mean, 0.7, { abs: 0.011 }, 'mean');
    expectClose(sum2 / N - mean * mean, 0.7, { abs: 0.017 }, 'variance');
    expectClose(zeros / N, Math.exp(-0.7), { abs: 0.006 }, 'P(0)');
  });

  it('poissonCount(stream, 0) is 0 and draws nothing', () => {
    const a = RandomStream.fromKey([5]), b = RandomStream.fromKey([5]);
    expect(poissonCount(a, 0)).toBe(0);
    expect(a.uniform()).toBe(b.uniform());
  });
});
