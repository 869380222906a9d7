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
  it('alight tune <log-folder> replays a recorded log per setting and recommends the lowest NIS cost', async () => {
    const record = fakeIo(dir);
    expect(await main(['record', scenario, '--out', 'log'], record), record.err.join('')).toBe(0);
    const io = fakeIo(dir);
    expect(await main(['tune', 'log', '--criterion', 'nis', '--grid', '2', '--refine', '2', '--json', '--surface', 'log-surface.json'], io), io.err.join('')).toBe(0);
    const r = JSON.parse(io.out.join('')) as { criterion: string; cost: number; baselineCost: number; evaluations: number; caution: string };
    expect(r.criterion).toBe('nis');
    const surface = JSON.parse(readFileSync(join(dir, 'log-surface.json'), 'utf8')) as { score: number; stage: string }[];
    expect(surface).toHaveLength(r.evaluations);
    expect(surface.filter((s) => s.stage === 'grid')).toHaveLength(8);
    expect(r.cost).toBe(Math.min(...surface.map((s) => s.score)));
    expect(r.caution).toContain('clear nothing for flight');
  });
  it('alight tune refuses log-only options for a scenario and a bad --criterion for a log (exit 2)', async () => {
    const a = fakeIo(dir);
    expect(await main(['tune', scenario, '--criterion', 'nis'], a)).toBe(2);
    expect(a.err.join('')).toContain('--criterion applies to a flight-log folder');
    const b = fakeIo(dir);
    expect(await main(['tune', dir, '--criterion', 'foo'], b)).toBe(2);
    expect(b.err.join('')).toContain('--criterion expects nis or nees');
  });
});
