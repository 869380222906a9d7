// Bench section `sweep`: the same 1,000-trial demo sweep with 1 and 2 workers, timed in one run.
// Both use the worker_threads pool (dist/sweep-worker.mjs, built by `npm run bench`), so both pay
// the same cold start (thread, module load, JIT warm-up) and the ratio is the parallel speed-up.
// Order 1, 2, 2, 1 and the faster of each pair, so a passing load on a shared machine or a drift
// in clock speed does not favour either side. One in-process run (what `--workers 1` does) is
// reported beside them. All result files must be byte-identical, or the section fails.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
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
    // CPU time of the whole process (worker threads included) tells a starved run from a slow one.
    const cpu: Record<string, number> = {};
    const timed = async (executor: TrialExecutor, name: string) => {
      const cpuStart = process.cpuUsage();
      const started = performance.now();
      await runSweep({ scenario, vary: [parseVary('detector.pixelNoise=0.5:5:10')], design: 'grid', trials: TRIALS, seed: 2026, out: join(dir, name), resume: false, executor });
      const seconds = (performance.now() - started) / 1000;
      const used = process.cpuUsage(cpuStart);
      cpu[name] = (used.user + used.system) / 1e6;
      await executor.close();
      return seconds;
    };
    const loadBefore = loadavg()[0]!;
    try {
      const a1 = await timed(workerPool({ workers: 1, apply: applyParams }), 'one-a.jsonl');
      const a2 = await timed(workerPool({ workers: 2, apply: applyParams }), 'two-a.jsonl');
      const b2 = await timed(workerPool({ workers: 2, apply: applyParams }), 'two-b.jsonl');
      const b1 = await timed(workerPool({ workers: 1, apply: applyParams }), 'one-b.jsonl');
      const inProcess = await timed(inProcessExecutor(simulateTrial, applyParams), 'in-process.jsonl');
      const reference = readFileSync(join(dir, 'one-a.jsonl'), 'utf8');
      for (const name of ['two-a.jsonl', 'two-b.jsonl', 'one-b.jsonl', 'in-process.jsonl']) {
        if (readFileSync(join(dir, name), 'utf8') !== reference) throw new Error(`sweep bench: ${name} differs from one-a.jsonl`);
      }
      const seconds1 = Math.min(a1, b1);
      const seconds2 = Math.min(a2, b2);
      const trials = 10 * TRIALS;
      const round = (v: number) => Number(v.toPrecision(4));
      return {
        trials,
        seconds1: round(seconds1),
        seconds2: round(seconds2),
        trialsPerSec1: round(trials / seconds1),
        trialsPerSec2: round(trials / seconds2),
        speedup: round(seconds1 / seconds2),
        trialsPerSecInProcess: round(trials / inProcess),
        cpuSeconds1: round(Math.min(cpu['one-a.jsonl']!, cpu['one-b.jsonl']!)),
        cpuSeconds2: round(Math.min(cpu['two-a.jsonl']!, cpu['two-b.jsonl']!)),
        // Other processes competing for the 2 cores make the wall-clock figures unreliable.
        loadAverage: [round(loadBefore), round(loadavg()[0]!)],
      };
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};
