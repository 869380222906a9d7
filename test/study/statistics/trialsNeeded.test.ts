import { describe, expect, it } from 'vitest';
import { binomialTail } from '../../../estimator/study/statistics/binomialTail.js';
import { logGamma } from '../../../estimator/study/statistics/logGamma.js';
import { minimumSuccesses, trialsNeeded } from '../../../estimator/study/statistics/trialsNeeded.js';
import { wilson } from '../../../estimator/study/statistics/wilson.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('trialsNeeded(rate, target)', () => {
  it('logGamma(n + 1) = ln n! (identity)', () => {
    expectClose(Math.exp(logGamma(11)), 3628800, { rel: 1e-13 }, '10!'); // Lanczos g=7 carries ~15 digits
    expectClose(logGamma(0.5), 0.5 * Math.log(Math.PI), { rel: 1e-13 }, 'Γ(1/2) = √π');
  });
  it('binomialTail agrees with direct summation (two implementations)', () => {
    const direct = (n: number, p: number, k: number) => {
      let s = 0;
      let c = 1;
      for (let j = 0; j <= n; j++) {
        if (j > 0) c = (c * (n - j + 1)) / j;
        if (j >= k) s += c * p ** j * (1 - p) ** (n - j);
      }
      return s;
    };
    for (const [n, p, k] of [[10, 0.5, 10], [30, 0.9, 25], [30, 0.9, 29], [50, 0.3, 10], [40, 0.97, 40]] as const) {
      expectClose(binomialTail(n, p, k), direct(n, p, k), { rel: 1e-11, abs: 1e-15 }, `${n},${p},${k}`); // float summation
    }
    expect(binomialTail(10, 0.5, 0)).toBe(1);
    expect(binomialTail(10, 0.5, 11)).toBe(0);
  });
  it('trialsNeeded(0.95, 0.9).allSucceed = ceil(z² t / (1 - t)) = 35 (Wilson 1927 algebra)', () => {
    const r = trialsNeeded(0.95, 0.9);
    expect(r.allSucceed).toBe(35);
    expect(wilson(35, 35).low).toBeGreaterThanOrEqual(0.9);
    expect(wilson(34, 34).low).toBeLessThan(0.9);
    expect(r.ruleOfThree).toBe(30); // Hanley and Lippman-Hand 1983: 3 / (1 - 0.9)
  });
  it('trialsNeeded(0.95, 0.9) answers are the smallest n that meet their definitions', () => {
    const r = trialsNeeded(0.95, 0.9, { power: 0.8 });
    const n = r.atExpectedCount!;
    expect(Math.round(0.95 * n)).toBeGreaterThanOrEqual(minimumSuccesses(n, 0.9));
    for (let m = r.allSucceed; m < n; m++) expect(Math.round(0.95 * m)).toBeLessThan(minimumSuccesses(m, 0.9));
    const w = r.withPower!;
    expect(binomialTail(w, 0.95, minimumSuccesses(w, 0.9))).toBeGreaterThanOrEqual(0.8);
    expect(binomialTail(w - 1, 0.95, minimumSuccesses(w - 1, 0.9))).toBeLessThan(0.8);
    expect(w).toBeGreaterThan(n); // power 0.8 asks for more than the expected count
  });
  it('trialsNeeded gives null when the true rate does not exceed the target', () => {
    const r = trialsNeeded(0.9, 0.95);
    expect(r.atExpectedCount).toBeNull();
    expect(r.withPower).toBeNull();
  });
});
