// Bench section `sweep`: the same 1,000-trial demo sweep with 1 and 2 workers, timed in one run.
// 1 worker = in-process (the single-thread baseline); 2 = the worker_threads pool (dist/sweep-worker.mjs,
// built by `npm run bench`). Both result files must be byte-identical, or the section fails.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { runSweep } from '../../estimator/study/runSweep.node.js';
import { simulateTrial } from '../../estimator/study/simulateTrial.js';
import { workerPool } from '../../estimator/study/sweepPool.node.js';
import { parseVary } from '../../estimator/study/sweepDesign.js';
import { inProcessExecutor, type TrialExecutor } from '../../estimator/study/trialExecutor.js';
import type { BenchSection } from './sections.js';

const TRIALS = 100; // x 10 points = 1,000 trials

export const sweepBench: BenchSection = {
  name: 'sweep',
  async run() {
    const scenario = loadScenario(new URL('../../data-demo/survey-rover.scenario.json', import.meta.url).pathname);
    const dir = mkdtempSync(join(tmpdir(), 'alight-bench-sweep-'));
    const timed = async (executor: TrialExecutor, name: string) => {
      const started = performance.now();
      await runSweep({ scenario, vary: [parseVary('detector.pixelNoise=0.5:5:10')], design: 'grid', trials: TRIALS, seed: 2026, out: join(dir, name), resume: false, executor });
      const seconds = (performance.now() - started) / 1000;
      await executor.close();
      return seconds;
    };
    try {
      const seconds1 = await timed(inProcessExecutor(simulateTrial, applyParams), 'one.jsonl');
      const seconds2 = await timed(workerPool({ workers: 2 }), 'two.jsonl');
      if (readFileSync(join(dir, 'one.jsonl'), 'utf8') !== readFileSync(join(dir, 'two.jsonl'), 'utf8')) {
        throw new Error('sweep bench: 1-worker and 2-worker result files differ');
      }
      const trials = 10 * TRIALS;
      const round = (v: number) => Number(v.toPrecision(4));
      return {
        trials,
        seconds1: round(seconds1),
        seconds2: round(seconds2),
        trialsPerSec1: round(trials / seconds1),
        trialsPerSec2: round(trials / seconds2),
        speedup: round(seconds1 / seconds2),
      };
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};
