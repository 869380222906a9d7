// Bench section `sweep`: 1,000 demo trials with 1 and 2 workers, timed in one run.
// A demo trial is the one of the `trial` section: the survey-rover demo flying the full 60 s
// (landing held off, filter 100 Hz, camera 30 Hz, every impairment on), here over 10 points of
// detector pixel noise x 100 trials. Both worker counts use the worker_threads pool
// (dist/sweep-worker.mjs, built by `npm run bench`), so both pay the same cold start (thread,
// module load, JIT warm-up) and the ratio is the parallel speed-up. Order 1, 2, 2, 1, 1, 2 and
// the fastest of each count: this host's two cores slow each other by 0 to 20 % depending on
// what else runs on the machine at the time (a process's CPU per trial, measured alone and
// beside a copy of itself), so one pair of runs measures the neighbours as much as the code.
// All result files must be byte-identical, or the section fails.
//
// `landingSweep` times the same grid with trials that end at touchdown (about 5 ms each): there
// the per-worker warm-up (V8 compiles the simulator anew in every worker, about 1 s of CPU on a
// background thread that a single worker gets free on the idle core) weighs on the speed-up.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { setPaths } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { runSweep } from '../../estimator/study/runSweep.node.js';
import { workerPool } from '../../estimator/study/sweepPool.node.js';
import { parseVary } from '../../estimator/study/sweepDesign.js';
import { demoScenarioPath } from './paths.js';
import type { BenchSection } from './sections.js';

const TRIALS = 100; // x 10 points = 1,000 trials
/** Worker counts in the order run: balanced, so a drift in machine speed favours neither. */
const ORDER = [1, 2, 2, 1, 1, 2];
const round = (v: number) => Number(v.toPrecision(4));

interface PairTiming {
  trials: number;
  seconds1: number;
  seconds2: number;
  cpuSeconds1: number;
  cpuSeconds2: number;
}

/** The 10 x 100 sweep with 1 and 2 workers in ORDER; the fastest run of each count. */
async function timeWorkerCounts(scenario: Scenario, dir: string, tag: string): Promise<PairTiming> {
  // CPU time of the whole process (worker threads included) tells a starved run from a slow one.
  const runs: Array<{ workers: number; seconds: number; cpu: number; file: string }> = [];
  for (const [index, workers] of ORDER.entries()) {
    const file = join(dir, `${tag}-${index}-${workers}.jsonl`);
    const executor = workerPool({ workers, apply: applyParams });
    const cpuStart = process.cpuUsage();
    const started = performance.now();
    await runSweep({ scenario, vary: [parseVary('detector.pixelNoise=0.5:5:10')], design: 'grid', trials: TRIALS, seed: 2026, out: file, resume: false, executor });
    const seconds = (performance.now() - started) / 1000;
    const used = process.cpuUsage(cpuStart);
    await executor.close();
    runs.push({ workers, seconds, cpu: (used.user + used.system) / 1e6, file });
  }
  const reference = readFileSync(runs[0]!.file, 'utf8');
  for (const run of runs.slice(1)) {
    if (readFileSync(run.file, 'utf8') !== reference) throw new Error(`sweep bench: ${run.file} differs from ${runs[0]!.file}`);
  }
  const best = (workers: number, key: 'seconds' | 'cpu') => Math.min(...runs.filter((r) => r.workers === workers).map((r) => r[key]));
  return { trials: 10 * TRIALS, seconds1: best(1, 'seconds'), seconds2: best(2, 'seconds'), cpuSeconds1: best(1, 'cpu'), cpuSeconds2: best(2, 'cpu') };
}

export const sweepBench: BenchSection = {
  name: 'sweep',
  async run() {
    const rover = loadScenario(demoScenarioPath('survey-rover'));
    const demoTrial = setPaths(rover, { duration: 60, 'guidance.alignTime': 60 });
    const dir = mkdtempSync(join(tmpdir(), 'alight-bench-sweep-'));
    const loadBefore = loadavg()[0]!;
    try {
      const full = await timeWorkerCounts(demoTrial, dir, 'full');
      const landing = await timeWorkerCounts(rover, dir, 'landing');
      return {
        trials: full.trials,
        simulatedSeconds: 60,
        seconds1: round(full.seconds1),
        seconds2: round(full.seconds2),
        trialsPerSec1: round(full.trials / full.seconds1),
        trialsPerSec2: round(full.trials / full.seconds2),
        speedup: round(full.seconds1 / full.seconds2),
        cpuSeconds1: round(full.cpuSeconds1),
        cpuSeconds2: round(full.cpuSeconds2),
        landingSweep: {
          trials: landing.trials,
          seconds1: round(landing.seconds1),
          seconds2: round(landing.seconds2),
          speedup: round(landing.seconds1 / landing.seconds2),
        },
        // Other processes competing for the 2 cores make the wall-clock figures unreliable.
        loadAverage: [round(loadBefore), round(loadavg()[0]!)],
      };
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};
