import { describe, expect, it } from 'vitest';
import { nelderMead } from '../../estimator/study/nelderMead.js';
import { expectClose } from '../helpers/expectClose.js';

describe('nelderMead', () => {
  it('nelderMead finds the Rosenbrock minimum at (1, 1) (Rosenbrock 1960, common test function)', async () => {
    const r = await nelderMead(([x, y]) => 100 * (y! - x! * x!) ** 2 + (1 - x!) ** 2, [-1.2, 1], { step: [0.5, 0.5], maxEvaluations: 600, tolerance: 1e-14 });
    expectClose(r.x[0]!, 1, { abs: 1e-3 }, 'x'); // simplex stops near 1e-6 in value: ~1e-3 in x
    expectClose(r.x[1]!, 1, { abs: 2e-3 }, 'y');
    expect(r.evaluations).toBeLessThanOrEqual(600);
  });
  it('nelderMead respects box bounds', async () => {
    const r = await nelderMead(([x]) => (x! - 5) ** 2, [0], { step: [1], lower: [-1], upper: [2], maxEvaluations: 80 });
    expectClose(r.x[0]!, 2, { abs: 1e-6 }, 'clamped at the bound');
  });
});
