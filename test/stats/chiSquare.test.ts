import { describe, expect, it } from 'vitest';
import { averagedChiSquareInterval, chiSquareCdf, chiSquareQuantile } from '../../estimator/stats/chiSquare.js';
import { expectClose } from '../helpers/expectClose.js';

// The table prints three decimals: tolerance 6e-4 absolute = half a unit in the last place plus margin.
const table = { abs: 6e-4 };

describe('chiSquareQuantile', () => {
  it('matches the NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.6.7.4 (upper 0.05)', () => {
    expectClose(chiSquareQuantile(0.95, 1), 3.841, table, 'df 1');
    expectClose(chiSquareQuantile(0.95, 2), 5.991, table, 'df 2');
    expectClose(chiSquareQuantile(0.95, 3), 7.815, table, 'df 3');
    expectClose(chiSquareQuantile(0.95, 10), 18.307, table, 'df 10');
  });

  it('matches NIST/SEMATECH 1.3.6.7.4 upper and lower 0.025 points', () => {
    expectClose(chiSquareQuantile(0.975, 3), 9.348, table, 'upper df 3');
    expectClose(chiSquareQuantile(0.975, 10), 20.483, table, 'upper df 10');
    expectClose(chiSquareQuantile(0.025, 3), 0.216, table, 'lower df 3');
    expectClose(chiSquareQuantile(0.025, 10), 3.247, table, 'lower df 10');
  });

  it('is the inverse of chiSquareCdf', () => {
    // 1e-12: both directions are computed to near double precision by @stdlib.
    expectClose(chiSquareCdf(chiSquareQuantile(0.997, 3), 3), 0.997, { abs: 1e-12 }, 'round trip');
  });

  it('rejects a probability outside [0, 1] and non-positive degrees of freedom', () => {
    expect(() => chiSquareQuantile(1.5, 2)).toThrow(/probability must be in \[0, 1\]/);
    expect(() => chiSquareQuantile(0.5, 0)).toThrow(/degrees of freedom/);
  });
});

describe('averagedChiSquareInterval', () => {
  it('N = 50 runs, n = 2: about [1.48, 2.59] (Bar-Shalom, Li, Kirubarajan 2001, section 5.4; the book rounds to [1.5, 2.6], [memory])', () => {
    const [lo, hi] = averagedChiSquareInterval(50, 2);
    // 0.005: the reference quotes two decimals.
    expectClose(lo, 1.48, { abs: 0.005 }, 'lower');
    expectClose(hi, 2.59, { abs: 0.005 }, 'upper');
  });
});
