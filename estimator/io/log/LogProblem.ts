// Problems found while reading a flight log. Row problems skip the row and are counted;
// layout problems (missing file, missing column, bad camera.json) stop the replay.
// Memory stays bounded however many rows are bad: counts for all, details for the first few.

export type LogProblemKind =
  | 'field-count' // a row has fewer or more fields than the header
  | 'not-a-number' // empty, non-numeric, NaN or infinite field
  | 'unsorted-time' // time earlier than the previous row's
  | 'duplicate-row' // the same row again
  | 'repeated-time' // same time as the previous row in a stream that allows one row per time
  | 'box-inverted' // xMax < xMin or yMax < yMin (or negative w/h)
  | 'capture-after-arrival' // a box arriving before it was captured
  | 'score-out-of-range' // score outside [0, 1]
  | 'quaternion-not-unit'; // |q| differs from 1 by more than 1e-3

export interface LogProblem {
  kind: LogProblemKind;
  /** File name inside the log folder, e.g. "boxes.csv". */
  file: string;
  /** 1-based line number (the header is line 1). */
  line: number;
  /** Column (field) name, or null when the whole row is at fault. */
  column: string | null;
  message: string;
}

/** `boxes.csv:17 xMax: ...` — the one way a problem is printed. */
export function formatProblem(p: LogProblem): string {
  return `${p.file}:${p.line}${p.column ? ` ${p.column}` : ''}: ${p.message}`;
}

/** A fatal layout problem: the log cannot be replayed as it stands. */
export class LogLayoutError extends Error {
  readonly file: string;
  readonly line: number | null;
  readonly column: string | null;
  constructor(file: string, line: number | null, column: string | null, message: string) {
    super(`${file}${line !== null ? `:${line}` : ''}${column ? ` ${column}` : ''}: ${message}`);
    this.name = 'LogLayoutError';
    this.file = file;
    this.line = line;
    this.column = column;
  }
}

/** Collects row problems: every one counted, the first `keep` kept in full. */
export class ProblemLog {
  readonly keep: number;
  readonly shown: LogProblem[] = [];
  readonly byKind: Partial<Record<LogProblemKind, number>> = {};
  total = 0;
  constructor(keep = 100) {
    this.keep = keep;
  }
  add(kind: LogProblemKind, file: string, line: number, column: string | null, message: string): void {
    this.total++;
    this.byKind[kind] = (this.byKind[kind] ?? 0) + 1;
    if (this.shown.length < this.keep) this.shown.push({ kind, file, line, column, message });
  }
}
