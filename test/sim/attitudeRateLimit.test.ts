// Must-show of the attitude response on every demo: no simulated step turns the body faster
// than the scenario's maxAttitudeRateDeg (peakAttitudeRateDeg is the largest over all steps).
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { runTrial } from '../../estimator/sim/runTrial.js';

const DEMO = join(import.meta.dirname, '..', '..', 'data-demo');
const demoNames = readdirSync(DEMO).filter((f) => f.endsWith('.scenario.json')).sort();

describe('attitude rate on the demos', () => {
  it.each(demoNames)('%s: 50 trials, no step turns faster than lander.maxAttitudeRateDeg', (name) => {
    const s = loadScenario(join(DEMO, name));
    const limit = s.lander.maxAttitudeRateDeg;
    let peak = 0;
    for (let trial = 0; trial < 50; trial++) peak = Math.max(peak, runTrial(s, { key: { seed: s.seed, point: 0, trial } }).peakAttitudeRateDeg);
    expect(peak).toBeLessThanOrEqual(limit * (1 + 1e-12)); // rounding of the rate in deg/s
    expect(peak).toBeGreaterThan(0.5 * limit); // the limit is exercised, not idle
  }, 60_000);
});
