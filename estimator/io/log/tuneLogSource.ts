// Tune the filter's Q, R and gate multipliers (filter.qScale, rScale, gateScale) on a flight
// log: every setting replays the whole log; STUDY's searchMultipliers (log-spaced grid, then
// Nelder–Mead) picks the best. Without truth the score is consistency from innovations alone
// (NIS near its dimension and white innovations); with truth it is NEES near its dimension.
// Browser-safe (any LogSource whose streams can be opened again for every replay).
import type { FilterSpec } from '../../sim/Scenario.js';
import { searchMultipliers, type Multipliers, type SearchOptions, type SurfaceSample } from '../../study/search.js';
import type { LogSource } from './LogSource.js';
import { SAFETY_CAUTION } from '../../safetyCaution.js';
import { replayFilterSpec, replayLog, type ReplayReport, type ReplaySettings } from './replayLog.js';

export type TuneCriterion = 'nis' | 'nees';

export interface TuneLogOptions extends Pick<SearchOptions, 'q' | 'r' | 'gate' | 'grid' | 'refine' | 'onSample'> {
  /** Settings over the log's filter.json, as for replay (qScale/rScale/gateScale are searched). */
  filter?: ReplaySettings['filter'];
  filterSource?: string;
  filterLines?: ReplaySettings['filterLines'];
  /** 'nees' needs truth.csv; default: 'nees' when the log has truth, else 'nis'. */
  criterion?: TuneCriterion;
  /** Whiteness lags (default 20). */
  lags?: number;
}

/** One evaluated setting with what its replay showed. */
export interface TuneSample extends SurfaceSample {
  nisMean: number | null;
  neesMean: number | null;
  white: boolean | null;
  gateRejections: number;
  divergence: string | null;
}

export interface TuneLogResult {
  criterion: TuneCriterion;
  /** Put these in the filter settings (absolute values of filter.qScale, rScale, gateScale). */
  recommended: { qScale: number; rScale: number; gateScale: number };
  cost: number;
  /** Cost and replay of the log's own settings, for comparison. */
  baseline: { cost: number; report: ReplayReport };
  best: ReplayReport;
  surface: TuneSample[];
  caution: string;
}

/** Weights of the cost terms (see tuneCost). */
const WHITENESS_WEIGHT = 0.5;
const GATING_WEIGHT = 2;
/** Cost of a replay with nothing to judge (no accepted update, no truth row) or a diverged one. */
const NOTHING_TO_JUDGE = 4;

/**
 * Cost of one replay, lower is better:
 *   nis:  mean over box/odometry updates of |ln(NIS mean / dim)|
 *         + 0.5 · mean over whiteness tests of ln(max(1, Q / threshold))
 *         + 2 · (gated / (accepted + gated))
 *   nees: |ln(NEES mean / dim)| + 2 · (gated / (accepted + gated))
 * A consistent filter has NIS ≈ dim and NEES ≈ dim (Bar-Shalom, Li, Kirubarajan 2001, 5.4); the
 * log makes "twice too large" and "half too small" equally bad, as in the simulation tuner.
 * The gating term keeps a tight gate from buying a good NIS by refusing measurements; a
 * divergence adds 4 (as much as NIS off by a factor e^4).
 */
export function tuneCost(report: ReplayReport, criterion: TuneCriterion): number {
  const kinds = [report.boxes, report.odometry];
  const accepted = kinds.reduce((a, k) => a + k.count, 0);
  const gated = kinds.reduce((a, k) => a + k.gated, 0);
  const gating = accepted + gated > 0 ? GATING_WEIGHT * (gated / (accepted + gated)) : 0;
  const divergence = report.divergence ? NOTHING_TO_JUDGE : 0;
  if (criterion === 'nees') {
    if (report.neesMean === null || !(report.neesMean > 0)) return NOTHING_TO_JUDGE + gating + divergence;
    return Math.abs(Math.log(report.neesMean / report.neesDim)) + gating + divergence;
  }
  const judged = kinds.filter((k) => k.count > 0 && k.mean !== null && k.mean > 0);
  if (judged.length === 0) return NOTHING_TO_JUDGE + gating + divergence;
  const consistency = judged.reduce((a, k) => a + Math.abs(Math.log(k.mean! / k.dim)), 0) / judged.length;
  const tests = report.whiteness.tests;
  const whiteness = tests.length > 0 ? tests.reduce((a, t) => a + Math.log(Math.max(1, t.ljungBox / t.threshold)), 0) / tests.length : 0;
  return consistency + WHITENESS_WEIGHT * whiteness + gating + divergence;
}

export async function tuneLogSource(source: LogSource, options: TuneLogOptions = {}): Promise<TuneLogResult> {
  const base: ReplaySettings = { filter: options.filter, filterSource: options.filterSource, filterLines: options.filterLines, lags: options.lags };
  const spec: FilterSpec = replayFilterSpec(source, base);
  const replayWith = (m: Multipliers) => replayLog(source, { ...base, filter: { ...spec, qScale: m.q, rScale: m.r, gateScale: m.gate }, filterSource: 'tuning' });
  const baselineReport = await replayWith({ q: spec.qScale, r: spec.rScale, gate: spec.gateScale });
  const hasTruth = baselineReport.rows.truth !== undefined;
  const criterion: TuneCriterion = options.criterion ?? (hasTruth ? 'nees' : 'nis');
  if (criterion === 'nees' && !hasTruth) throw new RangeError('tuning by NEES needs truth.csv in the log; use the NIS criterion');
  const reports = new Map<string, ReplayReport>();
  const result = await searchMultipliers(
    async (m) => {
      const report = await replayWith(m);
      reports.set(`${m.q},${m.r},${m.gate}`, report);
      return tuneCost(report, criterion);
    },
    { q: options.q, r: options.r, gate: options.gate, grid: options.grid, refine: options.refine, onSample: options.onSample },
  );
  const surface: TuneSample[] = result.surface.map((s) => {
    const r = reports.get(`${s.q},${s.r},${s.gate}`)!;
    return { ...s, nisMean: r.nisMean, neesMean: r.neesMean, white: r.whiteness.white, gateRejections: r.gateRejections, divergence: r.divergence };
  });
  return {
    criterion,
    recommended: { qScale: result.best.q, rScale: result.best.r, gateScale: result.best.gate },
    cost: result.best.score,
    baseline: { cost: tuneCost(baselineReport, criterion), report: baselineReport },
    best: reports.get(`${result.best.q},${result.best.r},${result.best.gate}`)!,
    surface,
    caution: SAFETY_CAUTION,
  };
}
