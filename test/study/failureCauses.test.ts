import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import type { Outcome } from '../../estimator/sim/TrialResult.js';
import { failureCauses } from '../../estimator/study/failureCauses.js';
import type { SweepRecord } from '../../estimator/study/resultsFile.js';
import { expectClose } from '../helpers/expectClose.js';
import { fakeTrial } from './fakeTrial.js';

function record(trial: number, outcome: Outcome, cause: SweepRecord['cause']): SweepRecord {
  return { v: 1, point: 4, trial, params: {}, ...fakeTrial(defaultScenario(), { seed: 1, point: 4, trial }), outcome, cause, causeChain: [] };
}

describe('failureCauses', () => {
  // 148 trials: 15 failed after a gust (trials 100-114), 2 with no single cause (3 and 7), the rest landed
  const records = Array.from({ length: 148 }, (_, t) =>
    t >= 100 && t < 115 ? record(t, t % 2 ? 'off-pad' : 'hard-contact', 'gust') : t === 3 || t === 7 ? record(t, 'timed-out', 'no-single-cause') : record(t, 'landed', null));

  it('counts failures per cause, most frequent first, with the Wilson interval of the rate', () => {
    const causes = failureCauses(records, 11);
    expect(causes.map((c) => [c.cause, c.count])).toEqual([['gust', 15], ['no-single-cause', 2]]);
    // Newcombe 1998, Statistics in Medicine 17:857, Wilson interval without continuity correction: 15/148 -> 0.0624 to 0.1605
    expectClose(causes[0]!.wilsonLow, 0.0624, { abs: 5e-5 }, 'low (4 printed decimals)');
    expectClose(causes[0]!.wilsonHigh, 0.1605, { abs: 5e-5 }, 'high (4 printed decimals)');
    expect(causes[0]!.rate).toBe(15 / 148);
    expect(causes[0]!.outcomes).toEqual({ 'hard-contact': 8, 'off-pad': 7 });
  });

  it('keeps the lowest-numbered trial of each cause as its replayable key', () => {
    const shuffled = [...records].reverse();
    const causes = failureCauses(shuffled, 11);
    expect(causes[0]!.example).toEqual({ seed: 11, point: 4, trial: 100 });
    expect(causes[1]!.example).toEqual({ seed: 11, point: 4, trial: 3 });
  });

  it('says not-attributed for failures from results written before attribution, and nothing for a point that always landed', () => {
    const old = records.slice(0, 10).map(({ cause, causeChain, ...r }) => ({ ...r, outcome: 'aborted' as const }));
    expect(failureCauses(old, 1).map((c) => [c.cause, c.count])).toEqual([['not-attributed', 10]]);
    expect(failureCauses(records.filter((r) => r.outcome === 'landed'), 1)).toEqual([]);
  });
});
