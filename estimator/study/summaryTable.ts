// Summaries as text for a terminal and as CSV for spreadsheets (RFC 4180 quoting).
import { FAILURE_CAUSES } from '../sim/attribution/FailureEvent.js';
import { OUTCOMES } from '../sim/TrialResult.js';
import { NOT_ATTRIBUTED } from './failureCauses.js';
import type { PointSummary } from './summarize.js';
import { consistencyWords } from './statistics/ensembleConsistency.js';
import { rateDecimals } from './formatNumbers.js';

function fixed(v: number | null, digits: number): string {
  return v === null ? '-' : v.toFixed(digits);
}

// Rates as percentages with the digits the trial count resolves (one trial moves a rate by 100/n %).
function pct(v: number | null, trials: number): string {
  return v === null ? '-' : (100 * v).toFixed(rateDecimals(trials));
}

function pointLabel(s: PointSummary): string {
  const entries = Object.entries(s.point);
  return entries.length === 0 ? '(scenario)' : entries.map(([k, v]) => `${k}=${typeof v === 'number' ? Number(v.toPrecision(6)) : v}`).join(' ');
}

/** A plain aligned table, one row per point. */
export function summaryTable(summaries: readonly PointSummary[]): string {
  const head = ['point', 'trials', 'landed', 'success %', 'wilson95 %', 'cep50 m', 'cep95 m', 'land s p50', 'nees', 'verdict'];
  const rows = summaries.map((s) => [
    pointLabel(s),
    String(s.trials),
    String(s.landed),
    pct(s.successRate, s.trials),
    `${pct(s.wilsonLow, s.trials)}-${pct(s.wilsonHigh, s.trials)}` + (s.ruleOfThreeLow !== null && s.ruleOfThreeLow > 0 ? ` (r3 >= ${pct(s.ruleOfThreeLow, s.trials)})` : ''), // vacuous below 4 trials
    fixed(s.cep50, 2), // cm: finer than the detector resolves at landing height
    fixed(s.cep95, 2),
    fixed(s.timeToLandP50, 1),
    s.neesMean === null ? '-' : `${fixed(s.neesMean, 2)} [${fixed(s.neesLow, 2)}, ${fixed(s.neesHigh, 2)}]`,
    s.neesVerdict ?? '-',
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  ');
  const failures = summaries.filter((s) => s.trials - s.landed > 0);
  const notes = failures.length > 0 ? `\noutcomes: ${OUTCOMES.map((o) => `${o} ${summaries.reduce((n, s) => n + s.outcomes[o], 0)}`).join(', ')}` : '';
  const descent = summaries.filter((s) => s.descentNees !== null).map((s) => {
    const e = s.descentNees!;
    return `${pointLabel(s)}: ${consistencyWords(e.verdict)} (ensemble NEES inside its 95 % interval in ${e.bins.filter((b) => b.verdict === 'consistent').length} of ${e.bins.length} height bins, ${e.outlierTrials} outlier trial-bins)`;
  });
  const descentNote = descent.length > 0 ? `\ndescent NEES by height:\n  ${descent.join('\n  ')}` : '';
  return [line(head), ...rows.map(line)].join('\n') + notes + descentNote + '\n' + causeLines(failures);
}

/**
 * Failures by cause, one line per point that had any:
 *   point  cause count (Wilson 95 % of the rate) trial key, ...
 */
function causeLines(failures: readonly PointSummary[]): string {
  if (failures.length === 0) return '';
  const lines = failures.map((s) => `${pointLabel(s)}: ` + s.causes.map((c) => `${c.cause} ${c.count} (${pct(c.wilsonLow, s.trials)}-${pct(c.wilsonHigh, s.trials)} %, e.g. trial ${c.example.point}/${c.example.trial})`).join('; '));
  return `failures by cause (count, Wilson 95 % of the rate, example point/trial):\n${lines.join('\n')}\n`;
}

function csvCell(v: unknown): string {
  if (v === null || v === undefined) return '';
  const text = String(v);
  return /[",\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** CSV with one column per varied path, then the statistics; outcome counts as outcome.<name>, failure causes as cause.<name>. */
export function summaryCsv(summaries: readonly PointSummary[], paths: readonly string[]): string {
  const stats = ['trials', 'landed', 'successRate', 'wilsonLow', 'wilsonHigh', 'ruleOfThreeLow', 'contacts', 'cep50', 'cep95',
    'timeToLandP10', 'timeToLandP50', 'timeToLandP90', 'neesMean', 'neesDim', 'neesLow', 'neesHigh', 'neesVerdict',
    'nisMean', 'nisDim', 'nisLow', 'nisHigh', 'nisVerdict', 'positionRmse', 'descentNeesVerdict'] as const;
  const causes = [...FAILURE_CAUSES, NOT_ATTRIBUTED];
  const head = [...paths, ...stats, ...OUTCOMES.map((o) => `outcome.${o}`), ...causes.map((c) => `cause.${c}`)];
  const count = (s: PointSummary, c: string) => s.causes.find((x) => x.cause === c)?.count ?? 0;
  const rows = summaries.map((s) => [...paths.map((p) => s.point[p]), ...stats.map((k) => s[k]), ...OUTCOMES.map((o) => s.outcomes[o]), ...causes.map((c) => count(s, c))]);
  return [head, ...rows].map((r) => r.map(csvCell).join(',')).join('\n') + '\n';
}
