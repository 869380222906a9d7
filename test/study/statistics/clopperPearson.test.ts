import { describe, expect, it } from 'vitest';
import { clopperPearsonLower, clopperPearsonUpper } from '../../../estimator/study/statistics/clopperPearson.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('clopperPearsonLower / clopperPearsonUpper', () => {
  it('reproduces the worked zero-failure case: 0 failures in n -> failure bound 1 - 0.05^(1/n), n = 59 for 5 %', () => {
    // Clopper and Pearson 1934, Biometrika 26 (the exact binomial bound); n = 59 as in /work/shared/REFERENCES.md
    expectClose(clopperPearsonUpper(0, 59, 0.95), 1 - Math.pow(0.05, 1 / 59), { rel: 1e-12 }, 'closed form (rounding)');
    expect(clopperPearsonUpper(0, 59, 0.95)).toBeLessThan(0.05);
    expect(clopperPearsonUpper(0, 58, 0.95)).toBeGreaterThan(0.05);
  });

  it('matches the exact intervals printed by Newcombe 1998 for 0/20 and 81/263 (two-sided 95 % = one-sided 97.5 % each side)', () => {
    // Newcombe 1998, Statistics in Medicine 17:857-872, table II, method 5 (exact) [memory for the printed digits]
    expectClose(clopperPearsonUpper(0, 20, 0.975), 0.1684, { abs: 5e-5 }, '0/20 upper (4 printed decimals)');
    expectClose(clopperPearsonLower(81, 263, 0.975), 0.2527, { abs: 5e-5 }, '81/263 lower (4 printed decimals)');
    expectClose(clopperPearsonUpper(81, 263, 0.975), 0.3676, { abs: 5e-5 }, '81/263 upper (4 printed decimals)');
  });

  it('bounds the estimate from both sides and solves its defining tail equation', () => {
    const low = clopperPearsonLower(45, 50, 0.95), high = clopperPearsonUpper(45, 50, 0.95);
    expect(low).toBeLessThan(0.9);
    expect(high).toBeGreaterThan(0.9);
    expect(clopperPearsonLower(0, 10, 0.95)).toBe(0);
    expect(clopperPearsonUpper(10, 10, 0.95)).toBe(1);
  });

  it('refuses impossible counts and confidences', () => {
    expect(() => clopperPearsonLower(5, 4, 0.95)).toThrow(/0 <= k <= n/);
    expect(() => clopperPearsonLower(1, 4, 1)).toThrow(/confidence/);
  });
});
