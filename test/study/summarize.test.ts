import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import type { TrialResult } from '../../estimator/sim/TrialResult.js';
import type { SweepHeader, SweepRecord } from '../../estimator/study/resultsFile.js';
import { summarize } from '../../estimator/study/summarize.js';
import { expectClose } from '../helpers/expectClose.js';
import { fakeTrial } from './fakeTrial.js';

const header: SweepHeader = {
  v: 1, kind: 'alight-sweep', tool: '0.1.0', seed: 3, trials: 30, design: 'grid',
  vary: [{ path: 'a', values: [1, 2] }, { path: 'b', values: ['x', 'y'] }],
  points: [{ a: 1, b: 'x' }, { a: 1, b: 'y' }, { a: 2, b: 'x' }, { a: 2, b: 'y' }],
  scenario: defaultScenario(),
};

function rec(point: number, trial: number, patch: Partial<TrialResult>): SweepRecord {
  return { v: 1, point, trial, params: header.points[point]!, ...fakeTrial(defaultScenario(), { seed: 1, point, trial }), ...patch };
}

describe('summarize(header, records)', () => {
  // Point 0: 29 of 29 landed, misses 0.01..0.29. Point 2: 81 of 263 is too many; use 15 of 30.
  const records: SweepRecord[] = [];
  for (let t = 0; t < 29; t++) records.push(rec(0, t, { outcome: 'landed', missDistance: (t + 1) / 100, touchdownTime: 10 + t, neesMean: 6, neesDim: 6 }));
  for (let t = 0; t < 30; t++) records.push(rec(2, t, t < 15 ? { outcome: 'landed' } : { outcome: 'timed-out', missDistance: null, missX: null, missY: null, touchdownTime: null }));

  it('summarize gives Wilson limits, rule of three and CEP per point', () => {
    const [p0, p2] = summarize(header, records);
    expect(p0!.point).toEqual({ a: 1, b: 'x' });
    expect([p0!.trials, p0!.landed, p0!.successRate]).toEqual([29, 29, 1]);
    // Newcombe 1998, Table I: 29/29 -> 0.8830 to 1 (four printed decimals).
    expectClose(p0!.wilsonLow, 0.883, { abs: 5e-5 }, 'wilsonLow');
    expect(p0!.wilsonHigh).toBe(1);
    // Hanley and Lippman-Hand 1983: no failure in 29 -> failure rate below about 3/29.
    expectClose(p0!.ruleOfThreeLow!, 1 - 3 / 29, { rel: 1e-15 }, 'rule of three'); // same arithmetic
    expect(p0!.cep50).toBe(0.15); // median of 0.01..0.29
    expect(p0!.timeToLandP50).toBe(24);
    expect(p0!.outcomes.landed).toBe(29);
    expect(p0!.neesMean).toBe(6);
    expect(p0!.neesVerdict).toBe('consistent');
    expect(p2!.point).toEqual({ a: 2, b: 'x' });
    expect([p2!.trials, p2!.landed, p2!.ruleOfThreeLow, p2!.contacts]).toEqual([30, 15, null, 15]);
    expect(p2!.outcomes['timed-out']).toBe(15);
  });
  it('summarize --by pools the other paths, in ascending value order', () => {
    const rows = summarize(header, records, 'a');
    expect(rows.map((r) => [r.point, r.trials, r.landed])).toEqual([[{ a: 1 }, 29, 29], [{ a: 2 }, 30, 15]]);
    expect(() => summarize(header, records, 'c')).toThrow(/--by c: not a varied path.*varied: a, b/);
  });
  it('summarize flags an over-confident filter when NEES is far above its dimension', () => {
    const hot = Array.from({ length: 40 }, (_, t) => rec(1, t, { neesMean: 12, neesDim: 6 }));
    const [row] = summarize(header, hot);
    expect(row!.neesVerdict).toBe('over-confident');
  });

});
