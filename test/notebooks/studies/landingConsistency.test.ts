import { describe, expect, it } from 'vitest';
import { nisBandCount } from '../../../notebooks/studies/landingConsistency.js';
import { expectClose } from '../../helpers/expectClose.js';

const update = (nis: number) => ({ t: 0, status: 'accepted' as const, nis, dim: 3 });

describe('nisBandCount', () => {
  it('uses the 2.5 % and 97.5 % chi-square quantiles of one update as the band', () => {
    // chi-square(3): 0.2158 and 9.3484 (Bar-Shalom, Li, Kirubarajan 2001, table of chi-square quantiles [memory])
    const { low, high } = nisBandCount([], 3);
    expectClose(low, 0.2158, { abs: 1e-4 }, 'table rounding');
    expectClose(high, 9.3484, { abs: 1e-4 }, 'table rounding');
  });

  it('counts values inside the band (edges included) among the updates that have a NIS', () => {
    const { low, high } = nisBandCount([], 3);
    const c = nisBandCount([update(low), update(high), update(3), update(0.1), update(20), update(Number.NaN)], 3);
    expect([c.total, c.inside]).toEqual([5, 3]);
  });
});
