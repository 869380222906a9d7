import { describe, expect, it } from 'vitest';
import { estimatesHeader, estimatesRow, estimatesRowFromDiagonal } from '../../../estimator/io/log/estimatesCsv.js';

describe('estimates CSV', () => {
  it('names 12 or 15 states and their variances', () => {
    expect(estimatesHeader(12).split(',')).toHaveLength(25);
    expect(estimatesHeader(15).split(',').slice(13, 16)).toEqual(['acx', 'acy', 'acz']);
    expect(estimatesHeader(15).split(',').at(-1)).toBe('P_acz');
  });

  it('prints the diagonal of P and numbers that read back to the same doubles', () => {
    const n = 12;
    const x = Float64Array.from({ length: n }, (_, i) => 1 / (i + 3));
    const P = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) P[i * n + j] = i === j ? 0.1 * (i + 1) : 7; // off-diagonal never printed
    const row = estimatesRow(0.125, x, P, n);
    const back = row.split(',').map(Number);
    expect(back[0]).toBe(0.125);
    expect(back.slice(1, 13)).toEqual(Array.from(x));
    expect(back.slice(13)).toEqual(Array.from({ length: n }, (_, i) => 0.1 * (i + 1)));
    expect(estimatesRowFromDiagonal(0.125, x, back.slice(13), n)).toBe(row);
  });
});
