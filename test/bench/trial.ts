// Bench `trial`: CPU per closed-loop demo trial of 60 s simulated time (filter 100 Hz,
// camera 30 Hz, every impairment of the demo on). Landing is held off (alignTime = duration)
// so every trial flies the full 60 s; 10 seeded trials per demo scenario, 50 in all.
// cpuMsZeroLatency: the same trials with detector latency 0 (no delayed-box re-propagation).
// Every scenario is warmed up before any is timed: process CPU time includes V8's background
// compiler threads, so a trial timed while the code still tiers up (the first scenario, or the
// first 15-state filter) would be charged for the compilation, not for the simulation.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { setPaths } from '../../estimator/io/scenarioPath.js';
import { runTrial } from '../../estimator/sim/runTrial.js';
import type { BenchSection } from './sections.js';

const TRIALS_PER_DEMO = 10;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
}

export const trialBench: BenchSection = {
  name: 'trial',
  async run() {
    const dir = join(import.meta.dirname, '..', '..', 'data-demo');
    const names = readdirSync(dir).filter((f) => f.endsWith('.scenario.json')).sort();
    const scenarios = names.map((name) => setPaths(loadScenario(join(dir, name)), { duration: 60, 'guidance.alignTime': 60 }));
    for (let round = 0; round < 3; round++) {
      for (const scenario of scenarios) {
        runTrial(scenario, { key: { seed: 999, point: 0, trial: round } });
        runTrial(setPaths(scenario, { 'detector.latency': 0, 'detector.latencyJitter': 0 }), { key: { seed: 999, point: 0, trial: round } });
      }
    }
    const cpu: number[] = [];
    const cpuNoLatency: number[] = [];
    const perScenario: Record<string, number> = {};
    let steps = 0, totalMs = 0;
    for (const [index, name] of names.entries()) {
      const scenario = scenarios[index]!;
      // the same trials with boxes arriving at once: the difference is the filter's
      // re-propagation of delayed boxes
      const prompt = setPaths(scenario, { 'detector.latency': 0, 'detector.latencyJitter': 0 });
      const mine: number[] = [];
      for (let trial = 0; trial < TRIALS_PER_DEMO; trial++) {
        const start = process.cpuUsage();
        runTrial(scenario, { key: { seed: 1, point: 0, trial } });
        const used = process.cpuUsage(start);
        const ms = (used.user + used.system) / 1000;
        mine.push(ms);
        totalMs += ms;
        steps += Math.round(scenario.duration * scenario.filter.rate);
      }
      cpu.push(...mine);
      for (let trial = 0; trial < TRIALS_PER_DEMO; trial++) {
        const start = process.cpuUsage();
        runTrial(prompt, { key: { seed: 1, point: 0, trial } });
        const used = process.cpuUsage(start);
        cpuNoLatency.push((used.user + used.system) / 1000);
      }
      perScenario[name.replace('.scenario.json', '')] = Number(median(mine).toFixed(2));
    }
    return {
      trials: cpu.length,
      simulatedSeconds: 60,
      cpuMs: Number(median(cpu).toFixed(2)),
      stepsPerSec: Math.round(steps / (totalMs / 1000)),
      cpuMsZeroLatency: Number(median(cpuNoLatency).toFixed(2)),
      perScenarioCpuMs: perScenario,
    };
  },
};
