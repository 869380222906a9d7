import { describe, expect, it } from 'vitest';
import { ruleOfThree } from '../../../estimator/study/statistics/ruleOfThree.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('ruleOfThree(n)', () => {
  it('ruleOfThree(n) is 3/n (Hanley and Lippman-Hand 1983, JAMA 249:1743)', () => {
    expect(ruleOfThree(30)).toBe(0.1);
    expect(ruleOfThree(300)).toBe(0.01);
  });
  it('ruleOfThree(n) approaches the exact one-sided 95 % bound 1 - 0.05^(1/n) for large n', () => {
    // Hanley and Lippman-Hand 1983: 3/n approximates -ln(0.05)/n = 2.996/n; the exact bound at
    // n = 100 is 0.02951, so 3/n is within 2 % there (first-order expansion of 1 - e^(-x)).
    expectClose(ruleOfThree(100), 1 - Math.pow(0.05, 1 / 100), { rel: 0.02 }, 'n = 100');
  });
  it('ruleOfThree(n) caps at 1 and refuses n = 0', () => {
    expect(ruleOfThree(2)).toBe(1);
    expect(() => ruleOfThree(0)).toThrow(/positive integer/);
  });
});
