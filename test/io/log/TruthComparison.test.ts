import { describe, expect, it } from 'vitest';
import { TruthComparison } from '../../../estimator/io/log/TruthComparison.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('TruthComparison', () => {
  it('with a diagonal P, NEES = sum of dr^2 / P_r + dv^2 / (P_c + P_l) and the RMS errors follow', () => {
    const n = 12;
    const P = new Float64Array(n * n);
    for (let i = 0; i < n; i++) P[i * n + i] = (i + 1) * 0.5;
    const x = new Float64Array(n);
    // errors: r off by (1, 1, 1); vC off by (0.2, 0.2, 0.2), vL off by (-0.1, -0.1, -0.1) -> relative velocity off by 0.3
    for (let i = 0; i < 3; i++) {
      x[i] = 1;
      x[3 + i] = 0.2;
      x[6 + i] = -0.1;
    }
    const c = new TruthComparison();
    let expected = 0;
    for (let i = 0; i < 3; i++) expected += 1 / ((i + 1) * 0.5) + 0.09 / ((i + 4) * 0.5 + (i + 7) * 0.5);
    expectClose(c.add(x, P, n, new Float64Array(10)), expected, { rel: 1e-12 }, 'NEES'); // rounding only
    const s = c.summary();
    expectClose(s.positionRmse, Math.sqrt(3), { rel: 1e-14 }, 'position RMSE'); // |(1,1,1)|
    expectClose(s.velocityRmse, Math.sqrt(3 * 0.09), { rel: 1e-14 }, 'velocity RMSE'); // |(0.3,0.3,0.3)|
    expect([s.count, s.neesCount, s.neesDim]).toEqual([1, 1, 6]);
  });

  it('counts a covariance that is not positive definite instead of averaging NaN', () => {
    const n = 12;
    const c = new TruthComparison();
    expect(c.add(new Float64Array(n), new Float64Array(n * n), n, new Float64Array(10))).toBeNaN();
    const s = c.summary();
    expect([s.notPositiveDefinite, s.count, s.neesCount]).toEqual([1, 1, 0]);
    expect(s.neesMean).toBeNaN();
  });
});
