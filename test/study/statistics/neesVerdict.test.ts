import { describe, expect, it } from 'vitest';
import { neesVerdict } from '../../../estimator/study/statistics/neesVerdict.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('neesVerdict(mean, runs, dim)', () => {
  it('neesVerdict(_, 50, 2) uses the averaged chi-square interval of about [1.48, 2.59]', () => {
    // Bar-Shalom, Li, Kirubarajan 2001, "Estimation with Applications to Tracking and
    // Navigation", section 5.4: N = 50 runs, n = 2 -> about [1.5, 2.6] as the book rounds
    // it [memory]; [chi2_100(0.025)/50, chi2_100(0.975)/50] = [1.4843, 2.5964]: tolerance 0.01
    // covers the two-decimal rounding of the reference.
    const v = neesVerdict(2, 50, 2);
    expectClose(v.low, 1.48, { abs: 0.01 }, 'low');
    expectClose(v.high, 2.59, { abs: 0.01 }, 'high');
    expect(v.verdict).toBe('consistent');
  });
  it('neesVerdict says over-confident above the interval and under-confident below', () => {
    expect(neesVerdict(2.7, 50, 2).verdict).toBe('over-confident');
    expect(neesVerdict(1.4, 50, 2).verdict).toBe('under-confident');
  });
  it('neesVerdict refuses NaN and zero runs', () => {
    expect(() => neesVerdict(Number.NaN, 5, 2)).toThrow(/finite/);
    expect(() => neesVerdict(1, 0, 2)).toThrow(/runs/);
  });
});
