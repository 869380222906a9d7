// Bench section `import`: `alight ingest` speed and memory on a generated ROS 2 recording of
// about 1 GB (test/io/ros/syntheticRecording.ts: 200 Hz IMU, 30 Hz camera info and detections,
// 20 Hz odometry, 100 Hz motion capture of lander and carrier; uncompressed chunks). The
// recording is written once into a temporary folder (about a minute) and deleted afterwards.
// mbPerSec: recording bytes / wall time of the conversion in a fresh child process (start-up
//   included), as `alight ingest` runs it (two threads); cpuSeconds: its CPU time (both threads),
//   which other load on the machine inflates less.
// peakMB: the child's peak resident memory (getrusage maxRSS): the conversion streams, so it
//   must not grow with the recording; peakMBSmall gives the same child on a 60 s recording.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ingestRosRecordingToFolder } from '../../estimator/io/ros/ingestRosRecording.node.js';
import { parseRosMap } from '../../estimator/io/ros/parseRosMap.js';
import { writeSyntheticRecording } from '../io/ros/syntheticRecording.js';
import { repoRoot, rerunArgs } from './paths.js';
import type { BenchSection } from './sections.js';

export const IMPORT_CHILD_FLAG = '--import-bench-child';
/** About 0.27 MB of recording per second of flight: 3,700 s make ~1 GB. */
const BIG_SECONDS = 3_700;
const round = (v: number) => Number(v.toPrecision(4));

interface ChildResult {
  seconds: number;
  cpuSeconds: number;
  bytes: number;
  rows: number;
  threads: number;
  maxRssKB: number;
}

function importInChild(recording: string, out: string): ChildResult {
  const child = spawnSync(process.execPath, [...rerunArgs(import.meta.url), IMPORT_CHILD_FLAG, recording, out], { encoding: 'utf8', maxBuffer: 1 << 20 });
  if (child.status !== 0) throw new Error(`import bench child failed (${child.status}): ${child.stderr}`);
  return JSON.parse(child.stdout.trim().split('\n').at(-1)!) as ChildResult;
}

// Child mode: convert the recording given after the flag with the demo map, print figures as JSON.
const childAt = process.argv.indexOf(IMPORT_CHILD_FLAG);
if (childAt >= 0) {
  const started = performance.now();
  const cpu = process.cpuUsage();
  const mapPath = join(repoRoot(), 'data-demo', 'ros', 'flight.map.json');
  const report = await ingestRosRecordingToFolder(process.argv[childAt + 1]!, parseRosMap(readFileSync(mapPath, 'utf8'), mapPath), process.argv[childAt + 2]!);
  const used = process.cpuUsage(cpu);
  const rows = Object.values(report.files).reduce((a, n) => a + n, 0);
  const result: ChildResult = { threads: report.threads, seconds: (performance.now() - started) / 1000, cpuSeconds: (used.user + used.system) / 1e6, bytes: report.bytes, rows, maxRssKB: process.resourceUsage().maxRSS };
  process.stdout.write(JSON.stringify(result) + '\n');
}

export const importBench: BenchSection = {
  name: 'import',
  async run() {
    const dir = mkdtempSync(join(tmpdir(), 'alight-bench-import-'));
    try {
      const small = join(dir, 'small.mcap');
      await writeSyntheticRecording(small, { duration: 60 });
      const smallRun = importInChild(small, join(dir, 'small-log'));
      rmSync(join(dir, 'small-log'), { recursive: true, force: true });

      const big = join(dir, 'big.mcap');
      const generating = performance.now();
      await writeSyntheticRecording(big, { duration: BIG_SECONDS });
      const generateSeconds = (performance.now() - generating) / 1000;
      const measured = importInChild(big, join(dir, 'big-log'));
      return {
        mbPerSec: round(measured.bytes / 1e6 / measured.seconds),
        peakMB: round(measured.maxRssKB / 1024),
        recordingMB: round(measured.bytes / 1e6),
        seconds: round(measured.seconds),
        cpuSeconds: round(measured.cpuSeconds),
        mbPerCpuSec: round(measured.bytes / 1e6 / measured.cpuSeconds),
        rows: measured.rows,
        threads: measured.threads,
        peakMBSmall: round(smallRun.maxRssKB / 1024),
        smallRecordingMB: round(smallRun.bytes / 1e6),
        generateSeconds: round(generateSeconds),
      };
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};
