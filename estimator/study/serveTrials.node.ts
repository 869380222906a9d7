// Node-only: the message loop of a sweep worker thread. It receives the job's seed and points
// ('init'), then chunks of (point, trial) pairs with the prepared scenarios of points it has not
// seen yet ('run'), and posts back their record lines. No scenario validation happens here.
import type { MessagePort } from 'node:worker_threads';
import type { Scenario } from '../sim/Scenario.js';
import type { WorkerReply, WorkerRequest } from './sweepPool.node.js';
import { runItems, TrialError, type TrialFunction, type TrialJob } from './trialExecutor.js';

const unprepared = (): never => {
  throw new Error('a point arrived without its prepared scenario');
};

export function serveTrials(port: MessagePort, trial: TrialFunction): void {
  let job: TrialJob | null = null;
  let cache = new Map<number, Scenario>();
  port.on('message', (request: WorkerRequest) => {
    if (request.type === 'init') {
      // The base scenario stays on the main thread: every point arrives prepared.
      job = { scenario: null as unknown as Scenario, seed: request.seed, points: request.points, items: new Int32Array(0) };
      cache = new Map();
      return;
    }
    const lines: string[] = [];
    let reply: WorkerReply;
    try {
      if (!job) throw new Error('run before init');
      for (const [point, scenario] of request.scenarios) cache.set(point, scenario);
      runItems({ ...job, items: request.items }, 0, request.items.length / 2, trial, unprepared, cache, (line) => lines.push(line));
      reply = { type: 'lines', lines };
    } catch (error) {
      reply = { type: 'error', message: (error as Error)?.message ?? String(error), internal: !(error instanceof TrialError) || error.internal };
    }
    port.postMessage(reply);
  });
}
