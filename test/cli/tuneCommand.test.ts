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
  it('alight tune searches a grid then refines, recommends the lowest-cost setting and writes the surface and heat map', async () => {
    const io = fakeIo(dir);
    const argv = ['tune', scenario, '--trials', '3', '--grid', '2', '--refine', '3', '--gate', '1:1', '--workers', '1', '--json', '--surface', 'surface.csv', '--svg', 'heat.svg'];
    expect(await main(argv, io), io.err.join('')).toBe(0);
    const r = JSON.parse(io.out.join('')) as { recommended: Record<string, number>; cost: number; evaluations: number };
    const rows = readFileSync(join(dir, 'surface.csv'), 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));
    expect(rows.length).toBe(r.evaluations);
    expect(rows.filter((c) => c[4] === 'grid')).toHaveLength(4);
    expect(rows.length).toBeGreaterThan(4); // refinement added settings
    const costs = rows.map((c) => Number(c[3]));
    expect(r.cost).toBe(Math.min(...costs));
    expect(r.recommended['filter.gateScale']).toBe(1);
    const svg = readFileSync(join(dir, 'heat.svg'), 'utf8');
    expect((svg.match(/<title>filter\.qScale /g) ?? []).length).toBe(4);
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
    expect(await main(['tune', scenario, '--criterion', 'nis'], a)).toBe(2);
    expect(a.err.join('')).toContain('--criterion applies to a flight-log folder');
    const b = fakeIo(dir);
    expect(await main(['tune', dir, '--criterion', 'nis'], b)).toBe(2);
    expect(b.err.join('')).toContain('--criterion applies to a scenario, not to flight logs');
    const c = fakeIo(dir);
    expect(await main(['tune', dir, '--free', 'pixelNoise,wobble'], c)).toBe(2);
    expect(c.err.join('')).toContain('--free expects noise terms from pixelNoise');
  });
});
