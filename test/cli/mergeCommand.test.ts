import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { runSweep } from '../../estimator/study/runSweep.node.js';
import { parseVary } from '../../estimator/study/sweepDesign.js';
import { inProcessExecutor } from '../../estimator/study/trialExecutor.js';
import { fakeTrial } from '../study/fakeTrial.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-merge-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const options = (out: string) => ({
  scenario: defaultScenario(), vary: [parseVary('detector.pixelNoise=1:5:2')], design: 'grid' as const, trials: 5, seed: 9,
  out: join(dir, out), resume: false, executor: inProcessExecutor(fakeTrial, applyParams),
});

beforeAll(async () => {
  await runSweep(options('whole.jsonl'));
  for (let i = 1; i <= 3; i++) await runSweep({ ...options(`s${i}.jsonl`), shard: { index: i, count: 3 } });
});

describe('alight merge', () => {
  it('alight merge s1 s2 s3 writes the unsharded file byte for byte', async () => {
    const io = fakeIo(dir);
    expect(await main(['merge', 's3.jsonl', 's1.jsonl', 's2.jsonl', '--out', 'merged.jsonl'], io)).toBe(0);
    expect(io.out.join('')).toContain('merged 3 files, 10 trials');
    expect(readFileSync(join(dir, 'merged.jsonl'), 'utf8')).toBe(readFileSync(join(dir, 'whole.jsonl'), 'utf8'));
  });
  it('alight merge refuses a missing shard, a repeated shard and a different sweep (exit 2)', async () => {
    const missing = fakeIo(dir);
    expect(await main(['merge', 's1.jsonl', 's2.jsonl', '--out', 'm2.jsonl'], missing)).toBe(2);
    expect(missing.err.join('')).toContain('missing shard file(s) 3/3');
    const twice = fakeIo(dir);
    expect(await main(['merge', 's1.jsonl', 's1.jsonl', 's2.jsonl', '--out', 'm3.jsonl'], twice)).toBe(2);
    expect(twice.err.join('')).toContain('s1.jsonl:1: shard 1/3 is also s1.jsonl');
    await runSweep({ ...options('other.jsonl'), seed: 10, shard: { index: 3, count: 3 } });
    const other = fakeIo(dir);
    expect(await main(['merge', 's1.jsonl', 's2.jsonl', 'other.jsonl', '--out', 'm4.jsonl'], other)).toBe(2);
    expect(other.err.join('')).toContain('other.jsonl:1: not a shard of the same sweep');
  });
});
