// Shared plumbing of the study commands that run trials (sweep, require, sensitivity, tune):
// scenario loading, trial executors and progress bars. No computation.
import { availableParallelism } from 'node:os';
import { SingleBar } from 'cli-progress';
import { loadScenario } from '../io/loadScenario.js';
import type { Scenario } from '../sim/Scenario.js';
import { applyParams } from '../study/applyParams.js';
import { simulateTrial } from '../study/simulateTrial.js';
import { workerPool } from '../study/sweepPool.node.js';
import { inProcessExecutor, type TrialExecutor } from '../study/trialExecutor.js';
import { CliError } from './CliError.js';
import { asCliError } from './studyCli.js';
import type { CommandIo } from './Command.js';
import { numberOption, type ParsedArgs } from './parseArgs.js';

export function loadScenarioOrFail(path: string | undefined, command: string, cwd: string): Scenario {
  if (!path) throw new CliError(`alight ${command}: give a scenario file (alight ${command} --help)`);
  try {
    return loadScenario(path.startsWith('/') ? path : `${cwd}/${path}`);
  } catch (error) {
    return asCliError(command, error);
  }
}

/**
 * --workers, at most one per core: more threads than cores only share the cores and each
 * holds its own compiled simulator (64 workers on 2 cores took 18x the time and 1.2 GB).
 */
export function workerCount(command: string, parsed: ParsedArgs, io: CommandIo): number {
  const cores = availableParallelism();
  const asked = numberOption(command, parsed, 'workers', cores, (v) => Number.isInteger(v) && v >= 1, 'a positive integer');
  if (asked <= cores) return asked;
  io.stderr(`alight ${command}: note: --workers ${asked} is more than the ${cores} cores here; using ${cores}\n`);
  return cores;
}

/**
 * One thread: in-process (no bundle needed); more: the worker_threads pool running
 * dist/sweep-worker.mjs, or the script named by ALIGHT_SWEEP_WORKER (tests, custom builds).
 */
export function createExecutor(workers: number, env: Record<string, string | undefined> = {}): TrialExecutor {
  return workers <= 1 ? inProcessExecutor(simulateTrial, applyParams) : workerPool({ workers, apply: applyParams, workerPath: env.ALIGHT_SWEEP_WORKER || undefined });
}

export interface Progress {
  update(done: number, total: number): void;
  stop(): void;
}

/** A progress bar with rate and ETA on a terminal; silent otherwise. */
export function progressBar(io: CommandIo, label: string): Progress {
  if (!io.interactive) return { update() {}, stop() {} };
  const bar = new SingleBar({
    format: `${label} {bar} {percentage}% | {value}/{total} trials | {speed} trials/s | ETA {eta_formatted}`,
    barCompleteChar: '█',
    barIncompleteChar: '·',
    hideCursor: true,
    etaBuffer: 50,
    stream: process.stderr,
  });
  const started = Date.now();
  let first = -1;
  let startedBar = false;
  return {
    update(done, total) {
      if (first < 0) first = done;
      const seconds = (Date.now() - started) / 1000;
      const speed = seconds > 0 ? ((done - first) / seconds).toFixed(1) : '-';
      if (!startedBar) {
        bar.start(total, done, { speed });
        startedBar = true;
      } else bar.update(done, { speed });
    },
    stop() {
      if (startedBar) bar.stop();
    },
  };
}
