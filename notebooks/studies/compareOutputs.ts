// A against B: two analyses' figure outputs side by side. Success counts (any figure whose data
// has `trials` and `landed` columns) are matched row by row on the columns before them, and each
// difference B - A gets the Newcombe interval (hybrid score, from the two Wilson intervals); the
// figures' key numbers are listed with their difference, without an interval where none applies.
import { differenceInterval } from '../../estimator/study/statistics/differenceInterval.js';
import type { FigureOutput } from './Study.js';

export interface CountDifference {
  figure: string;
  /** The matched row's identifying values, e.g. "detector.dropout = 0.2". */
  row: string;
  a: { landed: number; trials: number };
  b: { landed: number; trials: number };
  /** B's rate minus A's, and its interval at the chosen z. */
  difference: number;
  low: number;
  high: number;
  /** "B lower", "B higher", or "no difference shown" (interval includes 0). */
  reading: string;
}

export interface NumberDifference {
  figure: string;
  key: string;
  label: string;
  a: number;
  b: number;
  aText: string;
  bText: string;
}

export interface Comparison {
  counts: CountDifference[];
  numbers: NumberDifference[];
}

/** CSV as the figures write it (toCsv): header row, commas, fields quoted when they hold commas. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  for (const line of text.split('\n')) {
    if (line === '') continue;
    const cells: string[] = [];
    let cell = '';
    let quoted = false;
    for (let i = 0; i < line.length; i++) {
      const c = line[i]!;
      if (quoted) {
        if (c === '"' && line[i + 1] === '"') (cell += '"'), i++;
        else if (c === '"') quoted = false;
        else cell += c;
      } else if (c === '"') quoted = true;
      else if (c === ',') cells.push(cell), (cell = '');
      else cell += c;
    }
    cells.push(cell);
    rows.push(cells);
  }
  return rows;
}

function countRows(output: FigureOutput): Map<string, { landed: number; trials: number }> | null {
  if (output.csv === null) return null;
  const [header, ...rows] = parseCsv(output.csv);
  const t = header?.indexOf('trials') ?? -1;
  const l = header?.indexOf('landed') ?? -1;
  if (!header || t < 1 || l < 0) return null;
  const out = new Map<string, { landed: number; trials: number }>();
  for (const r of rows) out.set(header.slice(0, t).map((h, i) => `${h} = ${r[i]}`).join(', '), { landed: Number(r[l]), trials: Number(r[t]) });
  return out;
}

export function compareOutputs(a: ReadonlyMap<string, FigureOutput>, b: ReadonlyMap<string, FigureOutput>, z = 1.96): Comparison {
  const counts: CountDifference[] = [];
  const numbers: NumberDifference[] = [];
  for (const [figure, outB] of b) {
    const outA = a.get(figure);
    if (!outA) continue;
    const rowsA = countRows(outA);
    const rowsB = countRows(outB);
    if (rowsA && rowsB) {
      for (const [row, cb] of rowsB) {
        const ca = rowsA.get(row);
        if (!ca || ca.trials <= 0 || cb.trials <= 0) continue;
        // Several figures of a study tabulate the same sweep: list each point's counts once.
        if (counts.some((c) => c.row === row && c.a.landed === ca.landed && c.a.trials === ca.trials && c.b.landed === cb.landed && c.b.trials === cb.trials)) continue;
        // Newcombe 1998 method 10, B minus A.
        const d = differenceInterval(cb.landed, cb.trials, ca.landed, ca.trials, z);
        const reading = d.low > 0 ? 'B higher' : d.high < 0 ? 'B lower' : 'no difference shown';
        counts.push({ figure, row, a: ca, b: cb, difference: d.difference, low: d.low, high: d.high, reading });
      }
    }
    for (const nb of outB.numbers) {
      const na = outA.numbers.find((n) => n.key === nb.key);
      if (!na || na.value === null || nb.value === null) continue;
      numbers.push({ figure, key: nb.key, label: nb.label, a: na.value, b: nb.value, aText: na.text, bText: nb.text });
    }
  }
  return { counts, numbers };
}
