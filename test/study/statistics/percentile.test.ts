import { describe, expect, it } from 'vitest';
import { percentile } from '../../../estimator/study/statistics/percentile.js';

describe('percentile(values, p)', () => {
  it('percentile interpolates between order statistics (Hyndman and Fan 1996, type 7)', () => {
    expect(percentile([4, 1, 3, 2], 0.5)).toBe(2.5);
    expect(percentile([4, 1, 3, 2], 0)).toBe(1);
    expect(percentile([4, 1, 3, 2], 1)).toBe(4);
    expect(percentile([10, 20, 30, 40, 50], 0.9)).toBe(46);
  });
  it('percentile of nothing is null; NaN is refused, not skipped', () => {
    expect(percentile([], 0.5)).toBeNull();
    expect(() => percentile([1, Number.NaN], 0.5)).toThrow(/value 1 is not finite/);
    expect(() => percentile([1], 1.5)).toThrow(/p must be/);
  });
});
