// Worker entry for pool tests: the real message loop serving the deterministic stand-in trial.
// A pixel noise of 99 makes the thread exit mid-job, to test that the pool notices.
import { parentPort } from 'node:worker_threads';
import { serveTrials } from '../../estimator/study/serveTrials.node.js';
import { fakeTrial } from './fakeTrial.js';

serveTrials(parentPort!, (scenario, key) => {
  if (scenario.detector.pixelNoise === 99) process.exit(3);
  return fakeTrial(scenario, key);
});
