import { describe, expect, it } from 'vitest';
import { gateThreshold } from '../../estimator/filter/gate.js';
import { expectClose } from '../helpers/expectClose.js';

describe('gateThreshold', () => {
  it('is the chi-square quantile times the scale: 95 % in 3 dof = 7.815 (NIST/SEMATECH e-Handbook 1.3.6.7.4)', () => {
    // 6e-4: the table prints three decimals.
    expectClose(gateThreshold(0.95, 3), 7.815, { abs: 6e-4 }, '95 %, 3 dof');
    expectClose(gateThreshold(0.95, 3, 2), 2 * 7.815, { abs: 1.2e-3 }, 'scaled x2');
  });
  it('rejects probabilities outside (0, 1) and non-positive scales', () => {
    expect(() => gateThreshold(1, 3)).toThrow(/gate probability/);
    expect(() => gateThreshold(0.99, 3, 0)).toThrow(/gate scale/);
  });
});
