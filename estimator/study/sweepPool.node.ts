// Node-only: a pool of worker_threads running trials (dist/sweep-worker.mjs). The main thread
// prepares each point's validated scenario once and sends it with the first chunk that needs it,
// so workers load only the simulator (fast start-up); chunks of (point, trial) pairs go out on
// demand and compact record lines come back: little IPC, dynamic load balance, any order.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { Scenario } from '../sim/Scenario.js';
import type { Params } from './sweepDesign.js';
import { TrialError, type ApplyParams, type LineSink, type TrialExecutor, type TrialJob } from './trialExecutor.js';

export type WorkerRequest =
  | { type: 'init'; seed: number; points: Params[] }
  | { type: 'run'; items: Int32Array; scenarios: [number, Scenario][] };
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
  /** Sets a point's values on the scenario, validated (applyParams); runs on the main thread. */
  apply: ApplyParams;
  /** Worker script (default: defaultWorkerPath()). */
  workerPath?: string;
}

export function workerPool(options: PoolOptions): TrialExecutor {
  const { workers, apply } = options;
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
        const prepared = new Map<number, Scenario>();
        const known = threads.map(() => new Set<number>());
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
        const scenarioOf = (point: number): Scenario => {
          let s = prepared.get(point);
          if (!s) {
            try {
              s = apply(job.scenario, job.points[point]!);
            } catch (error) {
              const refused = (error as Error)?.name === 'ScenarioError';
              throw new TrialError(`point ${point} ${JSON.stringify(job.points[point])}: ${(error as Error)?.message ?? String(error)}`, !refused);
            }
            prepared.set(point, s);
          }
          return s;
        };
        // Chunks shrink towards the end so the last workers finish together.
        const dispatch = (w: number): boolean => {
          if (next >= total) return false;
          const size = Math.max(1, Math.min(32, Math.ceil((total - next) / (workers * 8))));
          const items = Int32Array.from(job.items.subarray(2 * next, 2 * (next + size)));
          next += size;
          const scenarios: [number, Scenario][] = [];
          for (let i = 0; i < items.length; i += 2) {
            const point = items[i]!;
            if (known[w]!.has(point)) continue;
            known[w]!.add(point);
            scenarios.push([point, scenarioOf(point)]);
          }
          active++;
          threads[w]!.postMessage({ type: 'run', items, scenarios } satisfies WorkerRequest, [items.buffer]);
          return true;
        };
        const tryDispatch = (w: number): boolean => {
          try {
            return dispatch(w);
          } catch (error) {
            finish(error as Error);
            return false;
          }
        };
        if (total === 0) return finish();
        threads.forEach((worker, w) => {
          const onMessage = (reply: WorkerReply) => {
            if (failed) return;
            active--;
            if (reply.type === 'error') return finish(new TrialError(reply.message, reply.internal));
            try {
              for (const line of reply.lines) sink(line);
            } catch (error) {
              return finish(error as Error);
            }
            if (!tryDispatch(w) && active === 0 && !failed) finish();
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
          worker.postMessage({ type: 'init', seed: job.seed, points: job.points } satisfies WorkerRequest);
        });
        for (let w = 0; w < threads.length && !failed; w++) tryDispatch(w);
      });
    },
    async close() {
      await Promise.all(threads.map((t) => t.terminate()));
    },
  };
}
