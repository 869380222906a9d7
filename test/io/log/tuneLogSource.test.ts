import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { logSourceFromFolder } from '../../../estimator/io/log/logSourceFromFolder.node.js';
import { replayLog, type ReplayReport } from '../../../estimator/io/log/replayLog.js';
import { tuneCost } from '../../../estimator/io/log/tuneLogSource.js';
import { expectClose } from '../../helpers/expectClose.js';
import { writeSyntheticLog } from './syntheticLog.js';

let base: ReplayReport;

beforeAll(async () => {
  const folder = mkdtempSync(join(tmpdir(), 'alight-cost-'));
  writeSyntheticLog(folder, { duration: 3, seed: 12 });
  base = await replayLog(logSourceFromFolder(folder));
});

/** The real report with chosen figures: NIS means, counts, gated counts, whiteness ratio Q/threshold. */
function report(boxMean: number, odoMean: number, gated: number, ratio: number, changes: Partial<ReplayReport> = {}): ReplayReport {
  return {
    ...base,
    boxes: { ...base.boxes, mean: boxMean, count: 90, dim: 3, gated },
    odometry: { ...base.odometry, mean: odoMean, count: 10, dim: 3, gated: 0 },
    whiteness: { ...base.whiteness, tests: base.whiteness.tests.slice(0, 1).map((t) => ({ ...t, ljungBox: ratio * t.threshold })) },
    ...changes,
  };
}

describe('tuneCost', () => {
  it('is zero for a consistent, white, ungated replay', () => {
    expect(tuneCost(report(3, 3, 0, 0.5), 'nis')).toBe(0);
  });

  it('adds |ln(NIS/dim)| averaged over kinds, ln(Q/threshold) above 1 at weight 0.5, and 2 x the gated fraction', () => {
    // exact arithmetic of the documented formula; tolerance: rounding only
    expectClose(tuneCost(report(6, 3, 0, 0.5), 'nis'), Math.log(2) / 2, { rel: 1e-12 }, 'NIS twice too large');
    expectClose(tuneCost(report(1.5, 1.5, 0, 0.5), 'nis'), Math.log(2), { rel: 1e-12 }, 'NIS half too small');
    expectClose(tuneCost(report(3, 3, 0, Math.E), 'nis'), 0.5, { rel: 1e-12 }, 'whiteness');
    expectClose(tuneCost(report(3, 3, 10, 0.5), 'nis'), (2 * 10) / 110, { rel: 1e-12 }, 'gating');
    expectClose(tuneCost(report(3, 3, 0, 0.5, { divergence: 'covariance-not-finite' }), 'nis'), 4, { rel: 1e-12 }, 'divergence');
  });

  it('with truth judges NEES against its dimension', () => {
    expectClose(tuneCost(report(3, 3, 0, 0.5, { neesMean: 12, neesDim: 6 }), 'nees'), Math.log(2), { rel: 1e-12 }, 'NEES');
    expect(tuneCost(report(3, 3, 0, 0.5, { neesMean: null }), 'nees')).toBe(4); // nothing to judge
  });
});
