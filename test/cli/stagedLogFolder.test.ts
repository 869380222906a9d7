import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { commitStaging, discardStaging, startStaging } from '../../estimator/cli/stagedLogFolder.js';
import { main } from '../../estimator/cli/main.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-staging-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('staged log folders', () => {
  it('a log stopped before its commit leaves no folder under the target name, and replay says so', async () => {
    const target = join(dir, 'stopped');
    const staging = startStaging(target);
    writeFileSync(join(staging, 'imu.csv'), 'time,gx,gy,gz,ax,ay,az\n0,0,0,0,0,0,-9.8'); // cut mid-row, as a kill leaves it
    expect(existsSync(target)).toBe(false);
    expect(readdirSync(dir)).toEqual([`.stopped.${process.pid}.partial`]); // hidden, and named unfinished
    const io = fakeIo(dir);
    expect(await main(['replay', 'stopped'], io)).toBe(2);
    discardStaging(staging);
    expect(readdirSync(dir)).toEqual([]);
  });

  it('commit into an existing folder replaces the old log files, drops a stale one and keeps other files', () => {
    const target = join(dir, 'old');
    mkdirSync(target);
    writeFileSync(join(target, 'truth.csv'), 'old truth');
    writeFileSync(join(target, 'imu.csv'), 'old imu');
    writeFileSync(join(target, 'notes.txt'), 'mine');
    const staging = startStaging(target);
    writeFileSync(join(staging, 'imu.csv'), 'new imu');
    commitStaging(staging, target, ['imu.csv', 'truth.csv']);
    expect(readdirSync(target).sort()).toEqual(['imu.csv', 'notes.txt']);
    expect(readFileSync(join(target, 'imu.csv'), 'utf8')).toBe('new imu');
    expect(existsSync(staging)).toBe(false);
  });

  it('alight record writes through a staging folder and leaves none behind', async () => {
    writeFileSync(join(dir, 'short.scenario.json'), JSON.stringify({ version: 1, name: 'short approach', duration: 20, seed: 4 }));
    const io = fakeIo(dir);
    expect(await main(['record', 'short.scenario.json', '--out', 'rec'], io), io.err.join('')).toBe(0);
    expect(readdirSync(join(dir, 'rec'))).toContain('boxes.csv');
    expect(readdirSync(dir).filter((f) => f.endsWith('.partial'))).toEqual([]);
  });
});
