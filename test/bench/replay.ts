// Bench section `replay`: flight-log replay speed and memory.
// seconds: replay of a generated 10-minute log (200 Hz IMU and attitude, 30 Hz boxes, 20 Hz
//   odometry, truth at 200 Hz), the first replay in this process (JIT warm-up included);
//   cpuSeconds: its CPU time (user + system), which other load on the machine inflates less;
//   secondsWithoutTruth: the same log without truth.csv (a flight with no reference).
// peakMB: peak resident memory (getrusage maxRSS) of a child process replaying a generated
//   ~1 GB log: the streams are merged row by row, so memory must not grow with the log. The
//   child runs with a 64 MB JavaScript heap limit (a leak growing with the log would die) and
//   the same child on the 10-minute log gives peakMBTenMinutes to compare with.
//   Writing and replaying that log takes a few minutes; `--only=replay` runs this section alone.
// The logs are synthetic (test/io/log/syntheticLog.ts) and deleted afterwards.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { logSourceFromFolder } from '../../estimator/io/log/logSourceFromFolder.node.js';
import { replayLog } from '../../estimator/io/log/replayLog.js';
import { writeSyntheticLog } from '../io/log/syntheticLog.js';
import { rerunArgs } from './paths.js';
import type { BenchSection } from './sections.js';

export const CHILD_FLAG = '--replay-bench-child';
/** About 33.5 kB of log per simulated second: 30,000 s make ~1 GB. */
const BIG_LOG_SECONDS = 30_000;
const round = (v: number) => Number(v.toPrecision(4));
/** JavaScript heap limit of the replay child (MB). */
const HEAP_LIMIT_MB = 64;

interface ChildResult {
  seconds: number;
  rows: number;
  steps: number;
  maxRssKB: number;
}

function replayInChild(folder: string): ChildResult {
  const child = spawnSync(process.execPath, [`--max-old-space-size=${HEAP_LIMIT_MB}`, ...rerunArgs(import.meta.url), CHILD_FLAG, folder], { encoding: 'utf8', maxBuffer: 1 << 20 });
  if (child.status !== 0) throw new Error(`replay bench child failed (${child.status}): ${child.stderr}`);
  return JSON.parse(child.stdout.trim().split('\n').at(-1)!) as ChildResult;
}

async function timedReplay(folder: string) {
  const started = performance.now();
  const cpu = process.cpuUsage();
  const report = await replayLog(logSourceFromFolder(folder));
  const seconds = (performance.now() - started) / 1000;
  const used = process.cpuUsage(cpu);
  const rows = Object.values(report.rows).reduce((a, r) => a + r.read, 0);
  return { seconds, cpuSeconds: (used.user + used.system) / 1e6, rows, steps: report.filterSteps, nisMean: report.nisMean };
}

// Child mode: replay the folder given after the flag, print seconds and maxRSS as JSON.
const childAt = process.argv.indexOf(CHILD_FLAG);
if (childAt >= 0) {
  const result = await timedReplay(process.argv[childAt + 1]!);
  process.stdout.write(JSON.stringify({ ...result, maxRssKB: process.resourceUsage().maxRSS }) + '\n');
}

export const replayBench: BenchSection = {
  name: 'replay',
  async run() {
    const dir = mkdtempSync(join(tmpdir(), 'alight-bench-replay-'));
    try {
      const tenMinutes = join(dir, 'ten-minutes');
      const logBytes = writeSyntheticLog(tenMinutes, { duration: 600, imuRate: 200, boxRate: 30, odometryRate: 20, seed: 1 });
      const small = await timedReplay(tenMinutes);
      const smallChild = replayInChild(tenMinutes);
      rmSync(join(tenMinutes, 'truth.csv'));
      const blind = await timedReplay(tenMinutes);
      rmSync(tenMinutes, { recursive: true, force: true });

      const big = join(dir, 'big');
      const bigBytes = writeSyntheticLog(big, { duration: BIG_LOG_SECONDS, imuRate: 200, boxRate: 30, odometryRate: 20, seed: 2 });
      const measured = replayInChild(big);
      return {
        seconds: round(small.seconds),
        cpuSeconds: round(small.cpuSeconds),
        secondsWithoutTruth: round(blind.seconds),
        logMB: round(logBytes / 1e6),
        rows: small.rows,
        filterSteps: small.steps,
        rowsPerSecond: round(small.rows / small.seconds),
        peakMB: round(measured.maxRssKB / 1024),
        peakMBTenMinutes: round(smallChild.maxRssKB / 1024),
        heapLimitMB: HEAP_LIMIT_MB,
        bigLogMB: round(bigBytes / 1e6),
        bigRows: measured.rows,
        bigSeconds: round(measured.seconds),
      };
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};
