import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { fakeIo } from './fakeIo.js';

const scenario = resolve('data-demo/survey-rover.scenario.json');
const dir = mkdtempSync(join(tmpdir(), 'alight-tune-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('alight tune (real trials)', () => {
  it('alight tune <scenario> identifies the noise from recorded trials and reports the landing trade-off as its non-dominated settings', async () => {
    const io = fakeIo(dir);
    const argv = ['tune', scenario, '--logs', '1', '--free', 'pixelNoise,odometryNoise', '--trials', '3', '--grid', '2', '--workers', '1', '--json', '--surface', 'tradeoff.csv', '--svg', 'tradeoff.svg'];
    expect(await main(argv, io), io.err.join('')).toBe(0);
    const r = JSON.parse(io.out.join('')) as {
      recommended: Record<string, number>; evaluations: number; trialsPerSetting: number;
      identified: { term: string; status: string }[];
      tradeOff: { front: number[]; chosen: number | null; settings: { qScale: number; rScale: number; nonDominated: boolean; neesDistance: number | null; summary: { successRate: number } }[] };
    };
    expect(r.identified.map((t) => t.term)).toEqual(['pixelNoise', 'odometryNoise']);
    expect(r.evaluations).toBe(4);
    expect(r.trialsPerSetting).toBe(3);
    const settings = r.tradeOff.settings;
    expect(settings.map((s) => [s.qScale, s.rScale])).toEqual([[0.25, 0.25], [0.25, 4], [4, 0.25], [4, 4]]);
    // Non-dominated: no other setting is at least as good on both objectives and better on one.
    for (const [i, s] of settings.entries()) {
      const dominated = settings.some((o, j) => j !== i && o.neesDistance !== null && s.neesDistance !== null &&
        o.summary.successRate >= s.summary.successRate && o.neesDistance <= s.neesDistance &&
        (o.summary.successRate > s.summary.successRate || o.neesDistance < s.neesDistance));
      if (s.neesDistance !== null) expect(s.nonDominated, `setting ${i}`).toBe(!dominated);
    }
    expect(r.tradeOff.front.length).toBeGreaterThanOrEqual(1);
    if (r.tradeOff.chosen !== null) expect(r.recommended['filter.qScale']).toBe(settings[r.tradeOff.chosen]!.qScale);
    const rows = readFileSync(join(dir, 'tradeoff.csv'), 'utf8').trim().split('\n');
    expect(rows).toHaveLength(5);
    expect(readFileSync(join(dir, 'tradeoff.svg'), 'utf8')).toContain('Landing success against consistency');
  });
  it('alight tune <log-folder> identifies the named noise terms with intervals and compares the recommended setting', async () => {
    const record = fakeIo(dir);
    expect(await main(['record', scenario, '--out', 'log'], record), record.err.join('')).toBe(0);
    const io = fakeIo(dir);
    expect(await main(['tune', 'log', '--free', 'pixelNoise,odometryNoise', '--json', '--surface', 'profiles.csv'], io), io.err.join('')).toBe(0);
    const r = JSON.parse(io.out.join('')) as {
      criterion: string; cost: number; baselineCost: number; evaluations: number; caution: string;
      recommended: Record<string, number>; identified: { term: string; status: string; recommended: number }[];
      current: { boxes: { verdict: string } }; recommendedCheck: { boxes: { verdict: string } };
    };
    expect(r.criterion).toBe('likelihood');
    expect(r.identified.map((t) => t.term)).toEqual(['pixelNoise', 'odometryNoise']);
    expect(r.cost).toBeLessThan(r.baselineCost);
    // The version-0.1 fields stay: the multipliers (held) and now the identified terms beside them.
    expect(r.recommended['filter.qScale']).toBe(1);
    expect(r.recommended['filter.pixelNoise']).toBe(r.identified[0]!.recommended);
    expect(['consistent', 'over-confident', 'under-confident']).toContain(r.recommendedCheck.boxes.verdict);
    const rows = readFileSync(join(dir, 'profiles.csv'), 'utf8').trim().split('\n');
    expect(rows[0]).toBe('term,value,rise');
    expect(rows.filter((l) => l.startsWith('pixelNoise,')).length).toBeGreaterThanOrEqual(3);
    expect(r.caution).toContain('clear nothing for flight');
    const text = fakeIo(dir);
    expect(await main(['tune', 'log', '--free', 'odometryNoise'], text), text.err.join('')).toBe(0);
    expect(text.out.join('')).toMatch(/odometryNoise +\S+ m\/s \(95 %: /);
    expect(text.out.join('')).toContain('box NIS (dim 3)');
  });
  it('alight tune refuses log-only options for a scenario, scenario-only options and unknown terms for a log (exit 2)', async () => {
    const a = fakeIo(dir);
    expect(await main(['tune', scenario, '--filter', 'x.json'], a)).toBe(2);
    expect(a.err.join('')).toContain('--filter applies to flight-log folders');
    const b = fakeIo(dir);
    expect(await main(['tune', dir, '--criterion', 'nis'], b)).toBe(2);
    expect(b.err.join('')).toContain('--criterion belonged to the multiplier search');
    const d = fakeIo(dir);
    expect(await main(['tune', dir, '--trials', '4'], d)).toBe(2);
    expect(d.err.join('')).toContain('--trials applies to a scenario, not to flight logs');
    const c = fakeIo(dir);
    expect(await main(['tune', dir, '--free', 'pixelNoise,wobble'], c)).toBe(2);
    expect(c.err.join('')).toContain('--free expects noise terms from pixelNoise');
  });
});
