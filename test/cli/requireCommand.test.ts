import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { wilson } from '../../estimator/study/statistics/wilson.js';
import { fakeIo } from './fakeIo.js';

const scenario = resolve('data-demo/survey-rover.scenario.json');
const dir = mkdtempSync(join(tmpdir(), 'alight-require-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Probe { value: number; trials: number; landed: number; wilsonLow: number; pass: boolean }

describe('alight require (real trials)', () => {
  it('alight require --json bisects with adaptive batches and reports each probe honestly', async () => {
    const io = fakeIo(dir);
    const argv = ['require', scenario, '--param', 'detector.pixelNoise', '--target', '0.2', '--from', '0.5', '--to', '12',
      '--trials', '20', '--first-batch', '5', '--steps', '1', '--workers', '1', '--json', '--svg', 'req.svg'];
    expect(await main(argv, io), io.err.join('')).toBe(0);
    const r = JSON.parse(io.out.join('')) as { value: number | null; failsAt: number | null; probes: Probe[] };
    expect(r.probes.length).toBeGreaterThanOrEqual(1);
    for (const p of r.probes) {
      expect([5, 10, 20]).toContain(p.trials); // batches double from --first-batch up to --trials
      expect(p.wilsonLow).toBe(wilson(p.landed, p.trials).low);
      expect(p.pass).toBe(p.wilsonLow >= 0.2);
    }
    // The answer is the last passing probe value, and the probe after it failed (or none did).
    const passing = r.probes.filter((p) => p.pass).map((p) => p.value);
    if (r.value !== null) expect(passing).toContain(r.value);
    if (r.failsAt !== null) expect(r.probes.find((p) => p.value === r.failsAt)!.pass).toBe(false);
    expect(readFileSync(join(dir, 'req.svg'), 'utf8')).toContain('target 0.2');
  });
  it('alight require refuses an unreachable target for the trial budget, naming the minimum', async () => {
    const io = fakeIo(dir);
    expect(await main(['require', scenario, '--param', 'detector.latency', '--target', '0.95', '--trials', '50', '--workers', '1'], io)).toBe(2);
    expect(io.err.join('')).toMatch(/--trials 50 can never show 0.95.*at least 73/);
  });
  it('alight require needs --to for a path without a built-in range', async () => {
    const io = fakeIo(dir);
    expect(await main(['require', scenario, '--param', 'guidance.kp', '--target', '0.5'], io)).toBe(2);
    expect(io.err.join('')).toContain('give --to V for guidance.kp');
  });
});
