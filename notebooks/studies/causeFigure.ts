// Failures by cause per sweep point, as a table: how many trials failed for each cause the
// attribution named, the Wilson interval of that rate, what they ended in, and a link that
// opens the cause's representative trial step by step in the landing study.
import type { SweepOutput } from '../jobs/sweepJob.js';
import type { JobState } from '../jobs/JobState.js';
import { escapeXml, formatPercent } from '../figures/svg.js';
import { fromState, keyNumber, toCsv, type Drawn } from './figureOutput.js';
import type { StudyFigure } from './Study.js';
import { trialLink } from './trialLink.js';

/** Cause table of a sweep whose points vary `path`. */
export function causeTable(value: SweepOutput, path: string): Drawn {
  const rows: string[] = [];
  const csv: (string | number)[][] = [];
  let failed = 0, named = 0;
  for (const s of value.summaries) {
    for (const c of s.causes) {
      failed += c.count;
      if (c.cause !== 'no-single-cause' && c.cause !== 'not-attributed') named += c.count;
      const link = trialLink(value.header.scenario, value.header.points[c.example.point]!, c.example);
      const replay = `point ${c.example.point}, trial ${c.example.trial}`;
      const outcomes = Object.entries(c.outcomes).map(([o, n]) => `${o} ${n}`).join(', ');
      rows.push(`<tr><th scope="row">${escapeXml(String(s.point[path]))}</th><td>${escapeXml(c.cause)}</td><td>${c.count} of ${s.trials}</td><td>${formatPercent(c.wilsonLow)} to ${formatPercent(c.wilsonHigh)}</td><td>${escapeXml(outcomes)}</td><td>${link ? `<a href="${escapeXml(link)}">replay ${replay}</a>` : escapeXml(replay)}</td></tr>`);
      csv.push([String(s.point[path]), c.cause, c.count, s.trials, c.wilsonLow, c.wilsonHigh, c.example.seed, c.example.point, c.example.trial]);
    }
  }
  const head = [path, 'cause', 'trials', 'Wilson 95 % of the rate', 'ended as', 'representative trial'].map((h) => `<th scope="col">${escapeXml(h)}</th>`).join('');
  const body = rows.length > 0 ? rows.join('') : `<tr><td colspan="6">no trial failed</td></tr>`;
  return {
    kind: 'table',
    markup: `<table><caption>Failures by attributed cause per point</caption><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`,
    csv: toCsv([path, 'cause', 'count', 'trials', 'wilsonLow', 'wilsonHigh', 'seed', 'point', 'trial'], csv),
    numbers: [keyNumber('failedTrials', 'failed trials', failed, String(failed)), keyNumber('attributedTrials', 'with a single named cause', named, String(named))],
  };
}

/** The figure for a sweep study whose swept path depends on a control (e.g. the impairment). */
export function causeFigure(pathOf: (choice: string) => string, choiceInput: string): StudyFigure {
  return {
    name: 'causes',
    title: 'Why trials failed',
    caption: 'Each failed trial’s first cause, named by a stated rule from the events the trial recorded (dropout bursts, late boxes, false boxes taken, gusts), or “no-single-cause” when none stands out. The link replays a representative trial step by step.',
    wide: true,
    inputs: ['sweep', choiceInput],
    compute: (state: JobState<SweepOutput>, choice: string) => fromState(state, 'trials', (value) => causeTable(value, pathOf(choice))),
  };
}
