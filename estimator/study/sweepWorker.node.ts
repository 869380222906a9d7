// Node-only worker_threads entry (bundled to dist/sweep-worker.mjs): receives a job's scenario
// and points once, then chunks of (point, trial) pairs, and posts back their record lines.
import { parentPort } from 'node:worker_threads';
import type { Scenario } from '../sim/Scenario.js';
import { applyParams } from './applyParams.js';
import { simulateTrial } from './simulateTrial.js';
import { runItems, type TrialJob } from './trialExecutor.js';
import type { WorkerReply, WorkerRequest } from './sweepPool.node.js';

const port = parentPort;
if (!port) throw new Error('sweepWorker.node.ts runs only as a worker thread');
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
    const chunk = { ...job, items: request.items };
    runItems(chunk, 0, request.items.length / 2, simulateTrial, applyParams, cache, (line) => lines.push(line));
    reply = { type: 'lines', lines };
  } catch (error) {
    reply = { type: 'error', message: (error as Error)?.message ?? String(error) };
  }
  port.postMessage(reply);
});
