// The landing study's NIS over time: every camera update's NIS = y' S^-1 y against the 95 %
// two-sided chi-square band of a single update, [q(0.025, m), q(0.975, m)] with m the update's
// dimension, and the gate threshold q(gateProbability, m) * gateScale above which the filter
// refused the box. For an honest filter about 95 % of the NIS values fall inside the band.
import { gateThreshold } from '../../estimator/filter/gate.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { chiSquareQuantile } from '../../estimator/stats/chiSquare.js';
import { ESTIMATE, MUTED, SERIES, TRUTH } from '../figures/palette.js';
import { extent, plotSvg, type Layer } from '../figures/plot.js';
import { formatNumber } from '../figures/svg.js';
import type { JobState } from '../jobs/JobState.js';
import type { LandingOutput } from '../jobs/landingJob.js';
import { fromState, keyNumber, toCsv, WIDE } from './figureOutput.js';
import type { StudyFigure } from './Study.js';

/** Two-sided level of the per-update band. */
export const NIS_BAND_LEVEL = 0.95;

export interface NisBandCount {
  /** Band [low, high] for one update of dimension dim at NIS_BAND_LEVEL. */
  low: number;
  high: number;
  /** Updates with a NIS (accepted or gated), and how many of them lie inside the band (inclusive). */
  total: number;
  inside: number;
}

/** Count the updates whose NIS lies inside the single-update chi-square band. */
export function nisBandCount(updates: LandingOutput['updates'], dim: number): NisBandCount {
  const low = chiSquareQuantile((1 - NIS_BAND_LEVEL) / 2, dim);
  const high = chiSquareQuantile((1 + NIS_BAND_LEVEL) / 2, dim);
  let total = 0, inside = 0;
  for (const u of updates) {
    if (!Number.isFinite(u.nis)) continue;
    total++;
    if (u.nis >= low && u.nis <= high) inside++;
  }
  return { low, high, total, inside };
}

const percent = (v: number | null) => (v === null ? '–' : `${formatNumber(100 * v)} %`);

export const nisFigure: StudyFigure = {
  name: 'nis',
  title: 'NIS of every camera update',
  caption: 'NIS of each box update over time (log scale) against the band holding 95 % of single χ² values for its dimension; boxes above the gate line were refused (gated), not used.',
  wide: true,
  inputs: ['run', 'flown'],
  compute: (state: JobState<LandingOutput>, flown: Scenario) =>
    fromState(state, 'trial', (v) => {
      const dim = v.updates.find((u) => u.dim > 0)?.dim ?? v.result.nisDim;
      const band = nisBandCount(v.updates, dim);
      const gate = gateThreshold(flown.filter.gateProbability, dim, flown.filter.gateScale);
      const accepted = v.updates.filter((u) => u.status === 'accepted' && Number.isFinite(u.nis));
      const gated = v.updates.filter((u) => u.status === 'gated' && Number.isFinite(u.nis));
      const values = [...accepted, ...gated].map((u) => u.nis).filter((n) => n > 0);
      const lowest = Math.min(band.low / 3, ...values.map((n) => n / 1.5));
      const top = Math.max(gate * 2, ...values.map((n) => n * 1.5));
      const time = extent(v.t, 0);
      const share = band.total > 0 ? band.inside / band.total : null;
      const layers: Layer[] = [
        { kind: 'band', x: time, low: [band.low, band.low], high: [band.high, band.high], color: TRUTH, label: `χ² ${formatNumber(100 * NIS_BAND_LEVEL)} % band (dim ${dim})` },
        { kind: 'rule', axis: 'y', value: dim, color: MUTED, dash: 2, label: `expected value ${dim}` },
        { kind: 'rule', axis: 'y', value: gate, color: SERIES[3], dash: 1, label: `gate ${formatNumber(gate)}` },
        { kind: 'points', x: accepted.map((u) => u.t), y: accepted.map((u) => u.nis), color: ESTIMATE, radius: 2.4, label: `accepted (${accepted.length})` },
        { kind: 'points', x: gated.map((u) => u.t), y: gated.map((u) => u.nis), color: SERIES[7], shape: 'square', radius: 3, label: `gated (${gated.length})` },
      ];
      return {
        markup: plotSvg({
          title: 'NIS of every camera update',
          ...WIDE,
          x: { label: 'time (s)', domain: time },
          y: { label: 'NIS (dimensionless)', domain: [Math.max(lowest, 1e-4), top], log: true, ticks: 4 },
          layers,
        }),
        csv: toCsv(['t', 'status', 'nis', 'dim', 'bandLow', 'bandHigh', 'gate'], v.updates.map((u) => [u.t, u.status, Number.isFinite(u.nis) ? u.nis : null, u.dim, band.low, band.high, gate])),
        numbers: [
          keyNumber('nisInBand', 'NIS inside the 95 % band', share, percent(share)),
          keyNumber('nisUpdates', 'updates with a NIS', band.total, String(band.total)),
          keyNumber('gated', 'gated', gated.length, String(gated.length)),
        ],
      };
    }),
};
