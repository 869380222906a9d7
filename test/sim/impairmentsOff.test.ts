// Must-show of the blind-height forecast: with every sensing impairment off (wind left as the
// demo has it: weather, not a sensor), no demo trial aborts, for a lost target or otherwise.
// The previous fixed blind height (1.2 x the deck's longest side) let an unbiased lander abort
// "target-lost" with the deck filling the image.
import { describe, expect, it } from 'vitest';
import { runTrial } from '../../estimator/sim/runTrial.js';
import { demoNames, loadDemo, sensingPerfect } from './demoTrials.js';

describe('impairments off', () => {
  it.each(demoNames)('%s: 30 trials, not one abort (no "target-lost" with the deck in view)', (name) => {
    const s = sensingPerfect(loadDemo(name));
    const aborted: number[] = [];
    for (let trial = 0; trial < 30; trial++) if (runTrial(s, { key: { seed: s.seed, point: 0, trial } }).aborts > 0) aborted.push(trial);
    expect(aborted).toEqual([]);
  }, 60_000);
});
