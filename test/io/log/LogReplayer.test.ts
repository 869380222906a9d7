// Box innovation whiteness per component (LogReplayer.boxWhiteness, reported in `whiteness.tests`):
// y_i / sqrt(S_ii) for u, v, s of every accepted box, tested like odometry's components with the
// Ljung-Box portmanteau Q against chi-square(L) at 5 % (Ljung and Box 1978, "On a measure of lack
// of fit in time series models", Biometrika 65(2):297-303).
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { logSourceFromFolder } from '../../../estimator/io/log/logSourceFromFolder.node.js';
import { replayLog, type ReplayReport } from '../../../estimator/io/log/replayLog.js';
import type { WhitenessResult } from '../../../estimator/io/log/WhitenessAccumulator.js';
import { writeSyntheticLog } from './syntheticLog.js';

// The filter told the generator's own noise: the carrier at constant velocity (sway 0), IMU noise
// 0.02 m/s² per 200 Hz sample = 0.0014 m/s²/√Hz, so the filter's gain is the right one and its
// innovations should be white (a mis-tuned Q makes them correlated by itself).
const MATCHED = { carrierAccelNoise: 0.01, accelNoise: 0.0015 };
const SEEDS = [4, 5, 6];
// 3 px on u (twice the white noise) with a 4 s period: slow against the 30 Hz boxes, too fast for
// the filter to absorb as carrier motion.
const drift = (t: number) => 3 * Math.sin((2 * Math.PI * t) / 4);

const white: ReplayReport[] = [];
const drifting: ReplayReport[] = [];

async function replay(seed: number, boxUError?: (t: number) => number): Promise<ReplayReport> {
  const folder = mkdtempSync(join(tmpdir(), 'alight-box-whiteness-'));
  writeSyntheticLog(folder, { duration: 20, seed, sway: 0, ...(boxUError ? { boxUError } : {}) });
  return replayLog(logSourceFromFolder(folder), { filter: MATCHED });
}

function test(report: ReplayReport, series: string): WhitenessResult {
  const found = report.whiteness.tests.find((t) => t.series === series);
  if (!found) throw new Error(`no whiteness test "${series}" in ${report.whiteness.tests.map((t) => t.series).join('; ')}`);
  return found;
}

beforeAll(async () => {
  for (const seed of SEEDS) {
    white.push(await replay(seed));
    drifting.push(await replay(seed, drift));
  }
});

describe('box innovation whiteness per component', () => {
  it('reports u, v, s beside the NIS sequences and the odometry components, in the same form', () => {
    expect(white[0]!.whiteness.tests.map((t) => t.series)).toEqual([
      'box NIS sequence (accepted updates, in order)',
      'odometry NIS sequence (accepted updates, in order)',
      'odometry innovation vx / sqrt(S)',
      'odometry innovation vy / sqrt(S)',
      'odometry innovation vz / sqrt(S)',
      'box innovation u / sqrt(S)',
      'box innovation v / sqrt(S)',
      'box innovation s / sqrt(S)',
    ]);
    const u = test(white[0]!, 'box innovation u / sqrt(S)');
    // one sample per accepted box: the same count as the box NIS
    expect(u.count).toBe(white[0]!.nisCount);
    expect(u.autocorrelation).toHaveLength(20);
  });

  it('white box noise and a matched filter: u, v and s pass (5 % test: 1 in 20 white series fails by chance; these seeded ones pass)', () => {
    for (const [i, report] of white.entries()) {
      for (const c of ['u', 'v', 's']) {
        const t = test(report, `box innovation ${c} / sqrt(S)`);
        expect(t.white, `seed ${SEEDS[i]} ${c}: Q = ${t.ljungBox} vs ${t.threshold}`).toBe(true);
      }
    }
  });

  it('a slow sinusoid on u fails the u test by far, while v, s and the box NIS-sequence test do not see it', () => {
    for (const [i, report] of drifting.entries()) {
      const u = test(report, 'box innovation u / sqrt(S)');
      expect(u.white, `seed ${SEEDS[i]}`).toBe(false);
      expect(u.ljungBox).toBeGreaterThan(10 * u.threshold); // observed 700-880 vs 31.4
      expect(u.autocorrelation[0]!).toBeGreaterThan(u.bound); // positive lag-1 correlation of a slow error
      expect(test(report, 'box innovation v / sqrt(S)').white).toBe(true);
      expect(test(report, 'box innovation s / sqrt(S)').white).toBe(true);
      // the gap this closes: the NIS sequence alone passes the drifting log
      expect(test(report, 'box NIS sequence (accepted updates, in order)').white, `seed ${SEEDS[i]}`).toBe(true);
      expect(report.whiteness.white).toBe(false);
    }
  });
});
