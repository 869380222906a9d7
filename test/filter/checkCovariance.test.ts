import { describe, expect, it } from 'vitest';
import { allFinite, checkCovariance } from '../../estimator/filter/checkCovariance.js';

describe('checkCovariance', () => {
  const work = new Float64Array(4);
  it('accepts a finite positive definite covariance', () => {
    expect(checkCovariance([1, 2], [2, 0.5, 0.5, 1], 2, work)).toBe(null);
  });
  it('names a non-finite state, a non-finite covariance and a non-positive-definite covariance', () => {
    expect(checkCovariance([Number.NaN, 2], [2, 0.5, 0.5, 1], 2, work)).toBe('state-not-finite');
    expect(checkCovariance([1, 2], [2, Number.POSITIVE_INFINITY, 0.5, 1], 2, work)).toBe('covariance-not-finite');
    // Eigenvalues of [[1, 2], [2, 1]] are 3 and -1.
    expect(checkCovariance([1, 2], [1, 2, 2, 1], 2, work)).toBe('covariance-not-positive-definite');
  });
  it('allFinite sees -Infinity and NaN anywhere', () => {
    expect(allFinite([0, -0, 1e308])).toBe(true);
    expect(allFinite([0, Number.NEGATIVE_INFINITY])).toBe(false);
    expect(allFinite([Number.NaN, 0])).toBe(false);
  });
});
