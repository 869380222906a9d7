import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { mergeResults } from '../../estimator/study/mergeResults.js';
import { parseResults } from '../../estimator/study/resultsFile.js';
import { runSweep } from '../../estimator/study/runSweep.node.js';
import { parseVary } from '../../estimator/study/sweepDesign.js';
import { inProcessExecutor } from '../../estimator/study/trialExecutor.js';
import { fakeTrial } from './fakeTrial.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-merge-lib-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const read = (name: string) => ({ name, parsed: parseResults(readFileSync(join(dir, name), 'utf8'), name) });

beforeAll(async () => {
  for (let i = 1; i <= 2; i++) {
    await runSweep({
      scenario: defaultScenario(), vary: [parseVary('detector.pixelNoise=1,2')], design: 'grid', trials: 3, seed: 1,
      out: join(dir, `s${i}.jsonl`), resume: false, shard: { index: i, count: 2 }, executor: inProcessExecutor(fakeTrial, applyParams),
    });
  }
});

describe('mergeResults', () => {
  it('mergeResults writes the unsharded header and every record in (point, trial) order', () => {
    const merged = mergeResults([read('s2.jsonl'), read('s1.jsonl')]);
    expect(merged.records).toBe(6);
    expect(merged.missing).toBe(0);
    expect(merged.header.shard).toBeUndefined();
    const lines = merged.text.trim().split('\n').slice(1).map((l) => JSON.parse(l) as { point: number; trial: number });
    expect(lines.map((r) => [r.point, r.trial])).toEqual([[0, 0], [0, 1], [0, 2], [1, 0], [1, 1], [1, 2]]);
  });
  it('mergeResults counts missing trials and refuses a record outside its shard', () => {
    const one = read('s1.jsonl');
    expect(mergeResults([{ ...one, parsed: { ...one.parsed, header: { ...one.parsed.header, shard: undefined } } }]).missing).toBe(3);
    const moved = read('s1.jsonl');
    moved.parsed.records[0]!.record.trial = 1; // (0, 1) belongs to shard 2 of 2
    expect(() => mergeResults([moved, read('s2.jsonl')])).toThrow(/s1\.jsonl:2: point 0 trial 1 does not belong to shard 1\/2/);
  });
});
