import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tuneLog } from '../../../estimator/io/log/tuneLog.js';

const boat = resolve('data-demo/logs/harbour-boat');
const van = resolve('data-demo/logs/delivery-van-no-truth');
/** The sensors' own noise, the centre fraction, and both process noises: what the demo logs' filter.json sets by hand. */
const SIX = ['pixelNoise', 'pixelNoiseFraction', 'sizeNoiseFraction', 'odometryNoise', 'carrierAccelNoise', 'accelNoise'] as const;

describe('tuneLog on the harbour-boat demo log', () => {
  it('identifies the four default terms, raises the likelihood and reports both settings against truth', async () => {
    const result = await tuneLog(boat, { profilePoints: 2 });
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

  it('the delivery-van demo log tunes to box and odometry NIS verdicts that are consistent', async () => {
    // Two profile points per side: the verdicts are what this test checks; it stays lean.
    const result = await tuneLog(van, { free: [...SIX], profilePoints: 2 });
    expect(result.checks.current.boxes!.verdict).toBe('under-confident'); // NIS 0.3 of 3 with the log's own settings
    expect(result.checks.recommended.boxes!.verdict).toBe('consistent');
    expect(result.checks.recommended.odometry!.verdict).toBe('consistent');
  });

  it('the harbour-boat demo log: odometry NIS consistent; box NIS raised from 1 to just under its interval (heave and bursts the filter does not model)', async () => {
    const result = await tuneLog(boat, { free: [...SIX], profilePoints: 2 });
    const box = result.checks.recommended.boxes!;
    expect(result.checks.recommended.odometry!.verdict).toBe('consistent');
    expect(result.checks.current.boxes!.mean).toBeLessThan(1.1);
    // Not yet consistent (2.6 for a lower bound of 2.72 when written): within 10 % of the bound.
    expect(box.mean).toBeGreaterThan(0.9 * box.low);
  });
});

