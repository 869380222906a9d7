// Which trials a shard runs, and how a shard is named by options or a batch scheduler.
import type { ShardInfo } from './resultsFile.js';

export class ShardError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ShardError';
  }
}

/**
 * Shard i of n (1-based) runs the trials whose global index g = point · trials + trial
 * satisfies g mod n = i - 1. Interleaving spreads slow and fast sweep points evenly.
 */
export function inShard(point: number, trial: number, trials: number, shard: ShardInfo | undefined): boolean {
  if (!shard) return true;
  return (point * trials + trial) % shard.count === shard.index - 1;
}

/** Parse "I/N" with 1 <= I <= N. */
export function parseShard(text: string): ShardInfo {
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  const index = m ? Number(m[1]) : NaN;
  const count = m ? Number(m[2]) : NaN;
  if (!m || count < 1 || index < 1 || index > count) throw new ShardError(`--shard "${text}": expected I/N with 1 <= I <= N, e.g. 2/3`);
  return { index, count };
}

function integerVariable(env: Record<string, string | undefined>, name: string): number | undefined {
  const text = env[name];
  if (text === undefined || text === '') return undefined;
  if (!/^\d+$/.test(text.trim())) throw new ShardError(`environment ${name}="${text}" is not a non-negative integer`);
  return Number(text);
}

/**
 * The shard of this process, in order of precedence:
 * 1. `--shard I/N` given: that shard.
 * 2. Slurm array job (SLURM_ARRAY_TASK_ID set): I = SLURM_ARRAY_TASK_ID - SLURM_ARRAY_TASK_MIN + 1
 *    (MIN defaults to 0), N = --shard-count, else SLURM_ARRAY_TASK_COUNT. The array must be a
 *    contiguous range, e.g. `--array=0-7` or `--array=1-8`.
 * 3. Kubernetes indexed job (JOB_COMPLETION_INDEX set): I = JOB_COMPLETION_INDEX + 1,
 *    N = --shard-count (Kubernetes does not export the completion count; pass `.spec.completions`).
 * 4. Otherwise unsharded (undefined).
 */
export function resolveShard(option: string | undefined, shardCount: number | undefined, env: Record<string, string | undefined>): ShardInfo | undefined {
  if (option !== undefined) {
    const shard = parseShard(option);
    if (shardCount !== undefined && shardCount !== shard.count) throw new ShardError(`--shard ${option} disagrees with --shard-count ${shardCount}`);
    return shard;
  }
  const slurmId = integerVariable(env, 'SLURM_ARRAY_TASK_ID');
  if (slurmId !== undefined) {
    const min = integerVariable(env, 'SLURM_ARRAY_TASK_MIN') ?? 0;
    const count = shardCount ?? integerVariable(env, 'SLURM_ARRAY_TASK_COUNT');
    if (count === undefined) throw new ShardError('SLURM_ARRAY_TASK_ID is set but neither --shard-count nor SLURM_ARRAY_TASK_COUNT is');
    const index = slurmId - min + 1;
    if (index < 1 || index > count) throw new ShardError(`Slurm array task ${slurmId} (min ${min}) is outside 1..${count}: use a contiguous --array range or pass --shard`);
    return { index, count };
  }
  const k8sIndex = integerVariable(env, 'JOB_COMPLETION_INDEX');
  if (k8sIndex !== undefined) {
    if (shardCount === undefined) throw new ShardError('JOB_COMPLETION_INDEX is set: pass --shard-count with the job\'s completions');
    if (k8sIndex >= shardCount) throw new ShardError(`JOB_COMPLETION_INDEX ${k8sIndex} is not below --shard-count ${shardCount}`);
    return { index: k8sIndex + 1, count: shardCount };
  }
  if (shardCount !== undefined) throw new ShardError('--shard-count given without --shard, SLURM_ARRAY_TASK_ID or JOB_COMPLETION_INDEX');
  return undefined;
}
