// The sweep results file (JSON Lines): one header line, then one record per trial.
// Formatting is deterministic (fixed key order, shortest round-trip floats), so equal runs
// give equal bytes; parsing validates every line and reports problems by line number.
import { JsonSyntaxError, parseJsonText } from '../io/jsonPositions.js';
import type { Scenario } from '../sim/Scenario.js';
import { OUTCOMES, type TrialResult } from '../sim/TrialResult.js';
import type { DesignKind, Params, VarySpec } from './sweepDesign.js';

export const RESULTS_KIND = 'alight-sweep';

export interface ShardInfo {
  /** 1-based shard number and shard count. */
  index: number;
  count: number;
}

export interface SweepHeader {
  v: 1;
  kind: typeof RESULTS_KIND;
  /** alight version that wrote the file. */
  tool: string;
  seed: number;
  trials: number;
  design: DesignKind;
  vary: VarySpec[];
  /** The varied values of every sweep point, by index. */
  points: Params[];
  /** The full base scenario, so the sweep can be reproduced from the file alone. */
  scenario: Scenario;
  /** Present only in a shard's file; a merged file equals an unsharded one. */
  shard?: ShardInfo;
}

export interface SweepRecord extends TrialResult {
  v: 1;
  point: number;
  trial: number;
  params: Params;
}

/** One header line (no newline), keys in a fixed order. */
export function formatHeader(h: SweepHeader): string {
  const { v, kind, tool, seed, trials, design, vary, points, scenario, shard } = h;
  const ordered: Record<string, unknown> = { v, kind, tool, seed, trials, design, vary, points };
  if (shard) ordered.shard = shard;
  ordered.scenario = scenario;
  return JSON.stringify(ordered);
}

/** One record line (no newline): `{"v":1,"point":i,"trial":j,"params":{...},...TrialResult}`. */
export function formatRecord(point: number, trial: number, params: Params, result: TrialResult): string {
  return JSON.stringify({ v: 1, point, trial, params, ...result });
}

export interface ResultsProblem {
  /** 1-based line number in the file. */
  line: number;
  message: string;
}

export interface ParsedRecord {
  record: SweepRecord;
  /** The line exactly as read, for byte-faithful rewriting. */
  text: string;
  line: number;
}

export interface ParsedResults {
  header: SweepHeader;
  records: ParsedRecord[];
  problems: ResultsProblem[];
  /** Byte length of the intact prefix: everything before the first unterminated last line. */
  intactLength: number;
}

export class ResultsError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ResultsError';
  }
}

const NUMBER_FIELDS = ['positionRmse', 'velocityRmse', 'neesMean', 'neesDim', 'nisMean', 'nisDim', 'nisCount',
  'boxes', 'dropped', 'falseBoxes', 'gateRejections', 'aborts'] as const;
const NULLABLE_FIELDS = ['missDistance', 'missX', 'missY', 'closingSpeed', 'lateralSpeed', 'tiltDeg', 'touchdownTime'] as const;

function checkHeader(value: unknown): string | null {
  if (!value || typeof value !== 'object' || Array.isArray(value)) return 'not a JSON object';
  const h = value as Record<string, unknown>;
  if (h.kind !== RESULTS_KIND) return `not an alight sweep header (kind is ${JSON.stringify(h.kind)}, expected "${RESULTS_KIND}")`;
  if (h.v !== 1) return `unsupported results version ${JSON.stringify(h.v)} (this alight reads 1)`;
  if (!Number.isInteger(h.seed)) return 'field "seed" must be an integer';
  if (!Number.isInteger(h.trials) || (h.trials as number) < 1) return 'field "trials" must be a positive integer';
  if (!Array.isArray(h.points) || h.points.length === 0) return 'field "points" must be a non-empty array';
  if (!Array.isArray(h.vary)) return 'field "vary" must be an array';
  if (!h.scenario || typeof h.scenario !== 'object') return 'field "scenario" must be an object';
  return null;
}

/** Checks one record against the header; returns a message naming the field, or null. */
function checkRecord(value: unknown, header: SweepHeader, pointKeys: string[]): string | null {
  if (!value || typeof value !== 'object' || Array.isArray(value)) return 'not a JSON object';
  const r = value as Record<string, unknown>;
  if (r.kind === RESULTS_KIND) return 'a second header (files concatenated? use alight merge)';
  if (r.v !== 1) return `field "v": expected 1, got ${JSON.stringify(r.v)}`;
  if (!Number.isInteger(r.point) || (r.point as number) < 0 || (r.point as number) >= header.points.length) {
    return `field "point": expected an integer in [0, ${header.points.length - 1}], got ${JSON.stringify(r.point)}`;
  }
  if (!Number.isInteger(r.trial) || (r.trial as number) < 0 || (r.trial as number) >= header.trials) {
    return `field "trial": expected an integer in [0, ${header.trials - 1}], got ${JSON.stringify(r.trial)}`;
  }
  if (JSON.stringify(r.params) !== pointKeys[r.point as number]) return `field "params" does not match point ${r.point as number} of the header`;
  if (!OUTCOMES.includes(r.outcome as never)) return `field "outcome": expected one of ${OUTCOMES.join(', ')}, got ${JSON.stringify(r.outcome)}`;
  // NaN serialises as null in JSON, so the estimate statistics may be null too.
  for (const f of NUMBER_FIELDS) if (typeof r[f] !== 'number' && r[f] !== null) return `field "${f}": expected a number, got ${JSON.stringify(r[f])}`;
  for (const f of NULLABLE_FIELDS) if (typeof r[f] !== 'number' && r[f] !== null) return `field "${f}": expected a number or null, got ${JSON.stringify(r[f])}`;
  return null;
}

/**
 * Parse a results file's text. The header must be the first line (otherwise ResultsError).
 * Every later line that is not valid JSON, has no end of line (a cut-off write), fails the
 * record checks, or repeats a (point, trial) is reported as a problem with its line number
 * and left out of `records`: callers skip with a count or refuse, never count it silently.
 */
export function parseResults(text: string, fileName: string): ParsedResults {
  const lines = text.split('\n');
  const terminated = text.endsWith('\n');
  if (terminated) lines.pop();
  let headerValue: unknown;
  try {
    headerValue = parseJsonText(lines[0] ?? '').value;
  } catch (error) {
    const detail = error instanceof JsonSyntaxError ? ` (column ${error.column}: ${error.message})` : '';
    throw new ResultsError(`${fileName}:1: not an alight results file (the first line is not a JSON header${detail})`);
  }
  const headerProblem = checkHeader(headerValue);
  if (headerProblem) throw new ResultsError(`${fileName}:1: ${headerProblem}`);
  if (lines.length === 1 && !terminated) throw new ResultsError(`${fileName}:1: header line cut off (no end of line)`);
  const header = headerValue as SweepHeader;
  const pointKeys = header.points.map((p) => JSON.stringify(p));
  const records: ParsedRecord[] = [];
  const problems: ResultsProblem[] = [];
  const seen = new Map<number, number>();
  let intactLength = text.length;
  for (let i = 1; i < lines.length; i++) {
    const lineText = lines[i]!;
    const line = i + 1;
    if (i === lines.length - 1 && !terminated) {
      problems.push({ line, message: 'cut off (no end of line): an interrupted write' });
      intactLength = text.length - lineText.length;
      continue;
    }
    if (lineText.trim() === '') {
      problems.push({ line, message: 'empty line' });
      continue;
    }
    let value: unknown;
    try {
      value = JSON.parse(lineText);
    } catch {
      problems.push({ line, message: 'not valid JSON (truncated or foreign line)' });
      continue;
    }
    // alight writes each record as JSON.stringify does; any other text (a key given twice, whose
    // last value JSON.parse would keep, 1e999 read as Infinity, a hand edit) is not counted.
    const problem = checkRecord(value, header, pointKeys) ?? (JSON.stringify(value) === lineText ? null : 'not a record as alight writes it (edited by hand, a key given twice, or a number out of range)');
    if (problem) {
      problems.push({ line, message: problem });
      continue;
    }
    const record = value as SweepRecord;
    const key = record.point * header.trials + record.trial;
    const first = seen.get(key);
    if (first !== undefined) {
      problems.push({ line, message: `point ${record.point} trial ${record.trial} repeats line ${first}` });
      continue;
    }
    seen.set(key, line);
    records.push({ record, text: lineText, line });
  }
  return { header, records, problems, intactLength };
}

/** "file:line: message" for each problem, at most `limit` of them plus a count of the rest. */
export function describeProblems(fileName: string, problems: readonly ResultsProblem[], limit = 10): string {
  const shown = problems.slice(0, limit).map((p) => `${fileName}:${p.line}: ${p.message}`);
  if (problems.length > limit) shown.push(`... and ${problems.length - limit} more problem lines`);
  return shown.join('\n');
}

/** Records sorted by (point, trial): the canonical order of every finished results file. */
export function canonicalText(header: SweepHeader, records: readonly { record: { point: number; trial: number }; text: string }[]): string {
  const sorted = records.slice().sort((a, b) => a.record.point - b.record.point || a.record.trial - b.record.trial);
  return formatHeader(header) + '\n' + sorted.map((r) => r.text + '\n').join('');
}
