import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { tuneLog } from '../../../estimator/io/log/tuneLog.js';
import { writeSyntheticLog } from './syntheticLog.js';

let folder = '';

beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'alight-tune-'));
  writeSyntheticLog(folder, { duration: 10, seed: 5 });
  // The lander "flew" with box noise assumed 4x too large (6 px for 1.5 px): R is 16x too big.
  writeFileSync(join(folder, 'filter.json'), JSON.stringify({ rate: 200, pixelNoise: 6, sizeNoise: 6, odometryNoise: 0.05, accelNoise: 0.05 }));
});

describe('tuneLog', () => {
  it('without truth (NIS + whiteness) finds that R must shrink, and lowers the cost', async () => {
    const result = await tuneLog(folder, { criterion: 'nis', q: [1, 1], gate: [1, 1], r: [0.01, 1], grid: 3, refine: 8 });
    expect(result.criterion).toBe('nis');
    expect(result.baseline.report.nisMean!).toBeLessThan(0.5); // far below 3: the assumed noise is too large
    expect(result.recommended.rScale).toBeLessThan(0.3);
    expect(result.cost).toBeLessThan(result.baseline.cost);
    expect(result.best.nisMean!).toBeGreaterThan(1.5);
    expect(result.surface.length).toBeGreaterThanOrEqual(3);
    expect(result.surface.every((s) => s.q === 1 && s.gate === 1)).toBe(true); // fixed axes stay fixed
  });

  it('with truth chooses NEES by default and improves it', async () => {
    const result = await tuneLog(folder, { q: [1, 1], gate: [1, 1], r: [0.01, 1], grid: 3, refine: 6 });
    expect(result.criterion).toBe('nees');
    const before = Math.abs(Math.log(result.baseline.report.neesMean! / 6));
    const after = Math.abs(Math.log(result.best.neesMean! / 6));
    expect(after).toBeLessThan(before);
    expect(result.caution).toMatch(/clear nothing for flight/);
  });
});

describe('tuneLog refuses', () => {
  it('the NEES criterion on a log without truth', async () => {
    const blind = mkdtempSync(join(tmpdir(), 'alight-tune-blind-'));
    writeSyntheticLog(blind, { duration: 3, truth: false, seed: 6 });
    await expect(tuneLog(blind, { criterion: 'nees', grid: 1, refine: 0 })).rejects.toThrow('tuning by NEES needs truth.csv');
  });
});
