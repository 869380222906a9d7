// Job: a grid sweep, trial by trial, through the study library's own trial runner, point
// application, record format and summaries. Its results text is byte for byte the file
// `alight sweep` writes for the same scenario, vary, trials and seed, so `alight summarize`
// on it shows the numbers the page shows.
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { canonicalText, RESULTS_KIND, type SweepHeader, type SweepRecord } from '../../estimator/study/resultsFile.js';
import { simulateTrial } from '../../estimator/study/simulateTrial.js';
import { summarize, type PointSummary } from '../../estimator/study/summarize.js';
import { designPoints, type VarySpec } from '../../estimator/study/sweepDesign.js';
import { runItems, type TrialJob } from '../../estimator/study/trialExecutor.js';
import { VERSION } from '../../estimator/version.js';
import type { Progress } from './JobState.js';

export interface SweepInput {
  scenario: Scenario;
  seed: number;
  vary: VarySpec[];
  trials: number;
  /** Summaries pooled by one varied path (summarize --by); omit for one summary per point. */
  by?: string;
  /** Run only every `count`-th trial starting at `index` (the page splits a sweep over its cores). */
  part?: { index: number; count: number };
}

export interface SweepOutput {
  header: SweepHeader;
  summaries: PointSummary[];
  records: SweepRecord[];
  /** The JSON Lines results file (header + records in canonical order). */
  resultsText: string;
  /** Each record's line as the results file holds it, in the order of `records`. */
  lines: string[];
}

/** Records in canonical order (point, then trial), so every sum runs in one order whatever split ran them. */
export function sweepOutput(input: SweepInput, header: SweepHeader, found: readonly { record: SweepRecord; text: string }[]): SweepOutput {
  const sorted = found.slice().sort((a, b) => a.record.point - b.record.point || a.record.trial - b.record.trial);
  const records = sorted.map((l) => l.record);
  return { header, summaries: summarize(header, records, input.by), records, resultsText: canonicalText(header, sorted), lines: sorted.map((l) => l.text) };
}

export function sweepHeaderFor(input: SweepInput): SweepHeader {
  const points = designPoints(input.vary, 'grid', { seed: input.seed });
  return { v: 1, kind: RESULTS_KIND, tool: VERSION, seed: input.seed, trials: input.trials, design: 'grid', vary: input.vary, points, scenario: input.scenario };
}

/** Trials a sweep (or one part of it) will run. */
export function plannedTrials(input: SweepInput): number {
  const { index, count } = input.part ?? { index: 0, count: 1 };
  const all = sweepHeaderFor(input).points.length * input.trials;
  return Math.max(0, Math.ceil((all - index) / count));
}

export function sweepJob(input: SweepInput, progress: Progress<SweepOutput>): SweepOutput {
  const header = sweepHeaderFor(input);
  const { index, count } = input.part ?? { index: 0, count: 1 };
  // Trial-major order: partial results cover every point evenly, and the parts of a split share
  // the work item by item. The order changes nothing: a trial's streams depend on (seed, point, trial).
  const all = header.points.length * input.trials;
  const total = plannedTrials(input);
  const items = new Int32Array(2 * total);
  for (let k = index, j = 0; k < all; k += count, j++) {
    items[2 * j] = k % header.points.length;
    items[2 * j + 1] = Math.floor(k / header.points.length);
  }
  const job: TrialJob = { scenario: input.scenario, seed: input.seed, points: header.points, items };
  const lines: { record: SweepRecord; text: string }[] = [];
  const cache = new Map<number, Scenario>();
  const output = (): SweepOutput => sweepOutput(input, header, lines);
  progress(0, total, null);
  for (let i = 0; i < total; i++) {
    runItems(job, i, i + 1, simulateTrial, applyParams, cache, (text) => lines.push({ record: JSON.parse(text) as SweepRecord, text }));
    progress(i + 1, total, output);
  }
  return output();
}

/** A sweep's input split into `count` interleaved parts (fewer when it has fewer trials). */
export function splitSweep(input: SweepInput, count: number): SweepInput[] {
  const all = sweepHeaderFor(input).points.length * input.trials;
  const n = Math.max(1, Math.min(count, all));
  return Array.from({ length: n }, (_, index) => ({ ...input, part: { index, count: n } }));
}

/** The parts' outputs so far as one sweep's output: the same records, summaries and file an unsplit run gives. */
export function mergeSweepParts(input: SweepInput, parts: readonly (SweepOutput | null)[]): SweepOutput {
  const found: { record: SweepRecord; text: string }[] = [];
  for (const p of parts) if (p) p.records.forEach((record, k) => found.push({ record, text: p.lines[k]! }));
  return sweepOutput(input, sweepHeaderFor(input), found);
}
