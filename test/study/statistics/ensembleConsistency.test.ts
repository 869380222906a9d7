import { describe, expect, it } from 'vitest';
import { consistencyWords, ensembleConsistency, type BinSamples } from '../../../estimator/study/statistics/ensembleConsistency.js';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { expectClose } from '../../helpers/expectClose.js';

/** Per-trial bin means of `samples` chi-square(dim) draws scaled by `scale` (a sound filter: scale 1). */
function chiSquareBins(bins: number, runs: number, dim: number, samples: number, scale: number, seed: number): BinSamples[] {
  const rng = RandomStream.fromKey([seed, 7]);
  const out: BinSamples[] = [];
  for (let b = 0; b < bins; b++) {
    const values: number[] = [];
    for (let r = 0; r < runs; r++) {
      let sum = 0;
      for (let s = 0; s < samples; s++) for (let d = 0; d < dim; d++) sum += rng.gaussian() ** 2;
      values.push((scale * sum) / samples);
    }
    out.push({ label: `bin ${b}`, values });
  }
  return out;
}

describe('ensembleConsistency(bins, dim)', () => {
  it('ensembleConsistency with one bin of 50 runs, n = 2, tests against about [1.48, 2.59]', () => {
    // Bar-Shalom, Li, Kirubarajan 2001, "Estimation with Applications to Tracking and
    // Navigation", section 5.4: N = 50, n = 2 -> about [1.5, 2.6] as the book rounds it [memory];
    // tolerance 0.01 covers that rounding.
    const values = Array.from({ length: 50 }, (_, i) => 1.6 + (i % 10) * 0.1); // mean 2.05, none an outlier
    const e = ensembleConsistency([{ label: 'all', values }], 2);
    expectClose(e.bins[0]!.low, 1.48, { abs: 0.01 }, 'low');
    expectClose(e.bins[0]!.high, 2.59, { abs: 0.01 }, 'high');
    expectClose(e.bins[0]!.robustMean, 2.05, { abs: 1e-12 }, 'mean of constructed values');
    expect(e.bins[0]!.outliers).toBe(0);
    expect(e.verdict).toBe('consistent');
  });

  it('ensembleConsistency calls sound chi-square ensembles consistent, scaled ones over- and under-confident', () => {
    const sound = ensembleConsistency(chiSquareBins(10, 100, 6, 20, 1, 1), 6);
    expect(sound.verdict).toBe('consistent');
    expect(sound.insideShare).toBeGreaterThanOrEqual(0.9);
    expect(ensembleConsistency(chiSquareBins(10, 100, 6, 20, 1.5, 2), 6).verdict).toBe('over-confident');
    expect(ensembleConsistency(chiSquareBins(10, 100, 6, 20, 0.7, 3), 6).verdict).toBe('under-confident');
  });

  it('ensembleConsistency keeps its verdict when one trial of one bin is multiplied by 1000', () => {
    const bins = chiSquareBins(8, 100, 6, 20, 1, 4);
    const before = ensembleConsistency(bins, 6);
    const hit = bins.map((b) => ({ label: b.label, values: [...b.values] }));
    hit[3]!.values[17]! *= 1000;
    const after = ensembleConsistency(hit, 6);
    expect(after.verdict).toBe(before.verdict);
    expect(after.bins[3]!.verdict).toBe(before.bins[3]!.verdict);
    expect(after.bins[3]!.outliers).toBe(before.bins[3]!.outliers + 1);
    expect(after.bins[3]!.mean).toBeGreaterThan(10 * before.bins[3]!.mean); // the plain mean shows it
  });

  it('ensembleConsistency calls a bin over-confident when more than 5 % of its trials are outliers', () => {
    const bins = chiSquareBins(1, 100, 6, 20, 1, 5);
    const values = [...bins[0]!.values];
    for (let i = 0; i < 6; i++) values[i] = 1e4; // six diverged trials of 100: above the 5 tolerated
    const e = ensembleConsistency([{ label: 'low', values }], 6);
    expect(e.bins[0]!.outliers).toBe(6);
    expect(e.bins[0]!.verdict).toBe('over-confident');
    values[0] = Number.POSITIVE_INFINITY; // a diverged trial counts as an outlier, not an error
    expect(ensembleConsistency([{ label: 'low', values }], 6).bins[0]!.outliers).toBe(6);
  });

  it('ensembleConsistency is consistent with 9 of 10 bins inside and not with 8', () => {
    const bins = chiSquareBins(10, 100, 3, 20, 1, 6);
    const oneOff = bins.map((b, i) => ({ label: b.label, values: i === 0 ? b.values.map((v) => v * 2) : b.values }));
    const e1 = ensembleConsistency(oneOff, 3);
    expect(e1.bins[0]!.verdict).toBe('over-confident');
    expect(e1.insideShare).toBe(0.9);
    expect(e1.verdict).toBe('consistent');
    const twoOff = oneOff.map((b, i) => ({ label: b.label, values: i === 1 ? b.values.map((v) => v * 0.5) : b.values }));
    const e2 = ensembleConsistency(twoOff, 3);
    expect(e2.insideShare).toBe(0.8);
    expect(e2.verdict).toBe('over-confident'); // one over, one under: ties go to the unsafe side
  });

  it('ensembleConsistency reports the median beside the mean and skips empty bins', () => {
    const e = ensembleConsistency([{ label: 'a', values: [1, 2, 9] }, { label: 'b', values: [] }], 3);
    expect(e.bins).toHaveLength(1);
    expect(e.bins[0]!.median).toBe(2);
    expect(e.bins[0]!.mean).toBe(4);
  });

  it('ensembleConsistency refuses NaN, negative values, no data and a bad dimension', () => {
    expect(() => ensembleConsistency([{ label: 'a', values: [1, Number.NaN] }], 3)).toThrow(/bin "a" holds NaN/);
    expect(() => ensembleConsistency([{ label: 'a', values: [-1] }], 3)).toThrow(/non-negative/);
    expect(() => ensembleConsistency([{ label: 'a', values: [] }], 3)).toThrow(/no bin/);
    expect(() => ensembleConsistency([{ label: 'a', values: [1] }], 0)).toThrow(/dimension/);
  });

  it('consistencyWords gives one sentence per verdict', () => {
    expect(consistencyWords('consistent')).toMatch(/^consistent: /);
    expect(consistencyWords('over-confident')).toMatch(/larger than the filter believes/);
    expect(consistencyWords('under-confident')).toMatch(/smaller than the filter believes/);
  });
});
