import { describe, expect, it } from 'vitest';
import { consistencyWords, ensembleConsistency } from '../../../estimator/study/statistics/ensembleConsistency.js';
import type { PointSummary } from '../../../estimator/study/summarize.js';
import type { SweepOutput } from '../../../notebooks/jobs/sweepJob.js';
import { descentNeesFigure } from '../../../notebooks/studies/descentFigure.js';
import type { FigureOutput } from '../../../notebooks/studies/Study.js';

const built = descentNeesFigure((p) => `${p.point.x} px`);
const figure = { compute: built.compute as unknown as (state: unknown, impairment: string) => FigureOutput };
const state = (summaries: PointSummary[]) => ({ done: 1, total: 1, value: { summaries } as unknown as SweepOutput, final: true, cancelled: false, error: null });

describe('descentNeesFigure', () => {
  it('draws each point per height bin and states its verdict in the shared words', () => {
    // Six trials per bin near the dimension (6) and one bin far above it.
    const good = ensembleConsistency([{ label: '0-1 m', values: [5.8, 6.1, 6.4, 5.5, 6.2, 6.0] }, { label: '1-2 m', values: [6.3, 5.9, 6.1, 5.7, 6.6, 5.8] }], 6);
    const bad = ensembleConsistency([{ label: '0-1 m', values: [30, 28, 35, 31, 29, 33] }, { label: '1-2 m', values: [6.3, 5.9, 6.1, 5.7, 6.6, 5.8] }], 6);
    const out = figure.compute(state([{ point: { x: 1 }, descentNees: good } as unknown as PointSummary, { point: { x: 8 }, descentNees: bad } as unknown as PointSummary]), 'pixelNoise') as FigureOutput;
    expect(out.numbers.map((n) => n.text)).toEqual([consistencyWords('consistent'), consistencyWords('over-confident')]);
    expect(out.numbers[1]!.label).toBe('8 px: 50 % of bins inside');
    expect(out.csv!.trim().split('\n')).toHaveLength(1 + 4);
    expect(out.markup).toContain('<svg');
  });

  it('says so when the results carry no per-height NEES', () => {
    const out = figure.compute(state([{ point: { x: 1 } } as unknown as PointSummary]), 'pixelNoise') as FigureOutput;
    expect(out.markup).toBe('<p>These results carry no NEES per height of the descent.</p>');
  });
});
