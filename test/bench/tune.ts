// Bench section `tune`: noise identification on a flight log.
// logSeconds: wall time of `tuneLog` on the harbour-boat demo log (data-demo/logs/harbour-boat,
//   about 13 s of flight) identifying four terms (pixelNoise, sizeNoiseFraction, odometryNoise,
//   carrierAccelNoise; the bench names four, the CLI default adds accelNoise): the search,
//   the curvature intervals, the profiles and the two comparison replays, i.e. everything
//   `alight tune data-demo/logs/harbour-boat --free <these four>` computes.
//   Goal: under 15 s on a 2-core machine. replays: how many times the log was replayed.
import { join } from 'node:path';
import { tuneLog } from '../../estimator/io/log/tuneLog.js';
import { repoRoot } from './paths.js';
import type { BenchSection } from './sections.js';

const BENCH_TERMS = ['pixelNoise', 'sizeNoiseFraction', 'odometryNoise', 'carrierAccelNoise'] as const;
const round = (v: number) => Number(v.toPrecision(4));

export const tuneBench: BenchSection = {
  name: 'tune',
  async run() {
    const started = performance.now();
    const cpu = process.cpuUsage();
    const result = await tuneLog(join(repoRoot(), 'data-demo', 'logs', 'harbour-boat'), { free: [...BENCH_TERMS] });
    const seconds = (performance.now() - started) / 1000;
    const used = process.cpuUsage(cpu);
    return {
      logSeconds: round(seconds),
      logCpuSeconds: round((used.user + used.system) / 1e6),
      replays: result.identification.evaluations + 2,
      terms: result.identification.terms.length,
    };
  },
};
