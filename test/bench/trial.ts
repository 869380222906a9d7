// Bench `trial`: CPU per closed-loop demo trial of 60 s simulated time (filter 100 Hz,
// camera 30 Hz, every impairment of the demo on). Landing is held off (alignTime = duration)
// so every trial flies the full 60 s; 10 seeded trials per demo scenario, 50 in all.
// cpuMsZeroLatency: the same trials with detector latency 0 (no delayed-box re-propagation).
// cpuMsNoAttribution: the same trials without the failure-attribution log (runTrial's
// `attribution: false`); attributionShare = cpuMs / cpuMsNoAttribution - 1 (promise: < 10 %).
//
// Every scenario is warmed up before any is timed: process CPU time includes V8's background
// compiler threads, so a trial timed while the code still tiers up (the first scenario, or the
// first 15-state filter) would be charged for the compilation, not for the simulation.
//
// The 50 trials run in ROUNDS (5) rounds over about 12 s, each round visiting every scenario,
// and each trial's figure is the least CPU it took in any round (cpuMs = median over the 50 of
// those). This host's speed changes by up to 1.6x for seconds at a time, whatever runs on it (a
// fixed arithmetic loop measured 57 ms per slice in one stretch and 90-120 ms in the next), so a
// single pass times the neighbours as much as the code; the minimum of repeats is the usual estimate
// of what the code itself costs. The median of each round is reported beside it
// (cpuMsPerRound), so the spread stays visible.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { setPaths } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { runTrial } from '../../estimator/sim/runTrial.js';
import { repoRoot } from './paths.js';
import type { BenchSection } from './sections.js';

const TRIALS_PER_DEMO = 10;
const ROUNDS = 5;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
}

/** CPU ms of one trial (process CPU: user + system, all threads). */
function cpuOf(scenario: Scenario, trial: number, attribution = true): number {
  const start = process.cpuUsage();
  runTrial(scenario, { key: { seed: 1, point: 0, trial }, attribution });
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1000;
}

const round2 = (v: number) => Number(v.toFixed(2));

export const trialBench: BenchSection = {
  name: 'trial',
  async run() {
    const dir = join(repoRoot(), 'data-demo');
    const names = readdirSync(dir).filter((f) => f.endsWith('.scenario.json')).sort();
    const scenarios = names.map((name) => setPaths(loadScenario(join(dir, name)), { duration: 60, 'guidance.alignTime': 60 }));
    // the same trials with boxes arriving at once: the difference is the filter's
    // re-propagation of delayed boxes
    const prompt = scenarios.map((s) => setPaths(s, { 'detector.latency': 0, 'detector.latencyJitter': 0 }));
    for (let round = 0; round < 3; round++) {
      for (let i = 0; i < scenarios.length; i++) {
        runTrial(scenarios[i]!, { key: { seed: 999, point: 0, trial: round } });
        runTrial(prompt[i]!, { key: { seed: 999, point: 0, trial: round } });
        runTrial(scenarios[i]!, { key: { seed: 999, point: 0, trial: round }, attribution: false });
      }
    }
    const count = scenarios.length * TRIALS_PER_DEMO;
    const best = new Array<number>(count).fill(Infinity);
    const bestPrompt = new Array<number>(count).fill(Infinity);
    const bestPlain = new Array<number>(count).fill(Infinity);
    const perRound: number[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      const mine: number[] = [];
      for (let i = 0; i < scenarios.length; i++) {
        for (let trial = 0; trial < TRIALS_PER_DEMO; trial++) {
          const k = i * TRIALS_PER_DEMO + trial;
          const ms = cpuOf(scenarios[i]!, trial);
          mine.push(ms);
          best[k] = Math.min(best[k]!, ms);
        }
        for (let trial = 0; trial < TRIALS_PER_DEMO; trial++) {
          const k = i * TRIALS_PER_DEMO + trial;
          bestPrompt[k] = Math.min(bestPrompt[k]!, cpuOf(prompt[i]!, trial));
        }
        for (let trial = 0; trial < TRIALS_PER_DEMO; trial++) {
          const k = i * TRIALS_PER_DEMO + trial;
          bestPlain[k] = Math.min(bestPlain[k]!, cpuOf(scenarios[i]!, trial, false));
        }
      }
      perRound.push(round2(median(mine)));
    }
    const perScenario: Record<string, number> = {};
    let steps = 0, totalMs = 0;
    for (const [i, name] of names.entries()) {
      const mine = best.slice(i * TRIALS_PER_DEMO, (i + 1) * TRIALS_PER_DEMO);
      perScenario[name.replace('.scenario.json', '')] = round2(median(mine));
      steps += TRIALS_PER_DEMO * Math.round(scenarios[i]!.duration * scenarios[i]!.filter.rate);
      totalMs += mine.reduce((a, b) => a + b, 0);
    }
    return {
      trials: count,
      rounds: ROUNDS,
      simulatedSeconds: 60,
      cpuMs: round2(median(best)),
      stepsPerSec: Math.round(steps / (totalMs / 1000)),
      cpuMsZeroLatency: round2(median(bestPrompt)),
      cpuMsNoAttribution: round2(median(bestPlain)),
      attributionShare: round2(median(best) / median(bestPlain) - 1),
      cpuMsPerRound: perRound,
      perScenarioCpuMs: perScenario,
    };
  },
};
