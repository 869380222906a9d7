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
}

export interface SweepOutput {
  header: SweepHeader;
  summaries: PointSummary[];
  records: SweepRecord[];
  /** The JSON Lines results file (header + records in canonical order). */
  resultsText: string;
}

export function sweepHeaderFor(input: SweepInput): SweepHeader {
  const points = designPoints(input.vary, 'grid', { seed: input.seed });
  return { v: 1, kind: RESULTS_KIND, tool: VERSION, seed: input.seed, trials: input.trials, design: 'grid', vary: input.vary, points, scenario: input.scenario };
}

export function sweepJob(input: SweepInput, progress: Progress<SweepOutput>): SweepOutput {
  const header = sweepHeaderFor(input);
  const total = header.points.length * input.trials;
  const items = new Int32Array(2 * total);
  for (let p = 0, k = 0; p < header.points.length; p++) {
    for (let t = 0; t < input.trials; t++, k++) {
      items[2 * k] = p;
      items[2 * k + 1] = t;
    }
  }
  const job: TrialJob = { scenario: input.scenario, seed: input.seed, points: header.points, items };
  const lines: { record: SweepRecord; text: string }[] = [];
  const cache = new Map<number, Scenario>();
  const output = (): SweepOutput => {
    const records = lines.map((l) => l.record);
    return { header, summaries: summarize(header, records, input.by), records, resultsText: canonicalText(header, lines) };
  };
  progress(0, total, null);
  for (let i = 0; i < total; i++) {
    runItems(job, i, i + 1, simulateTrial, applyParams, cache, (text) => lines.push({ record: JSON.parse(text) as SweepRecord, text }));
    progress(i + 1, total, output);
  }
  return output();
}
