import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { mergeSweepParts, plannedTrials, splitSweep, sweepJob, type SweepInput } from '../../../notebooks/jobs/sweepJob.js';

describe('a sweep split over workers', () => {
  const input: SweepInput = { scenario: defaultScenario(), seed: 3, trials: 3, vary: [{ path: 'detector.pixelNoise', values: [0.5, 6] }] };
  const none = (): void => undefined;

  it('merges to the very file, records and summaries of one unsplit run', () => {
    const whole = sweepJob(input, none);
    const parts = splitSweep(input, 4);
    expect(parts.map((p) => plannedTrials(p))).toEqual([2, 2, 1, 1]); // 6 trials dealt round the parts
    const merged = mergeSweepParts(input, parts.map((p) => sweepJob(p, none)));
    expect(merged.resultsText).toBe(whole.resultsText);
    expect(merged.records).toEqual(whole.records);
    expect(merged.summaries).toEqual(whole.summaries);
    // Partial merges (a part still missing) hold only what has run.
    expect(mergeSweepParts(input, [sweepJob(parts[0]!, none), null, null, null]).records.map((r) => [r.point, r.trial])).toEqual([[0, 0], [0, 2]]);
  });

  it('never makes more parts than trials', () => {
    expect(splitSweep({ ...input, trials: 1 }, 8)).toHaveLength(2);
  });
});
