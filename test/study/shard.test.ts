import { describe, expect, it } from 'vitest';
import { inShard, parseShard, resolveShard } from '../../estimator/study/shard.js';

describe('shard', () => {
  it('inShard gives every trial to exactly one of N shards', () => {
    const owners = new Map<number, number>();
    for (let i = 1; i <= 3; i++) {
      for (let p = 0; p < 4; p++) for (let t = 0; t < 5; t++) if (inShard(p, t, 5, { index: i, count: 3 })) owners.set(p * 5 + t, (owners.get(p * 5 + t) ?? 0) + 1);
    }
    expect(owners.size).toBe(20);
    expect([...owners.values()].every((n) => n === 1)).toBe(true);
  });
  it('parseShard reads 1-based I/N and refuses 0/3 and 4/3', () => {
    expect(parseShard('2/3')).toEqual({ index: 2, count: 3 });
    expect(() => parseShard('0/3')).toThrow(/1 <= I <= N/);
    expect(() => parseShard('4/3')).toThrow(/1 <= I <= N/);
  });
  it('resolveShard reads Slurm array variables relative to SLURM_ARRAY_TASK_MIN', () => {
    expect(resolveShard(undefined, undefined, { SLURM_ARRAY_TASK_ID: '0', SLURM_ARRAY_TASK_COUNT: '4' })).toEqual({ index: 1, count: 4 });
    expect(resolveShard(undefined, undefined, { SLURM_ARRAY_TASK_ID: '4', SLURM_ARRAY_TASK_MIN: '1', SLURM_ARRAY_TASK_COUNT: '4' })).toEqual({ index: 4, count: 4 });
    expect(resolveShard(undefined, 8, { SLURM_ARRAY_TASK_ID: '7' })).toEqual({ index: 8, count: 8 });
    expect(() => resolveShard(undefined, undefined, { SLURM_ARRAY_TASK_ID: '3' })).toThrow(/SLURM_ARRAY_TASK_COUNT/);
  });
  it('resolveShard reads a Kubernetes JOB_COMPLETION_INDEX with --shard-count', () => {
    expect(resolveShard(undefined, 3, { JOB_COMPLETION_INDEX: '2' })).toEqual({ index: 3, count: 3 });
    expect(() => resolveShard(undefined, undefined, { JOB_COMPLETION_INDEX: '2' })).toThrow(/--shard-count/);
  });
  it('resolveShard: --shard wins over the environment; nothing set means unsharded', () => {
    expect(resolveShard('1/2', undefined, { SLURM_ARRAY_TASK_ID: '5' })).toEqual({ index: 1, count: 2 });
    expect(resolveShard(undefined, undefined, {})).toBeUndefined();
  });
});
