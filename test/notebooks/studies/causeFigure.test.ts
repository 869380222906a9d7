// The cause table of a sweep, and its promise: the link of a cause's representative trial opens
// the landing study on exactly the trial the sweep flew (same outcome, cause and miss).
import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { setPaths } from '../../../estimator/io/scenarioPath.js';
import { parseAnalysis } from '../../../notebooks/analysis/parseAnalysis.js';
import { analysisTextFromFragment } from '../../../notebooks/analysis/permalink.js';
import type { JobState } from '../../../notebooks/jobs/JobState.js';
import { landingJob } from '../../../notebooks/jobs/landingJob.js';
import { sweepJob, type SweepOutput } from '../../../notebooks/jobs/sweepJob.js';
import { causeTable } from '../../../notebooks/studies/causeFigure.js';
import { studyById } from '../../../notebooks/studies/studies.js';
import { testCardStudy } from '../../../notebooks/studies/testCardStudy.js';

// 3 s without the carrier mid-descent, 20 s flights: most trials abort and cannot land again in time
const scenario = setPaths(defaultScenario(), { duration: 20, 'detector.script': [{ kind: 'dropout', time: 7, duration: 3 }] });
const sweep = sweepJob({ scenario, seed: 4, trials: 6, vary: [{ path: 'detector.latency', values: [0.05, 0.15] }] }, () => {});

describe('causeTable', () => {
  const drawn = causeTable(sweep, 'detector.latency');

  it('lists the failures of each point by cause with their Wilson interval', () => {
    const failed = sweep.records.filter((r) => r.outcome !== 'landed').length;
    expect(failed).toBeGreaterThan(0);
    expect(drawn.numbers!.find((n) => n.key === 'failedTrials')!.value).toBe(failed);
    expect(drawn.markup).toContain('<td>dropout-burst</td>');
    expect(drawn.csv!.split('\n')[0]).toBe('detector.latency,cause,count,trials,wilsonLow,wilsonHigh,seed,point,trial');
  });

  it('links each cause to its representative trial, which the landing study replays exactly', () => {
    const href = /href="(#analysis=[^"]+)"/.exec(drawn.markup)![1]!;
    const analysis = parseAnalysis(analysisTextFromFragment(href)!, 'link', (id) => studyById(id).parameters);
    expect(analysis.study).toBe('landing');
    const { trial, point } = analysis.parameters as { trial: number; point: number };
    const record = sweep.records.find((r) => r.point === point && r.trial === trial)!;
    expect(record.outcome).not.toBe('landed');
    const replay = landingJob({ scenario: analysis.scenario, seed: analysis.seed, trial, point, every: 1 }, () => {});
    expect(replay.result.outcome).toBe(record.outcome);
    expect(replay.result.cause).toBe(record.cause);
    expect(replay.result.touchdownTime).toBe(record.touchdownTime);
    expect(replay.result.positionRmse).toBe(record.positionRmse); // bit-identical: same streams, same scenario
  });
});

describe('testCardStudy card figure', () => {
  const state: JobState<SweepOutput> = { done: 12, total: 12, value: sweep, final: true, cancelled: false, error: null };
  const card = testCardStudy.figures.find((f) => f.name === 'card')!.compute as unknown as (...inputs: unknown[]) => unknown;

  it('shows the card with the caution first and offers it as one printable page', () => {
    const out = card(state, 'latency', 0.15, 0.5, 0.95) as { markup: string; attachment: { text: string } };
    expect(out.markup.startsWith('<p class="caution"')).toBe(true);
    expect(out.attachment.text).toMatch(/^<!doctype html>/);
  });

  it('says in words when no swept point lies inside the claim', () => {
    const out = card(state, 'latency', 0.01, 0.9, 0.95) as { markup: string; failure?: string };
    expect(out.markup).toMatch(/no sweep point lies inside the claim/);
  });
});
