import { describe, expect, it } from 'vitest';
import { summarizeGroup } from '../../estimator/study/summarize.js';
import { tuningCost } from '../../estimator/study/tuningCost.js';
import type { SweepRecord } from '../../estimator/study/resultsFile.js';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { fakeTrial } from './fakeTrial.js';

function group(landed: number, nees: number | null) {
  const records: SweepRecord[] = Array.from({ length: 10 }, (_, t) => ({
    v: 1, point: 0, trial: t, params: {}, ...fakeTrial(defaultScenario(), { seed: 1, point: 0, trial: t }),
    outcome: t < landed ? 'landed' : 'aborted', neesMean: nees as number, neesDim: 6,
  }));
  return summarizeGroup({}, records);
}

describe('tuningCost', () => {
  it('tuningCost = (1 - success) + w |ln(ANEES / n)|: a consistent filter pays only for failures', () => {
    expect(tuningCost(group(8, 6))).toBeCloseTo(0.2, 12);
    // Twice and half too large NEES cost the same (log symmetry), 0.25 ln 2 each.
    expect(tuningCost(group(10, 12))).toBeCloseTo(0.25 * Math.log(2), 12);
    expect(tuningCost(group(10, 3))).toBeCloseTo(0.25 * Math.log(2), 12);
    expect(tuningCost(group(10, 12), 1)).toBeCloseTo(Math.log(2), 12);
  });
  it('tuningCost charges a missing NEES as e^4 off', () => {
    expect(tuningCost(group(10, null))).toBeCloseTo(1, 12);
  });
});
