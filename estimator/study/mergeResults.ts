// Join shard files into exactly the file an unsharded sweep writes.
import { canonicalText, formatHeader, type ParsedRecord, type ParsedResults, type SweepHeader } from './resultsFile.js';
import { inShard } from './shard.js';

export class MergeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'MergeError';
  }
}

export interface MergeInput {
  name: string;
  parsed: ParsedResults;
}

export interface MergeResult {
  text: string;
  header: SweepHeader;
  records: number;
  /** Trials the full sweep has that no input holds. */
  missing: number;
}

/**
 * Checks that the inputs are shards of one sweep (equal headers apart from the shard field),
 * that every shard 1..N appears once and that each record belongs to its file's shard, then
 * writes the records in canonical order under the unsharded header. Unsharded inputs (e.g.
 * partial files of one sweep) are accepted too; a trial found in two files is refused.
 */
export function mergeResults(inputs: readonly MergeInput[]): MergeResult {
  if (inputs.length === 0) throw new MergeError('nothing to merge: give the shard files');
  const base: SweepHeader = { ...inputs[0]!.parsed.header };
  delete base.shard;
  const expected = formatHeader(base);
  const shardsSeen = new Map<number, string>();
  let count: number | undefined;
  const all: ParsedRecord[] = [];
  const owner = new Map<number, string>();
  for (const { name, parsed } of inputs) {
    const h: SweepHeader = { ...parsed.header };
    const shard = h.shard;
    delete h.shard;
    if (formatHeader(h) !== expected) throw new MergeError(`${name}:1: not a shard of the same sweep as ${inputs[0]!.name} (seed, trials, design, points or scenario differ)`);
    if (shard) {
      if (count !== undefined && shard.count !== count) throw new MergeError(`${name}:1: shard ${shard.index}/${shard.count} does not match /${count} of the other files`);
      count = shard.count;
      const other = shardsSeen.get(shard.index);
      if (other) throw new MergeError(`${name}:1: shard ${shard.index}/${shard.count} is also ${other}`);
      shardsSeen.set(shard.index, name);
    }
    for (const r of parsed.records) {
      const { point, trial } = r.record;
      if (shard && !inShard(point, trial, base.trials, shard)) {
        throw new MergeError(`${name}:${r.line}: point ${point} trial ${trial} does not belong to shard ${shard.index}/${shard.count}`);
      }
      const key = point * base.trials + trial;
      const previous = owner.get(key);
      if (previous) throw new MergeError(`${name}:${r.line}: point ${point} trial ${trial} is also in ${previous}`);
      owner.set(key, `${name}:${r.line}`);
      all.push(r);
    }
  }
  if (count !== undefined && shardsSeen.size !== count) {
    const absent = Array.from({ length: count }, (_, i) => i + 1).filter((i) => !shardsSeen.has(i));
    throw new MergeError(`missing shard file(s) ${absent.map((i) => `${i}/${count}`).join(', ')}`);
  }
  const full = base.points.length * base.trials;
  return { text: canonicalText(base, all), header: base, records: all.length, missing: full - all.length };
}
