// Node-only: a pool of worker_threads running trials (dist/sweep-worker.mjs). Each worker gets
// the scenario once per job, then small chunks of (point, trial) pairs on demand, and returns
// compact record lines: little IPC, dynamic load balance, order-independent results.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { Scenario } from '../sim/Scenario.js';
import type { Params } from './sweepDesign.js';
import { TrialError, type LineSink, type TrialExecutor, type TrialJob } from './trialExecutor.js';

export type WorkerRequest =
  | { type: 'init'; scenario: Scenario; seed: number; points: Params[] }
  | { type: 'run'; items: Int32Array };
export type WorkerReply = { type: 'lines'; lines: string[] } | { type: 'error'; message: string; internal: boolean };

/** The bundled worker: beside this bundle (dist/), or dist/ of the repo when run from source. */
export function defaultWorkerPath(): string {
  const candidates = [new URL('./sweep-worker.mjs', import.meta.url), new URL('../../dist/sweep-worker.mjs', import.meta.url)];
  for (const url of candidates) {
    const path = fileURLToPath(url);
    if (existsSync(path)) return path;
  }
  throw new TrialError('dist/sweep-worker.mjs not found: run `npm run build` first (or use --workers 1)');
}

export interface PoolOptions {
  workers: number;
  /** Worker script (default: defaultWorkerPath()). */
  workerPath?: string;
}

export function workerPool(options: PoolOptions): TrialExecutor {
  const { workers } = options;
  if (!Number.isInteger(workers) || workers < 1) throw new TrialError(`--workers must be a positive integer, got ${workers}`);
  const path = options.workerPath ?? defaultWorkerPath();
  const threads = Array.from({ length: workers }, () => new Worker(path));
  let busy = false;
  let broken: Error | null = null; // after a failure, stale replies may still arrive: refuse further jobs

  return {
    run(job: TrialJob, sink: LineSink): Promise<void> {
      if (busy) return Promise.reject(new TrialError('worker pool already running a job'));
      if (broken) return Promise.reject(broken);
      busy = true;
      return new Promise<void>((resolve, reject) => {
        const total = job.items.length / 2;
        let next = 0;
        let active = 0;
        let failed = false;
        const listeners: Array<() => void> = [];
        const finish = (error?: Error) => {
          if (failed) return;
          if (error) {
            failed = true;
            broken = error;
          }
          for (const off of listeners) off();
          busy = false;
          if (error) reject(error);
          else resolve();
        };
        // Chunks shrink towards the end so the last workers finish together.
        const dispatch = (worker: Worker): boolean => {
          if (next >= total) return false;
          const size = Math.max(1, Math.min(32, Math.ceil((total - next) / (workers * 8))));
          const chunk = job.items.subarray(2 * next, 2 * (next + size));
          next += size;
          active++;
          const items = Int32Array.from(chunk);
          worker.postMessage({ type: 'run', items } satisfies WorkerRequest, [items.buffer]);
          return true;
        };
        if (total === 0) return finish();
        for (const worker of threads) {
          const onMessage = (reply: WorkerReply) => {
            if (failed) return;
            active--;
            if (reply.type === 'error') return finish(new TrialError(reply.message, reply.internal));
            try {
              for (const line of reply.lines) sink(line);
            } catch (error) {
              return finish(error as Error);
            }
            if (!dispatch(worker) && active === 0) finish();
          };
          const onError = (error: Error) => finish(new TrialError(`worker thread failed: ${error.message}`, true));
          const onExit = (code: number) => finish(new TrialError(`worker thread stopped (exit code ${code}) during the sweep`, true));
          worker.on('message', onMessage);
          worker.on('error', onError);
          worker.on('exit', onExit);
          listeners.push(() => {
            worker.off('message', onMessage);
            worker.off('error', onError);
            worker.off('exit', onExit);
          });
          worker.postMessage({ type: 'init', scenario: job.scenario, seed: job.seed, points: job.points } satisfies WorkerRequest);
        }
        for (const worker of threads) dispatch(worker);
      });
    },
    async close() {
      await Promise.all(threads.map((t) => t.terminate()));
    },
  };
}
