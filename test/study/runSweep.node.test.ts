import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { mergeResults } from '../../estimator/study/mergeResults.js';
import { parseResults } from '../../estimator/study/resultsFile.js';
import { runSweep, type SweepOptions } from '../../estimator/study/runSweep.node.js';
import { parseVary } from '../../estimator/study/sweepDesign.js';
import { inProcessExecutor } from '../../estimator/study/trialExecutor.js';
import { fakeTrial } from './fakeTrial.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-sweep-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const base = (out: string): SweepOptions => ({
  scenario: defaultScenario(),
  vary: [parseVary('detector.pixelNoise=0:4:3'), parseVary('detector.latency=0.05,0.1')],
  design: 'grid',
  trials: 7,
  seed: 11,
  out: join(dir, out),
  resume: false,
  executor: inProcessExecutor(fakeTrial, applyParams),
});

describe('runSweep (with a deterministic stand-in trial)', () => {
  it('runSweep writes a header and one record per trial in (point, trial) order', async () => {
    const r = await runSweep(base('plain.jsonl'));
    expect(r).toMatchObject({ total: 42, ran: 42, resumed: 0 });
    const parsed = parseResults(readFileSync(join(dir, 'plain.jsonl'), 'utf8'), 'plain.jsonl');
    expect(parsed.problems).toEqual([]);
    expect(parsed.header.points).toHaveLength(6);
    expect(parsed.records.map((x) => [x.record.point, x.record.trial])).toEqual(
      Array.from({ length: 42 }, (_, g) => [Math.floor(g / 7), g % 7]),
    );
    expect(parsed.records[7]!.record.params).toEqual({ 'detector.pixelNoise': 0, 'detector.latency': 0.1 });
  });

  it('three shards merged equal one unsharded run byte for byte', async () => {
    const whole = readFileSync(join(dir, 'plain.jsonl'), 'utf8');
    const inputs = [];
    for (let i = 1; i <= 3; i++) {
      const name = `shard-${i}.jsonl`;
      const r = await runSweep({ ...base(name), shard: { index: i, count: 3 } });
      expect(r.total).toBe(14);
      inputs.push({ name, parsed: parseResults(readFileSync(join(dir, name), 'utf8'), name) });
    }
    const merged = mergeResults(inputs.reverse());
    expect(merged.missing).toBe(0);
    expect(merged.text).toBe(whole);
  });

  it('a sweep cut off mid-line and resumed equals an uninterrupted one byte for byte', async () => {
    const whole = readFileSync(join(dir, 'plain.jsonl'), 'utf8');
    // Simulate a kill: completion order scrambled (as with workers) and the last write cut short.
    const lines = whole.split('\n').slice(0, -1);
    const body = lines.slice(1, 20).reverse();
    writeFileSync(join(dir, 'cut.jsonl'), [lines[0], ...body].join('\n') + '\n' + lines[25]!.slice(0, 40));
    const notes: string[] = [];
    const r = await runSweep({ ...base('cut.jsonl'), resume: true, onNote: (n) => notes.push(n) });
    expect(r).toMatchObject({ total: 42, resumed: 19, ran: 23 });
    expect(notes.join()).toMatch(/cut\.jsonl:21: dropped a cut-off record/);
    expect(readFileSync(join(dir, 'cut.jsonl'), 'utf8')).toBe(whole);
  });

  it('a sweep killed while writing its header resumes from scratch', async () => {
    const whole = readFileSync(join(dir, 'plain.jsonl'), 'utf8');
    writeFileSync(join(dir, 'header-cut.jsonl'), whole.slice(0, 100));
    const notes: string[] = [];
    const r = await runSweep({ ...base('header-cut.jsonl'), resume: true, onNote: (n) => notes.push(n) });
    expect(r).toMatchObject({ total: 42, resumed: 0, ran: 42 });
    expect(notes.join()).toMatch(/only a cut-off header/);
    expect(readFileSync(join(dir, 'header-cut.jsonl'), 'utf8')).toBe(whole);
  });

  it('runSweep refuses to overwrite without --resume and to resume a different sweep', async () => {
    await expect(runSweep(base('plain.jsonl'))).rejects.toThrow(/already exists: add --resume/);
    await expect(runSweep({ ...base('plain.jsonl'), seed: 12, resume: true })).rejects.toThrow(/plain\.jsonl:1: cannot resume.*"seed" differs/);
  });

  it('runSweep refuses to resume over a foreign line in the middle, naming its line', async () => {
    const whole = readFileSync(join(dir, 'plain.jsonl'), 'utf8').split('\n');
    whole.splice(3, 0, '{"hello":"world"}');
    writeFileSync(join(dir, 'foreign.jsonl'), whole.join('\n'));
    await expect(runSweep({ ...base('foreign.jsonl'), resume: true })).rejects.toThrow(/foreign\.jsonl:4: field "v"/);
  });
});
