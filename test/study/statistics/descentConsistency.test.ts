// The descent's ensemble NEES verdict, from trials' per-height NEES (TrialResult.neesByHeight):
// the bins line up with DESCENT_HEIGHT_EDGES, a trial counts in the bins its descent reached,
// and the verdict is robust to one wild trial (issue 10: one trial's NEES x 1000 changes nothing).
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../../estimator/io/loadScenario.js';
import { runTrial } from '../../../estimator/sim/runTrial.js';
import { DESCENT_HEIGHT_EDGES, descentHeightBin, descentHeightLabels } from '../../../estimator/sim/descentHeightBins.js';
import { descentConsistency } from '../../../estimator/study/statistics/descentConsistency.js';
import { RandomStream } from '../../../estimator/random/RandomStream.js';

describe('descentHeightBin', () => {
  it('puts a height in [edge i, edge i+1), below 0 in the first bin, above the last edge in the last', () => {
    expect(descentHeightBin(-0.2)).toBe(0);
    expect(descentHeightBin(0.5)).toBe(1);
    expect(descentHeightBin(2.99)).toBe(4);
    expect(descentHeightBin(40)).toBe(DESCENT_HEIGHT_EDGES.length - 1);
    expect(descentHeightLabels()[4]).toBe('2-3 m');
  });
});

describe('descentConsistency', () => {
  it('calls seeded chi-square(6) averages consistent, and 3x their size over-confident (Bar-Shalom et al. 2001, 5.4)', () => {
    // each trial's bin value: the mean of 10 independent chi-square(6) draws (a consistent filter)
    const stream = RandomStream.fromKey([10, 0, 0, 1]);
    const draw = () => {
      let sum = 0;
      for (let k = 0; k < 10; k++) for (let d = 0; d < 6; d++) sum += stream.gaussian() ** 2;
      return sum / 10;
    };
    const trials = Array.from({ length: 100 }, () => DESCENT_HEIGHT_EDGES.map(() => draw()));
    expect(descentConsistency(trials, 6)!.verdict).toBe('consistent');
    expect(descentConsistency(trials.map((t) => t.map((v) => 3 * v)), 6)!.verdict).toBe('over-confident');
    expect(descentConsistency(trials.map((t) => t.map((v) => v / 3)), 6)!.verdict).toBe('under-confident');
  });

  it('on simulated trials: bins hold the trials that reached them, and one trial x 1000 changes no verdict', () => {
    const rover = loadScenario(join(import.meta.dirname, '..', '..', '..', 'data-demo', 'survey-rover.scenario.json'));
    const perTrial = Array.from({ length: 40 }, (_, trial) => runTrial(rover, { key: { seed: rover.seed, point: 0, trial } }).neesByHeight!);
    const before = descentConsistency(perTrial, 6)!;
    const reached = (bin: number) => perTrial.filter((t) => t[bin] !== null).length;
    for (const b of before.bins) expect(b.runs).toBe(reached(descentHeightLabels().indexOf(b.label)));
    expect(before.bins.length).toBeGreaterThanOrEqual(5); // the rover descends from 4 m: bins up to 4-6 m
    const wild = perTrial.map((t, i) => (i === 7 ? t.map((v) => (v === null ? null : 1000 * v)) : t));
    const after = descentConsistency(wild, 6)!;
    expect(after.verdict).toBe(before.verdict);
    // a bin sitting on its interval's edge may tip (a trial at 0.005 times 1000 is an ordinary 5,
    // not an outlier), but never more than the one bin: the ensemble verdict above holds
    const changed = after.bins.filter((b, i) => b.verdict !== before.bins[i]!.verdict).length;
    expect(changed).toBeLessThanOrEqual(1);
    // the wild trial is counted as an outlier in every bin it reached (unless it was one already)
    expect(after.outlierTrials).toBeGreaterThan(before.outlierTrials);
  }, 60_000);
});
