import { Matrix, determinant, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { InnovationLikelihood } from '../../../estimator/io/log/InnovationLikelihood.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('InnovationLikelihood', () => {
  const S = [4, 1, 0.5, 1, 3, 0.2, 0.5, 0.2, 2];
  const y = [1, -0.5, 0.8];
  // The same sum written plainly with ml-matrix: ln|2 pi S| + yᵀ S⁻¹ y (Mehra 1970).
  const m = new Matrix([S.slice(0, 3), S.slice(3, 6), S.slice(6, 9)]);
  const nis = new Matrix([y]).mmul(inverse(m)).mmul(new Matrix([y]).transpose()).get(0, 0);
  const logDet = Math.log(determinant(m.clone().mul(2 * Math.PI)));

  it('adds ln|2 pi S| + yᵀ S⁻¹ y per update, as the plain matrix computation', () => {
    const l = new InnovationLikelihood(14);
    l.add(Float64Array.from(y), Float64Array.from(S), false);
    l.add(Float64Array.from(y), Float64Array.from(S), false);
    const s = l.summary();
    // Tolerance 1e-12: round-off of two 3x3 routes.
    expectClose(s.minus2LogL, 2 * (logDet + nis), { rel: 1e-12 }, '-2 ln L');
    expect(s.count).toBe(2);
  });

  it('beyond the gate counts c (1 + ln(NIS / c)), and counts the gated update', () => {
    const big = y.map((v) => 10 * v); // NIS 100x
    const l = new InnovationLikelihood(9);
    l.add(Float64Array.from(big), Float64Array.from(S), true);
    const s = l.summary();
    expectClose(s.nisSum, 9 * (1 + Math.log((100 * nis) / 9)), { rel: 1e-12 }, 'log-weighted term');
    expect(s.gated).toBe(1);
  });

  it('ignores a non-positive-definite S', () => {
    const l = new InnovationLikelihood(9);
    l.add(Float64Array.from(y), Float64Array.from([1, 2, 0, 2, 1, 0, 0, 0, 1]), false);
    expect(l.summary().count).toBe(0);
  });
});
