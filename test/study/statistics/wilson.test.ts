import { describe, expect, it } from 'vitest';
import { wilson } from '../../../estimator/study/statistics/wilson.js';
import { expectClose } from '../../helpers/expectClose.js';

// Source: Newcombe (1998), "Two-sided confidence intervals for the single proportion:
// comparison of seven methods", Statistics in Medicine 17:857-872, Table I, method 3
// (Wilson score, no continuity correction). Printed to four decimals: tolerance 5e-5.
const printed = { abs: 5e-5 };

describe('wilson(k, n)', () => {
  it('wilson(81, 263) matches Newcombe 1998 Table I: 0.2553 to 0.3662', () => {
    const { low, high } = wilson(81, 263);
    expectClose(low, 0.2553, printed, 'low');
    expectClose(high, 0.3662, printed, 'high');
  });
  it('wilson(15, 148) matches Newcombe 1998 Table I: 0.0624 to 0.1605', () => {
    const { low, high } = wilson(15, 148);
    expectClose(low, 0.0624, printed, 'low');
    expectClose(high, 0.1605, printed, 'high');
  });
  it('wilson(0, 20) matches Newcombe 1998 Table I: 0 to 0.1611, with an exact 0', () => {
    const { low, high } = wilson(0, 20);
    expect(low).toBe(0);
    expectClose(high, 0.1611, printed, 'high');
  });
  it('wilson(29, 29) matches Newcombe 1998 Table I: 0.8830 to 1, with an exact 1', () => {
    const { low, high } = wilson(29, 29);
    expectClose(low, 0.883, printed, 'low');
    expect(high).toBe(1);
  });
  it('wilson(5, 5) shows "5 of 5 landed" still allows a success rate below 60 %', () => {
    // Identity: with k = n the lower limit is n / (n + z²) (common practice algebra).
    expectClose(wilson(5, 5).low, 5 / (5 + 1.96 * 1.96), { rel: 1e-12 }, 'n/(n+z²)');
    expect(wilson(5, 5).low).toBeLessThan(0.6);
  });
  it('wilson(k, n) is symmetric: low(k) = 1 - high(n - k)', () => {
    for (const [k, n] of [[3, 17], [40, 41], [1, 1000]] as const) {
      expectClose(wilson(k, n).low, 1 - wilson(n - k, n).high, { abs: 1e-14 }, `${k}/${n}`); // rounding only
    }
  });
  it('wilson(0, 0) is the uninformative [0, 1] and bad counts are refused', () => {
    expect(wilson(0, 0)).toEqual({ low: 0, high: 1 });
    expect(() => wilson(3, 2)).toThrow(/0 <= k <= n/);
    expect(() => wilson(1.5, 2)).toThrow(/integers/);
  });
});
