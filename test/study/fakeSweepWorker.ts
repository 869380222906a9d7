// Worker entry for pool tests: the real message loop serving the deterministic stand-in trial.
import { parentPort } from 'node:worker_threads';
import { applyParams } from '../../estimator/study/applyParams.js';
import { serveTrials } from '../../estimator/study/serveTrials.node.js';
import { fakeTrial } from './fakeTrial.js';

serveTrials(parentPort!, fakeTrial, applyParams);
