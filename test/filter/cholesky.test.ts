import { describe, expect, it } from 'vitest';
import { cholesky, invertSymmetricPositiveDefinite } from '../../estimator/filter/cholesky.js';
import { expectAllClose } from '../helpers/expectClose.js';

const A = new Float64Array([4, 2, 0.4, 2, 5, -1, 0.4, -1, 3]);

describe('cholesky', () => {
  it('L Lᵀ = A (identity check, common practice)', () => {
    const L = new Float64Array(9);
    expect(cholesky(A, 3, L)).toBe(true);
    const back = new Float64Array(9);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) back[3 * i + j] = back[3 * i + j]! + L[3 * i + k]! * L[3 * j + k]!;
    // 1e-15: a few operations on O(1) numbers.
    expectAllClose(back, A, { abs: 1e-14 }, 'L Lᵀ');
    expect([L[1], L[2], L[5]]).toEqual([0, 0, 0]);
  });

  it('returns false for an indefinite or non-finite matrix', () => {
    expect(cholesky(new Float64Array([1, 2, 2, 1]), 2, new Float64Array(4))).toBe(false);
    expect(cholesky(new Float64Array([1, 0, 0, Number.NaN]), 2, new Float64Array(4))).toBe(false);
  });

  it('invertSymmetricPositiveDefinite gives A A⁻¹ = I', () => {
    const inv = new Float64Array(9);
    expect(invertSymmetricPositiveDefinite(A, 3, inv, new Float64Array(18))).toBe(true);
    const product = new Float64Array(9);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) product[3 * i + j] = product[3 * i + j]! + A[3 * i + k]! * inv[3 * k + j]!;
    expectAllClose(product, [1, 0, 0, 0, 1, 0, 0, 0, 1], { abs: 1e-14 }, 'A A⁻¹');
  });
});
