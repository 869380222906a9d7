import { describe, expect, it } from 'vitest';
import { differenceInterval } from '../../../estimator/study/statistics/differenceInterval.js';
import { expectClose } from '../../helpers/expectClose.js';

// Newcombe (1998), "Interval estimation for the difference between independent proportions:
// comparison of eleven methods", Statistics in Medicine 17:873-890, Table II, method 10
// (score-based hybrid). Values recalled [memory], four printed decimals: tolerance 5e-5.
const printed = { abs: 5e-5 };

describe('differenceInterval(k1, n1, k2, n2)', () => {
  it('56/70 - 48/80 -> 0.0524 to 0.3339 (Newcombe 1998b, Table II [memory])', () => {
    const d = differenceInterval(56, 70, 48, 80);
    expectClose(d.difference, 0.2, { abs: 1e-15 }, 'difference'); // exact arithmetic
    expectClose(d.low, 0.0524, printed, 'low');
    expectClose(d.high, 0.3339, printed, 'high');
  });
  it('9/10 - 3/10 -> 0.1705 to 0.8090 and 5/56 - 0/29 -> -0.0381 to 0.1926 (Newcombe 1998b [memory])', () => {
    const a = differenceInterval(9, 10, 3, 10);
    expectClose(a.low, 0.1705, printed, 'a.low');
    expectClose(a.high, 0.809, printed, 'a.high');
    const b = differenceInterval(5, 56, 0, 29);
    expectClose(b.low, -0.0381, printed, 'b.low');
    expectClose(b.high, 0.1926, printed, 'b.high');
  });
  it('differenceInterval is antisymmetric: swapping the samples negates the interval', () => {
    const a = differenceInterval(7, 20, 15, 25);
    const b = differenceInterval(15, 25, 7, 20);
    expectClose(a.low, -b.high, { abs: 1e-15 }, 'low'); // same terms, reordered
    expectClose(a.high, -b.low, { abs: 1e-15 }, 'high');
  });
});
