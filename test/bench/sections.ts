// The benchmark sections, one import and one entry each; the key is the JSON key.
import { ekf } from './ekf.js';
import { world } from './world.js';
import { sweepBench } from './sweep.js';
import { replayBench } from './replay.js';
import { trialBench } from './trial.js';
import { importBench } from './importBench.js';
import { pageBench } from './page.js';
import { tuneBench } from './tune.js';
export interface BenchSection {
  name: string;
  run(): Promise<Record<string, unknown>>;
}

export const sections: BenchSection[] = [
  ekf,
  world,
  sweepBench,
  replayBench,
  trialBench,
  pageBench,
  importBench,
  tuneBench,
];
