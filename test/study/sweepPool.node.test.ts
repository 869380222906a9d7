import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'esbuild';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { runSweep } from '../../estimator/study/runSweep.node.js';
import { workerPool } from '../../estimator/study/sweepPool.node.js';
import { parseVary } from '../../estimator/study/sweepDesign.js';
import { inProcessExecutor, type TrialExecutor } from '../../estimator/study/trialExecutor.js';
import { fakeTrial } from './fakeTrial.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-pool-'));
const workerPath = join(dir, 'fake-worker.mjs');
afterAll(() => rmSync(dir, { recursive: true, force: true }));
beforeAll(async () => {
  // The pool runs a bundled script: bundle the real message loop with the stand-in trial.
  await build({
    entryPoints: ['test/study/fakeSweepWorker.ts'], outfile: workerPath, bundle: true, platform: 'node', format: 'esm', logLevel: 'error',
    banner: { js: "import { createRequire as __r } from 'node:module'; const require = __r(import.meta.url);" },
  });
});

async function sweepWith(executor: TrialExecutor, out: string): Promise<string> {
  try {
    await runSweep({
      scenario: defaultScenario(), vary: [parseVary('detector.pixelNoise=0:6:4'), parseVary('detector.dropout=0:0.2:3')], design: 'grid',
      trials: 25, seed: 77, out: join(dir, out), resume: false, executor,
    });
  } finally {
    await executor.close();
  }
  return readFileSync(join(dir, out), 'utf8');
}

describe('workerPool', () => {
  it('workerPool with 1, 2 and 3 threads writes the same bytes as the in-process executor (two implementations)', async () => {
    const reference = await sweepWith(inProcessExecutor(fakeTrial, applyParams), 'in-process.jsonl');
    expect(reference.split('\n')).toHaveLength(1 + 300 + 1);
    for (const workers of [1, 2, 3]) {
      expect(await sweepWith(workerPool({ workers, workerPath, apply: applyParams }), `pool-${workers}.jsonl`), `${workers} workers`).toBe(reference);
    }
  });
  it('workerPool reports a failing trial with its point and parameters, and refuses later jobs', async () => {
    const pool = workerPool({ workers: 2, workerPath, apply: applyParams });
    const job = { scenario: defaultScenario(), seed: 1, points: [{ 'detector.pixelNoise': -3 }], items: Int32Array.from([0, 0, 0, 1]) };
    await expect(pool.run(job, () => {})).rejects.toThrow(/point 0 \{"detector.pixelNoise":-3\}: .*detector\.pixelNoise/);
    await expect(pool.run(job, () => {})).rejects.toThrow(/detector\.pixelNoise/);
    await pool.close();
  });
  it('workerPool fails the job, not hangs, when a worker thread exits mid-job', async () => {
    const pool = workerPool({ workers: 2, workerPath, apply: applyParams });
    const job = { scenario: defaultScenario(), seed: 1, points: [{ 'detector.pixelNoise': 99 }], items: Int32Array.from([0, 0]) };
    await expect(pool.run(job, () => {})).rejects.toMatchObject({ message: expect.stringMatching(/worker thread stopped \(exit code 3\)/), internal: true });
    await pool.close();
  });
  it('workerPool refuses a worker count below 1', () => {
    expect(() => workerPool({ workers: 0, workerPath, apply: applyParams })).toThrow(/--workers must be a positive integer/);
  });
});
