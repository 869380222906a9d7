import { describe, expect, it } from 'vitest';
import { claimReach } from '../../../notebooks/studies/claimReach.js';

describe('claimReach', () => {
  it('says 95 % needs 73 straight successes at z = 1.96 and 5 trials cannot show it', () => {
    // n of n has Wilson lower bound n / (n + z²) (Wilson 1927): 73 / (73 + 3.8416) = 0.9500, 72 -> 0.9493.
    const r = claimReach(5, 0.95, 1.96);
    expect(r.reachable).toBe(false);
    expect(r.needed).toBe(73);
    expect(r.bestLow).toBeCloseTo(5 / (5 + 1.96 ** 2), 12); // closed form, rounding only
    expect(r.words).toBe('5 trials per point cannot support success ≥ 95 %: even 5 of 5 landed gives a Wilson lower bound of only 56.6 %. Showing it takes at least 73 trials, all landed.');
    expect(claimReach(73, 0.95, 1.96).reachable).toBe(true);
    expect(claimReach(72, 0.95, 1.96).reachable).toBe(false);
  });

  it('refuses a 100 % claim in words', () => {
    expect(claimReach(1000, 1, 1.96)).toMatchObject({ reachable: false, words: 'No number of trials shows success ≥ 100 %: a Wilson lower bound never reaches 100 %.' });
  });
});
