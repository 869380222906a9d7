// Node-only worker_threads entry, bundled to dist/sweep-worker.mjs: serves real simulated trials.
// Scenarios arrive validated from the main thread, so the worker loads only the simulator.
import { parentPort } from 'node:worker_threads';
import { serveTrials } from './serveTrials.node.js';
import { simulateTrial } from './simulateTrial.js';

if (!parentPort) throw new Error('sweepWorker.node.ts runs only as a worker thread');
serveTrials(parentPort, simulateTrial);
