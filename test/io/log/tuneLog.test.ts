import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tuneLog } from '../../../estimator/io/log/tuneLog.js';

const boat = resolve('data-demo/logs/harbour-boat');

describe('tuneLog on the harbour-boat demo log', () => {
  it('identifies the four default terms, raises the likelihood and reports both settings against truth', async () => {
    const result = await tuneLog(boat);
    expect(result.criterion).toBe('likelihood');
    expect(result.identification.terms.map((t) => t.name)).toEqual(['pixelNoise', 'sizeNoiseFraction', 'odometryNoise', 'carrierAccelNoise']);
    expect(result.cost).toBeLessThan(result.baseline.cost);
    // The multipliers are held, not searched: they keep the log's own values.
    expect(result.recommendedMultipliers).toEqual({ qScale: 1, rScale: 1, gateScale: 1 });
    // The log's settings assume box and odometry noise far too large (NIS about 1 for dimension 3);
    // the identified setting brings both NIS means up towards 3.
    const before = result.checks.current, after = result.checks.recommended;
    expect(before.boxes!.verdict).toBe('under-confident');
    expect(after.boxes!.mean).toBeGreaterThan(before.boxes!.mean + 0.4);
    expect(after.odometry!.verdict).toBe('consistent');
    // Truth is a check, never the objective: both settings carry NEES and RMSE.
    expect(before.positionRmse).not.toBeNull();
    expect(after.nees).not.toBeNull();
    for (const t of result.identification.terms) {
      if (t.status === 'identified') {
        expect(t.low!).toBeLessThan(t.estimate);
        expect(t.high!).toBeGreaterThan(t.estimate);
      } else expect(t.warning).not.toBeNull();
    }
    expect(result.caution).toContain('clear nothing for flight');
  });
});
