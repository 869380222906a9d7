import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { runSweep } from '../../estimator/study/runSweep.node.js';
import { parseVary } from '../../estimator/study/sweepDesign.js';
import { inProcessExecutor } from '../../estimator/study/trialExecutor.js';
import { wilson } from '../../estimator/study/statistics/wilson.js';
import { fakeTrial } from '../study/fakeTrial.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-summarize-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

beforeAll(async () => {
  await runSweep({
    scenario: defaultScenario(), vary: [parseVary('detector.pixelNoise=1:5:3')], design: 'grid', trials: 40, seed: 4,
    out: join(dir, 'r.jsonl'), resume: false, executor: inProcessExecutor(fakeTrial, applyParams),
  });
});

describe('alight summarize', () => {
  it('alight summarize --json prints one object per point with the promised fields', async () => {
    const io = fakeIo(dir);
    expect(await main(['summarize', 'r.jsonl', '--json'], io)).toBe(0);
    const rows = JSON.parse(io.out.join('')) as Record<string, unknown>[];
    expect(rows).toHaveLength(3);
    for (const key of ['point', 'trials', 'landed', 'successRate', 'wilsonLow', 'wilsonHigh', 'cep50', 'cep95', 'outcomes', 'neesMean']) {
      expect(rows[0]).toHaveProperty(key);
    }
    expect(rows.map((r) => r.point)).toEqual([{ 'detector.pixelNoise': 1 }, { 'detector.pixelNoise': 3 }, { 'detector.pixelNoise': 5 }]);
    const r = rows[1] as { trials: number; landed: number; wilsonLow: number; outcomes: Record<string, number> };
    expect(r.trials).toBe(40);
    expect(r.outcomes.landed + r.outcomes['off-pad']).toBe(40);
    expect(r.wilsonLow).toBe(wilson(r.landed, 40).low);
  });

  it('alight summarize refuses truncated and foreign lines with file:line (exit 2)', async () => {
    const lines = readFileSync(join(dir, 'r.jsonl'), 'utf8').split('\n');
    lines.splice(5, 0, 'time,x,y');
    writeFileSync(join(dir, 'bad.jsonl'), lines.join('\n').slice(0, -60));
    const io = fakeIo(dir);
    expect(await main(['summarize', 'bad.jsonl', '--json'], io)).toBe(2);
    const message = io.err.join('');
    expect(message).toContain('bad.jsonl:6: not valid JSON (truncated or foreign line)');
    expect(message).toContain('bad.jsonl:122: cut off (no end of line)');
    expect(message).toContain('--skip-bad');
    expect(io.out).toEqual([]);
  });

  it('alight summarize --skip-bad skips them with a count and never counts them', async () => {
    const io = fakeIo(dir);
    expect(await main(['summarize', 'bad.jsonl', '--json', '--skip-bad'], io)).toBe(0);
    expect(io.err.join('')).toMatch(/skipped 2 bad line\(s\), counted 119 trials/);
    expect(io.err.join('')).toContain('bad.jsonl holds 119 of 120 trials');
    const rows = JSON.parse(io.out.join('')) as { trials: number }[];
    expect(rows.map((r) => r.trials)).toEqual([40, 40, 39]);
  });

  it('alight summarize writes CSV, a success figure and a miss figure as standalone SVG', async () => {
    const io = fakeIo(dir);
    expect(await main(['summarize', 'r.jsonl', '--csv', 'r.csv', '--svg', 's.svg', '--miss-svg', 'm.svg', '--target', '0.8'], io)).toBe(0);
    expect(io.out.join('')).toMatch(/detector\.pixelNoise=3\s+40/);
    expect(io.out.join('')).toContain('clear nothing for flight');
    expect(readFileSync(join(dir, 'r.csv'), 'utf8').split('\n')[0]).toMatch(/^detector\.pixelNoise,trials,landed,successRate/);
    for (const f of ['s.svg', 'm.svg']) {
      const svg = readFileSync(join(dir, f), 'utf8');
      expect(svg.startsWith('<?xml')).toBe(true);
      expect(svg).toContain('xmlns="http://www.w3.org/2000/svg"');
    }
    expect(readFileSync(join(dir, 's.svg'), 'utf8')).toContain('target 0.8');
  });

  it('alight summarize --format csv prints CSV; a non-results file is refused at line 1', async () => {
    const io = fakeIo(dir);
    expect(await main(['summarize', 'r.jsonl', '--format', 'csv'], io)).toBe(0);
    expect(io.out.join('').split('\n')).toHaveLength(5);
    writeFileSync(join(dir, 'other.jsonl'), '{"rows":[]}\n');
    const io2 = fakeIo(dir);
    expect(await main(['summarize', 'other.jsonl'], io2)).toBe(2);
    expect(io2.err.join('')).toMatch(/other\.jsonl:1: not an alight sweep header/);
  });
});
