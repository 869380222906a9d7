// Node-only: the message loop of a sweep worker thread. It receives a job's scenario and points
// once ('init'), then chunks of (point, trial) pairs ('run'), and posts back their record lines.
import type { MessagePort } from 'node:worker_threads';
import type { Scenario } from '../sim/Scenario.js';
import type { WorkerReply, WorkerRequest } from './sweepPool.node.js';
import { runItems, TrialError, type ApplyParams, type TrialFunction, type TrialJob } from './trialExecutor.js';

export function serveTrials(port: MessagePort, trial: TrialFunction, apply: ApplyParams): void {
  let job: TrialJob | null = null;
  let cache = new Map<number, Scenario>();
  port.on('message', (request: WorkerRequest) => {
    if (request.type === 'init') {
      job = { scenario: request.scenario, seed: request.seed, points: request.points, items: new Int32Array(0) };
      cache = new Map();
      return;
    }
    const lines: string[] = [];
    let reply: WorkerReply;
    try {
      if (!job) throw new Error('run before init');
      runItems({ ...job, items: request.items }, 0, request.items.length / 2, trial, apply, cache, (line) => lines.push(line));
      reply = { type: 'lines', lines };
    } catch (error) {
      reply = { type: 'error', message: (error as Error)?.message ?? String(error), internal: !(error instanceof TrialError) || error.internal };
    }
    port.postMessage(reply);
  });
}
