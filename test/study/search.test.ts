import { describe, expect, it } from 'vitest';
import { searchMultipliers } from '../../estimator/study/search.js';
import { expectClose } from '../helpers/expectClose.js';

describe('searchMultipliers', () => {
  it('searchMultipliers refines an off-grid minimum in log space beyond the grid', async () => {
    // Minimum at q = 2, r = 0.3 (gate fixed at 1): not on the 5-point log grid 0.1 .. 10.
    const cost = ({ q, r }: { q: number; r: number }) => Math.log(q / 2) ** 2 + 2 * Math.log(r / 0.3) ** 2;
    const result = await searchMultipliers(cost, { gate: [1, 1], grid: 5, refine: 60 });
    const grid = result.surface.filter((s) => s.stage === 'grid');
    expect(grid).toHaveLength(25);
    const bestGrid = Math.min(...grid.map((s) => s.score));
    expect(result.best.score).toBeLessThan(bestGrid / 20);
    expectClose(result.best.q, 2, { rel: 0.02 }, 'q'); // 60 simplex steps: within 2 %
    expectClose(result.best.r, 0.3, { rel: 0.02 }, 'r');
    expect(result.best.gate).toBe(1);
  });
  it('searchMultipliers with maximize picks the highest score and evaluates each setting once', async () => {
    const seen = new Set<string>();
    let repeats = 0;
    const result = await searchMultipliers(({ q, r, gate }) => {
      const key = `${q},${r},${gate}`;
      if (seen.has(key)) repeats++;
      seen.add(key);
      return -Math.abs(Math.log(q)) - Math.abs(Math.log(r)) - Math.abs(Math.log(gate / 2));
    }, { grid: 3, refine: 0, maximize: true, gate: [0.5, 8] });
    expect(repeats).toBe(0);
    expect(result.surface).toHaveLength(27);
    expect([result.best.q, result.best.r, result.best.gate]).toEqual([1, 1, 2]);
  });
  it('searchMultipliers refuses a non-positive range', async () => {
    await expect(searchMultipliers(() => 0, { q: [0, 1] })).rejects.toThrow(/q range must satisfy 0 < lo <= hi/);
  });
});
