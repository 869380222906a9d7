import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { runBatch } from '../../estimator/study/runBatch.js';
import { inProcessExecutor } from '../../estimator/study/trialExecutor.js';
import { fakeTrial } from './fakeTrial.js';

describe('runBatch', () => {
  const executor = inProcessExecutor(fakeTrial, applyParams);
  it('runBatch returns records per setting, sorted by trial, keyed from pointOffset', async () => {
    const [a, b] = await runBatch(executor, { scenario: defaultScenario(), seed: 4, points: [{ 'detector.pixelNoise': 1 }, { 'detector.pixelNoise': 2 }], pointOffset: 7, trialStart: 3, trialEnd: 6 });
    expect(a!.map((r) => [r.point, r.trial])).toEqual([[7, 3], [7, 4], [7, 5]]);
    expect(b!.map((r) => [r.point, r.trial])).toEqual([[8, 3], [8, 4], [8, 5]]);
    expect(b![0]!.params).toEqual({ 'detector.pixelNoise': 2 });
  });
  it('runBatch at the same key point reuses the random streams (common random numbers)', async () => {
    const run = (noise: number) => runBatch(executor, { scenario: defaultScenario(), seed: 4, points: [{ 'detector.pixelNoise': noise }], trialStart: 0, trialEnd: 20 });
    const [low] = await run(1);
    const [high] = await run(3);
    // The stand-in draws the same uniforms for the same key: its miss scales with the noise exactly.
    for (let t = 0; t < 20; t++) expect(high![t]!.missX! / low![t]!.missX!).toBeCloseTo(3, 12);
  });
});
