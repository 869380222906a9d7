import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { differenceInterval } from '../../estimator/study/statistics/differenceInterval.js';
import { fakeIo } from './fakeIo.js';

const scenario = resolve('data-demo/survey-rover.scenario.json');
const dir = mkdtempSync(join(tmpdir(), 'alight-sensitivity-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Row { path: string; loss: number; lossLow: number; lossHigh: number; good: { landed: number; trials: number }; bad: { landed: number; trials: number } }

describe('alight sensitivity (real trials)', () => {
  it('alight sensitivity --json ranks the given impairments by success lost, with Newcombe intervals', async () => {
    const io = fakeIo(process.cwd());
    const argv = ['sensitivity', scenario, '--vary', 'lander.wind.speed=0:10', '--vary', 'detector.dropout=0:0.6', '--trials', '5', '--workers', '1', '--json', '--svg', join(dir, 'rank.svg')];
    expect(await main(argv, io), io.err.join('')).toBe(0);
    const rows = JSON.parse(io.out.join('')) as Row[];
    expect(rows.map((r) => r.path).sort()).toEqual(['detector.dropout', 'lander.wind.speed']);
    expect(rows[0]!.loss).toBeGreaterThanOrEqual(rows[1]!.loss);
    for (const r of rows) {
      expect(r.good.trials).toBe(5);
      const d = differenceInterval(r.good.landed, 5, r.bad.landed, 5);
      expect([r.loss, r.lossLow, r.lossHigh]).toEqual([d.difference, d.low, d.high]);
    }
    const svg = readFileSync(join(dir, 'rank.svg'), 'utf8');
    expect(svg).toContain('lander.wind.speed 0 → 10');
    expect(svg).toContain('detector.dropout 0 → 0.6');
  });
  it('alight sensitivity text gives rates in whole percent for 3 trials (one trial moves a rate by 33 %)', async () => {
    const io = fakeIo(process.cwd());
    expect(await main(['sensitivity', scenario, '--vary', 'lander.wind.speed=0:10', '--trials', '3', '--workers', '1'], io), io.err.join('')).toBe(0);
    const row = io.out.join('').split('\n')[1]!;
    expect(row).toMatch(/^lander\.wind\.speed 0 -> 10 +(0|33|67|100) % -> (0|33|67|100) % +-?\d+ pts \(-?\d+ \.\. -?\d+\)$/);
  });
  it('alight sensitivity refuses an unknown path before running any trial', async () => {
    const io = fakeIo(process.cwd());
    expect(await main(['sensitivity', scenario, '--vary', 'detector.pixelNoize=0:1', '--workers', '1'], io)).toBe(2);
    expect(io.err.join('')).toContain('unknown scenario field "detector.pixelNoize"');
  });
});
