import { describe, expect, it } from 'vitest';
import { confirmMaxFailures, flightCounts, refuteMinFailures } from '../../estimator/study/flightCounts.js';
import { binomialTail } from '../../estimator/study/statistics/binomialTail.js';
import { clopperPearsonLower, clopperPearsonUpper } from '../../estimator/study/statistics/clopperPearson.js';

/** Fewest flights in which `failures` failures still confirm p0 at confidence C. */
function flightsAllowing(failures: number, p0: number, C: number): number {
  let n = 1;
  while (confirmMaxFailures(n, p0, C) < failures) n++;
  return n;
}

describe('flightCounts', () => {
  it('zero failures: 59 flights show 95 % success at 95 % confidence', () => {
    // Clopper and Pearson 1934, Biometrika 26: 0 failures in n -> one-sided 95 % bound 1 - 0.05^(1/n); n = 59 for 5 %
    // (worked case in /work/shared/REFERENCES.md; the rule of three, Hanley and Lippman-Hand 1983, gives about 3/0.05 = 60)
    const c = flightCounts(0.95, 0.95, 1);
    expect(c.allLand).toBe(59);
    expect(c.flights).toBe(59);
    expect(c.confirmMaxFailures).toBe(0);
    expect(c.chance).toBe(1);
  });

  it('reproduces the success-run demonstration counts for 90 % at 90 % and 95 % at 95 % with 0, 1 and 2 failures', () => {
    // Exact binomial (Clopper-Pearson) success-run test plans as tabled for reliability demonstration
    // [memory: 90/90 -> 22, 38, 52; 95/95 -> 59, 93, 124]
    expect([0, 1, 2].map((f) => flightsAllowing(f, 0.9, 0.9))).toEqual([22, 38, 52]);
    expect([0, 1, 2].map((f) => flightsAllowing(f, 0.95, 0.95))).toEqual([59, 93, 124]);
  });

  it('agrees with the Clopper-Pearson bounds it stands for, count by count', () => {
    for (const n of [10, 29, 40, 76]) {
      const c = confirmMaxFailures(n, 0.9, 0.95);
      if (c >= 0) expect(clopperPearsonLower(n - c, n, 0.95)).toBeGreaterThanOrEqual(0.9);
      expect(clopperPearsonLower(n - c - 1, n, 0.95)).toBeLessThan(0.9);
      const r = refuteMinFailures(n, 0.9, 0.95);
      expect(clopperPearsonUpper(n - r, n, 0.95)).toBeLessThan(0.9);
      expect(clopperPearsonUpper(n - r + 1, n, 0.95)).toBeGreaterThanOrEqual(0.9);
    }
  });

  it('plans on the simulated rate: the fewest flights whose expected verdict comes out with the wanted chance', () => {
    const up = flightCounts(0.9, 0.95, 0.97, { power: 0.8 });
    expect(up.expect).toBe('confirm');
    const n = up.flights!;
    // P(successes >= n - c | 0.97) >= 0.8 here, and not with one flight fewer
    expect(binomialTail(n, 0.97, n - up.confirmMaxFailures!)).toBeGreaterThanOrEqual(0.8);
    const c1 = confirmMaxFailures(n - 1, 0.9, 0.95);
    expect(binomialTail(n - 1, 0.97, n - 1 - c1)).toBeLessThan(0.8);
    const down = flightCounts(0.9, 0.95, 0.75);
    expect(down.expect).toBe('refute');
    expect(down.refuteMinFailures!).toBeLessThanOrEqual(down.flights!);
    expect(flightCounts(0.9, 0.95, 0.9).expect).toBe('undecided');
    expect(flightCounts(0.9, 0.95, 0.9001, { maxFlights: 500 }).flights).toBeNull();
  });
});
