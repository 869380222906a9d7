import { describe, expect, it } from 'vitest';
import { averageRanks, spearman } from '../../../estimator/study/statistics/spearman.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('spearman', () => {
  it('is +1 / -1 for any strictly monotone pair and NaN when one side is constant', () => {
    expect(spearman([0.02, 0.1, 0.3, 0.5], [1, 4, 9, 100])).toBe(1);
    expect(spearman([0.02, 0.1, 0.3, 0.5], [99, 91, 61, 27])).toBe(-1);
    expect(spearman([1, 2, 3], [5, 5, 5])).toBeNaN();
  });

  it('gives ties their average rank (common practice): ranks of [10, 20, 20, 30] are 1, 2.5, 2.5, 4', () => {
    expect(averageRanks([10, 20, 20, 30])).toEqual([1, 2.5, 2.5, 4]);
    expect(averageRanks([3, 1, 3, 3])).toEqual([3, 1, 3, 3]);
  });

  it('matches the no-ties formula 1 - 6 sum d^2 / (n (n^2 - 1)) (Spearman 1904; common practice)', () => {
    const x = [1, 2, 3, 4, 5, 6], y = [2, 1, 4, 3, 6, 5]; // every d = +-1: 1 - 6 * 6 / (6 * 35) = 29/35
    expectClose(spearman(x, y), 29 / 35, { abs: 1e-15 }, 'rho');
  });

  it('refuses samples of different or too short length', () => {
    expect(() => spearman([1], [2])).toThrow(RangeError);
    expect(() => spearman([1, 2], [1, 2, 3])).toThrow(/same length/);
  });
});
