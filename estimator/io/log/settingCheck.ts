// What one filter setting does on one or more logs, for comparing a recommendation with the
// current setting: per-sensor NIS with its chi-square interval and verdict, NEES verdict and
// RMSE against truth, the gated fraction, whiteness and the innovation likelihood.
import { neesVerdict, type Consistency } from '../../study/statistics/neesVerdict.js';
import type { ReplayReport } from './ReplayReport.js';

export interface StatisticCheck {
  mean: number;
  count: number;
  dim: number;
  /** 95 % acceptance interval of the mean for a consistent filter (Bar-Shalom, Li, Kirubarajan 2001, 5.4). */
  low: number;
  high: number;
  verdict: Consistency;
}

export interface SettingCheck {
  minus2LogL: number;
  boxes: StatisticCheck | null;
  odometry: StatisticCheck | null;
  /** With truth: NEES of relative position + velocity (dim 6; the bounds assume independent rows, a guide). */
  nees: StatisticCheck | null;
  positionRmse: number | null;
  velocityRmse: number | null;
  /** Gated updates / (accepted + gated), boxes and odometry together. */
  gatedFraction: number;
  /** Whiteness tests passed out of those with enough samples; white = all passed. */
  whitenessPassed: number;
  whitenessTests: number;
  white: boolean | null;
  divergences: number;
}

function check(sum: number, count: number, dim: number, level: number): StatisticCheck | null {
  if (count === 0) return null;
  const v = neesVerdict(sum / count, count, dim, level);
  return { mean: v.mean, count, dim, low: v.low, high: v.high, verdict: v.verdict };
}

/** The check of one setting over several replays (one per log): statistics pooled over every update or row. */
export function settingCheck(reports: readonly ReplayReport[], level = 0.95): SettingCheck {
  let boxSum = 0, boxCount = 0, odoSum = 0, odoCount = 0, neesSum = 0, neesCount = 0, gated = 0, judged = 0;
  let posSq = 0, velSq = 0, truthRows = 0, passed = 0, tests = 0, divergences = 0, d = 0;
  for (const r of reports) {
    d += r.likelihood.minus2LogL;
    if (r.boxes.mean !== null) (boxSum += r.boxes.mean * r.boxes.count), (boxCount += r.boxes.count);
    if (r.odometry.mean !== null) (odoSum += r.odometry.mean * r.odometry.count), (odoCount += r.odometry.count);
    gated += r.boxes.gated + r.odometry.gated;
    judged += r.boxes.count + r.odometry.count + r.boxes.gated + r.odometry.gated;
    if (r.neesMean !== null) (neesSum += r.neesMean * r.neesCount), (neesCount += r.neesCount);
    // RMSE pooled over logs by their compared rows (NEES rows = truth rows compared).
    if (r.positionRmse !== null && r.velocityRmse !== null) {
      posSq += r.positionRmse ** 2 * r.neesCount;
      velSq += r.velocityRmse ** 2 * r.neesCount;
      truthRows += r.neesCount;
    }
    for (const t of r.whiteness.tests) {
      tests++;
      if (t.white) passed++;
    }
    divergences += r.divergences.length;
  }
  return {
    minus2LogL: d,
    boxes: check(boxSum, boxCount, reports[0]?.boxes.dim ?? 3, level),
    odometry: check(odoSum, odoCount, reports[0]?.odometry.dim ?? 3, level),
    nees: check(neesSum, neesCount, reports[0]?.neesDim ?? 6, level),
    positionRmse: truthRows > 0 ? Math.sqrt(posSq / truthRows) : null,
    velocityRmse: truthRows > 0 ? Math.sqrt(velSq / truthRows) : null,
    gatedFraction: judged > 0 ? gated / judged : 0,
    whitenessPassed: passed,
    whitenessTests: tests,
    white: tests > 0 ? passed === tests : null,
    divergences,
  };
}

/** Relative RMSE increase above which a recommendation is said to worsen accuracy: 2 %, above what re-tuning noise alone moves it on the demo logs. */
export const ACCURACY_TOLERANCE = 0.02;

/** Sentences on what the recommended setting does that the user must weigh (empty when nothing). */
export function recommendationWarnings(current: SettingCheck, recommended: SettingCheck): string[] {
  const out: string[] = [];
  const worse = (a: number | null, b: number | null) => a !== null && b !== null && b > a * (1 + ACCURACY_TOLERANCE);
  if (worse(current.positionRmse, recommended.positionRmse)) {
    out.push(`the recommended setting WORSENS accuracy against truth: position RMSE ${current.positionRmse!.toPrecision(2)} m -> ${recommended.positionRmse!.toPrecision(2)} m; the likelihood's optimum is not the most accurate filter here (model mismatch?)`);
  }
  if (worse(current.velocityRmse, recommended.velocityRmse)) {
    out.push(`the recommended setting WORSENS velocity accuracy against truth: RMSE ${current.velocityRmse!.toPrecision(2)} m/s -> ${recommended.velocityRmse!.toPrecision(2)} m/s`);
  }
  if (recommended.divergences > current.divergences) out.push(`the recommended setting diverges more often (${recommended.divergences} vs ${current.divergences})`);
  if (recommended.gatedFraction > current.gatedFraction + 0.02) out.push(`the recommended setting gates more updates (${(100 * recommended.gatedFraction).toFixed(1)} % vs ${(100 * current.gatedFraction).toFixed(1)} %)`);
  return out;
}
