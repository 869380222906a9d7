// Noise identification by innovation likelihood on recorded logs (Mehra 1970, "On the
// identification of variances and adaptive Kalman filtering", IEEE TAC 15(2); Bar-Shalom, Li,
// Kirubarajan 2001): from a start 4x too small and 4x too large, the maximum-likelihood setting
// recovers the known noise, and filters as accurately as the true setting.
import { describe, expect, it } from 'vitest';
import { identifyLogNoise } from '../../../estimator/io/log/identifyLogNoise.js';
import { replayLog } from '../../../estimator/io/log/replayLog.js';
import { settingCheck } from '../../../estimator/io/log/settingCheck.js';
import { expectClose } from '../../helpers/expectClose.js';
import { knownNoiseScenario, recordedLog, type KnownNoise } from './knownNoiseLogs.js';

const CASES: { noise: KnownNoise; seed: number }[] = [
  { noise: { pixelNoise: 2, sizeNoise: 0.05, odometryNoise: 0.05 }, seed: 3 },
  { noise: { pixelNoise: 4, sizeNoise: 0.03, odometryNoise: 0.1 }, seed: 3 },
  { noise: { pixelNoise: 1, sizeNoise: 0.08, odometryNoise: 0.2 }, seed: 3 },
];

describe('identifyLogNoise on logs with known noise', () => {
  for (const { noise, seed } of CASES) {
    for (const factor of [0.25, 4]) {
      it(`recovers pixel ${noise.pixelNoise} px, size ${noise.sizeNoise}, odometry ${noise.odometryNoise} m/s from a start ${factor}x`, async () => {
        const scenario = knownNoiseScenario(noise);
        const log = await recordedLog(scenario, seed);
        const start = { pixelNoise: noise.pixelNoise * factor, sizeNoiseFraction: noise.sizeNoise * factor, odometryNoise: noise.odometryNoise * factor };
        // Two profile points per side: enough to see each term closed on both sides, and the test stays lean.
        const result = await identifyLogNoise([log], { free: ['pixelNoise', 'sizeNoiseFraction', 'odometryNoise'], filter: start, profilePoints: 2 });
        const byName = Object.fromEntries(result.identification.terms.map((t) => [t.name, t]));
        // Tolerance 15 %: the requirement; a 15 s log has about 420 boxes and 300
        // odometry samples, whose variance estimates alone carry about 4-5 % (1 sigma) of noise.
        for (const [term, truth] of [['pixelNoise', noise.pixelNoise], ['sizeNoiseFraction', noise.sizeNoise], ['odometryNoise', noise.odometryNoise]] as const) {
          expect(byName[term]!.status, term).toBe('identified');
          expectClose(byName[term]!.estimate, truth, { rel: 0.15 }, term);
          expect(byName[term]!.low!, `${term} interval`).toBeLessThan(byName[term]!.estimate);
          expect(byName[term]!.high!, `${term} interval`).toBeGreaterThan(byName[term]!.estimate);
        }
        // Accuracy against truth: the tuned setting filters within 5 % of the true setting's RMSE.
        const trueCheck = settingCheck([await replayLog(log)]);
        expect(result.checks.recommended.positionRmse!).toBeLessThanOrEqual(1.05 * trueCheck.positionRmse!);
        expect(result.identification.minus2LogL).toBeLessThan(result.identification.startMinus2LogL);
      });
    }
  }

  it('reports a bias walk on a 10 s log as not pinned down, with no precise value', async () => {
    const log = await recordedLog(knownNoiseScenario({ pixelNoise: 2, sizeNoise: 0.05, odometryNoise: 0.05 }, 10), 4);
    const result = await identifyLogNoise([log], { free: ['accelBiasWalk'] });
    const walk = result.identification.terms[0]!;
    expect(walk.status).not.toBe('identified');
    expect(walk.digits).toBe(0);
    // Open on at least one side: no two-sided interval is claimed.
    expect(walk.low === null || walk.high === null).toBe(true);
    expect(walk.warning).toMatch(/no (precise )?value claimed/);
    expect(result.warnings.some((w) => w.startsWith('accelBiasWalk'))).toBe(true);
  });
});
