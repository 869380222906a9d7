// Job: replay a flight log through the landing filter with REPLAY's replayLog, keeping the
// estimate of the relative position and its 1-sigma every `every` seconds for the figures.
// The log is a demo log by name (the page fetches it from the server, the report reads the
// folder) or files dropped on the page.
import type { FilterSpec } from '../../estimator/sim/Scenario.js';
import { logSourceFromFiles, type LogFile, type LogSource } from '../../estimator/io/log/LogSource.js';
import { replayLog, type ReplayReport } from '../../estimator/io/log/replayLog.js';
import { STREAM_SPECS, LOG_STREAMS } from '../../estimator/io/log/logStreams.js';
import type { JobContext } from './jobTable.js';
import type { Progress } from './JobState.js';

/** Problem rows the page keeps in full (all are counted); the page table shows the first 200, its CSV all kept. */
export const PROBLEMS_KEPT = 10_000;

export type LogChoice = { kind: 'demo'; name: string } | { kind: 'files'; files: ReadonlyMap<string, LogFile>; name: string };

export interface ReplayInput {
  log: LogChoice;
  filter: Partial<FilterSpec>;
  /** Spacing of the kept estimate samples (s). */
  every: number;
}

export interface ReplayOutput {
  report: ReplayReport;
  /** Kept samples: time, r (3) and its 1-sigma (3), columns of equal length. */
  t: number[];
  r: [number[], number[], number[]];
  sigma: [number[], number[], number[]];
}

export const LOG_FILES = ['camera.json', 'filter.json', ...LOG_STREAMS.map((s) => STREAM_SPECS[s].file)];

/** Browser: fetch a demo log's files from the notebook server (absent files are skipped). */
async function fetchDemoLog(name: string): Promise<LogSource> {
  const files = new Map<string, LogFile>();
  for (const file of LOG_FILES) {
    const response = await fetch(`/data-demo/${name.split('/').map(encodeURIComponent).join('/')}/${file}`);
    if (response.ok) files.set(file, await response.blob());
  }
  if (files.size === 0) throw new Error(`demo log "${name}" is not on the server`);
  return logSourceFromFiles(files, name);
}

export async function replayJob(input: ReplayInput, progress: Progress<ReplayOutput>, context: JobContext): Promise<ReplayOutput> {
  let source: LogSource;
  if (input.log.kind === 'files') source = await logSourceFromFiles(input.log.files, input.log.name);
  else if (context.openLogFolder) source = context.openLogFolder(input.log.name) as LogSource;
  else source = await fetchDemoLog(input.log.name);
  const t: number[] = [];
  const r: [number[], number[], number[]] = [[], [], []];
  const sigma: [number[], number[], number[]] = [[], [], []];
  let next = -Infinity;
  progress(0, 1, null);
  const report = await replayLog(source, {
    filter: input.filter,
    filterSource: 'study controls',
    // Every problem row in full, up to a bound that keeps a wrecked log's report small enough to post.
    keepProblems: PROBLEMS_KEPT,
    onEstimate: (time, x, P, n) => {
      if (time < next) return;
      next = time + input.every;
      t.push(time);
      for (let i = 0; i < 3; i++) {
        r[i]!.push(x[i]!);
        sigma[i]!.push(Math.sqrt(P[i * n + i]!));
      }
    },
  });
  progress(1, 1, null);
  return { report, t, r, sigma };
}
