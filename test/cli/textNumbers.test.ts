// Text output rounds to what a number supports and names its unit; --json keeps full precision
// without float noise on values that are whole multiples of the step.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { decimalsFor, decimalsIn, percent, quantity } from '../../estimator/study/formatNumbers.js';
import { main } from '../../estimator/cli/main.js';
import { scenarioUnit } from '../../estimator/io/scenarioUnit.js';
import { findRequirement } from '../../estimator/study/findRequirement.js';
import { PHASES } from '../../estimator/sim/TrialResult.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-numbers-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('numbers in text output', () => {
  it('rounds to the step, keeps the digits a user wrote, and reads units from the schema', () => {
    expect(decimalsFor((8 - 0.5) / 64)).toBe(1); // step 0.117: tenths resolve it
    expect(decimalsFor((0.2 - 0.02) / 64)).toBe(3);
    expect(decimalsFor(5)).toBe(0);
    expect(decimalsIn(0.02)).toBe(2);
    expect(quantity(4.015625, 2, 'px')).toBe('4.02 px');
    expect(percent(0.925)).toBe('92.5 %');
    expect(scenarioUnit('detector.latency')).toBe('s');
    expect(scenarioUnit('detector.pixelNoise')).toBe('px');
    expect(scenarioUnit('localization.misalignmentDeg')).toBe('deg');
    expect(scenarioUnit('detector.dropout')).toBe(''); // a probability has no unit
  });

  it('a probe whose Wilson interval straddles the target is inconclusive, not a miss', async () => {
    // 37 of 40 landed: 92.5 %, Wilson 95 % 0.801-0.974 straddles 0.9 (Wilson 1927, score interval)
    const landed = (value: number, _probe: number, start: number, end: number) => Promise.resolve(value < 1 ? end - start : value < 3 ? Math.round((end - start) * 0.925) : 0);
    const r = await findRequirement({ from: 0, to: 4, target: 0.9, maxTrials: 40, firstBatch: 40, steps: 1, landedCount: landed });
    expect(r.probes.map((p) => p.verdict)).toEqual(['meets', 'misses', 'inconclusive']);
    expect(r.probes.map((p) => p.pass)).toEqual([true, false, false]);
  });

  it('alight require prints every probe it counts, with verdict words and the unit', async () => {
    writeFileSync(join(dir, 'sc.json'), '{"version": 1, "duration": 4, "seed": 2}');
    const io = fakeIo(dir);
    const argv = ['require', 'sc.json', '--param', 'detector.latency', '--target', '0.2', '--from', '0.02', '--to', '0.5', '--trials', '10', '--first-batch', '5', '--steps', '1', '--workers', '1'];
    expect(await main(argv, io), io.err.join('')).toBe(0);
    const out = io.out.join('');
    const count = Number(/^(\d+) probes, \d+ trials/m.exec(out)![1]);
    const rows = out.split('\n').filter((l) => /^ +\d+\. /.test(l));
    expect(rows).toHaveLength(count);
    for (const row of rows) expect(row).toMatch(/^ +\d+\. +0\.\d{2} s +\d+\/\d+ landed \(\d+\.\d %\), Wilson 95 % \d+\.\d % to \d+\.\d %: (meets|misses|inconclusive)$/);
    expect(out).not.toMatch(/\d\.\d{4,}/); // no false precision anywhere
    expect(io.err.join('')).toBe(''); // not a terminal: no progress lines
  });

  it('simulate --json phase times carry no float noise: each is its step count over the rate', async () => {
    const io = fakeIo(process.cwd());
    expect(await main(['simulate', 'data-demo/survey-rover.scenario.json', '--json'], io)).toBe(0);
    const r = JSON.parse(io.out.join('')) as { phaseTimes: Record<string, number> };
    const rate = 100; // the demo's filter.rate (Hz)
    for (const phase of PHASES) {
      const t = r.phaseTimes[phase]!;
      expect(t, phase).toBe(Math.round(t * rate) / rate);
    }
  });
});
