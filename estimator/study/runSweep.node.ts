// Node-only: run a sweep into a JSON Lines file — stream records as trials finish, resume an
// interrupted file, and rewrite the finished file in canonical (point, trial) order.
import { closeSync, existsSync, unlinkSync, openSync, readFileSync, renameSync, truncateSync, writeFileSync, writeSync } from 'node:fs';
import type { Scenario } from '../sim/Scenario.js';
import { VERSION } from '../version.js';
import { canonicalText, describeProblems, formatHeader, parseResults, type ShardInfo, type SweepHeader } from './resultsFile.js';
import { inShard } from './shard.js';
import { checkStudySize, designSize } from './studyLimits.js';
import { designPoints, type DesignKind, type VarySpec } from './sweepDesign.js';
import type { ApplyParams, TrialExecutor } from './trialExecutor.js';

export class SweepError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SweepError';
  }
}

export interface SweepOptions {
  scenario: Scenario;
  vary: VarySpec[];
  design: DesignKind;
  /** Points of random/LHS designs (default: largest COUNT). */
  points?: number;
  /** Trials per sweep point. */
  trials: number;
  seed: number;
  /** Results file path. */
  out: string;
  /** Continue an interrupted file instead of refusing to touch an existing one. */
  resume: boolean;
  shard?: ShardInfo;
  executor: TrialExecutor;
  /** Called after each written trial with (done, total) of this run, including resumed ones. */
  onProgress?: (done: number, total: number) => void;
  /** Called with notes for the user (e.g. a dropped cut-off line). */
  onNote?: (message: string) => void;
  /** Applies a point's values to the scenario (e.g. applyParams); when given, every point is checked before any file is touched. */
  check?: ApplyParams;
}

export interface SweepSummary {
  header: SweepHeader;
  /** Trials this shard owns, trials found already done, trials run now. */
  total: number;
  resumed: number;
  ran: number;
}

function firstDifference(a: SweepHeader, b: SweepHeader): string {
  for (const key of ['tool', 'seed', 'trials', 'design', 'vary', 'points', 'shard', 'scenario'] as const) {
    if (JSON.stringify(a[key]) !== JSON.stringify(b[key])) return key;
  }
  return 'header';
}

/** The header a sweep with these options writes. */
export function sweepHeader(o: Pick<SweepOptions, 'scenario' | 'vary' | 'design' | 'points' | 'trials' | 'seed' | 'shard'>): SweepHeader {
  const points = designPoints(o.vary, o.design, { seed: o.seed, points: o.points });
  const header: SweepHeader = { v: 1, kind: 'alight-sweep', tool: VERSION, seed: o.seed, trials: o.trials, design: o.design, vary: o.vary, points, scenario: o.scenario };
  if (o.shard) header.shard = o.shard;
  return header;
}

export async function runSweep(o: SweepOptions): Promise<SweepSummary> {
  if (!Number.isInteger(o.trials) || o.trials < 1) throw new SweepError(`--trials must be a positive integer, got ${o.trials}`);
  checkStudySize(designSize(o.vary, o.design, o.points), o.trials);
  const header = sweepHeader(o);
  if (o.check) {
    header.points.forEach((params, i) => {
      try {
        o.check!(o.scenario, params);
      } catch (error) {
        throw new SweepError(`sweep point ${i} ${JSON.stringify(params)}: ${(error as Error)?.message ?? String(error)}`);
      }
    });
  }
  const done = new Set<number>();
  let fresh = true;
  if (existsSync(o.out)) {
    if (!o.resume) throw new SweepError(`${o.out} already exists: add --resume to continue it, or choose another --out`);
    const text = readFileSync(o.out, 'utf8');
    if (!text.includes('\n')) {
      // Killed before the header line was complete: nothing to keep.
      o.onNote?.(`${o.out}: only a cut-off header; starting the sweep afresh`);
      unlinkSync(o.out);
      return runSweep({ ...o, resume: false });
    }
    const parsed = parseResults(text, o.out);
    if (formatHeader(parsed.header) !== formatHeader(header)) {
      throw new SweepError(`${o.out}:1: cannot resume: the file was written for a different sweep (field "${firstDifference(parsed.header, header)}" differs)`);
    }
    // A kill can cut the last line short; that trial simply runs again. Anything else is refused.
    const cutOff = parsed.intactLength < text.length ? parsed.problems[parsed.problems.length - 1] : undefined;
    const serious = parsed.problems.filter((p) => p !== cutOff);
    if (serious.length > 0) throw new SweepError(`cannot resume ${o.out}: fix or remove these lines first\n${describeProblems(o.out, serious)}`);
    if (cutOff) {
      truncateSync(o.out, Buffer.byteLength(text.slice(0, parsed.intactLength)));
      o.onNote?.(`${o.out}:${cutOff.line}: dropped a cut-off record; that trial runs again`);
    }
    for (const { record } of parsed.records) done.add(record.point * o.trials + record.trial);
    fresh = false;
  }
  const pairs: number[] = [];
  let total = 0;
  for (let point = 0; point < header.points.length; point++) {
    for (let trial = 0; trial < o.trials; trial++) {
      if (!inShard(point, trial, o.trials, o.shard)) continue;
      total++;
      if (!done.has(point * o.trials + trial)) pairs.push(point, trial);
    }
  }
  const resumed = total - pairs.length / 2;
  const fd = openSync(o.out, fresh ? 'w' : 'a');
  let finished = resumed;
  try {
    if (fresh) writeSync(fd, formatHeader(header) + '\n');
    o.onProgress?.(finished, total);
    await o.executor.run({ scenario: o.scenario, seed: o.seed, points: header.points, items: Int32Array.from(pairs) }, (line) => {
      writeSync(fd, line + '\n');
      finished++;
      o.onProgress?.(finished, total);
    });
  } finally {
    closeSync(fd);
  }
  // Canonical order: a resumed, multi-worker or merged file equals an uninterrupted one byte for byte.
  const parsed = parseResults(readFileSync(o.out, 'utf8'), o.out);
  if (parsed.problems.length > 0) throw new SweepError(`internal: ${describeProblems(o.out, parsed.problems)}`);
  const temporary = `${o.out}.tmp-${process.pid}`;
  writeFileSync(temporary, canonicalText(parsed.header, parsed.records));
  renameSync(temporary, o.out);
  return { header, total, resumed, ran: pairs.length / 2 };
}
