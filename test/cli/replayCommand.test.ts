import { mkdtempSync, readFileSync, rmSync, writeFileSync, cpSync, unlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { averagedChiSquareInterval } from '../../estimator/stats/chiSquare.js';
import { writeSyntheticLog } from '../io/log/syntheticLog.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-replay-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
beforeAll(() => {
  writeSyntheticLog(join(dir, 'flight'), { duration: 8, seed: 11 });
});

async function run(...argv: string[]) {
  const io = fakeIo(dir);
  const code = await main(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

/** A copy of the synthetic log with one file replaced (or removed when text is null). */
function variant(name: string, file: string, text: string | null): string {
  const folder = join(dir, name);
  cpSync(join(dir, 'flight'), folder, { recursive: true });
  if (text === null) unlinkSync(join(folder, file));
  else writeFileSync(join(folder, file), text);
  return name;
}

describe('alight replay', () => {
  it('alight replay <log> --json prints one object with the promised fields', async () => {
    const { code, out, err } = await run('replay', 'flight', '--json');
    expect(err).toBe('');
    expect(code).toBe(0);
    expect(out.trim().split('\n').length).toBe(1);
    const report = JSON.parse(out);
    for (const stream of ['boxes', 'imu', 'attitude', 'odometry', 'truth']) {
      expect(Object.keys(report.rows[stream])).toEqual(expect.arrayContaining(['read', 'used', 'skipped']));
    }
    expect(report.rows.imu.read).toBe(1601);
    expect(report.nisBounds).toEqual(averagedChiSquareInterval(report.nisCount, 3, 0.95));
    expect(typeof report.nisMean).toBe('number');
    expect(typeof report.gateRejections).toBe('number');
    expect(report.whiteness.tests.length).toBeGreaterThan(0);
    expect(report.whiteness.method).toMatch(/Ljung and Box 1978/);
    expect(report.neesBounds).toEqual(averagedChiSquareInterval(report.neesCount, 6, 0.95));
    expect(report.positionRmse).toBeLessThan(0.2);
    expect(typeof report.velocityRmse).toBe('number');
    expect(typeof report.neesMean).toBe('number');
  });

  it('alight replay <log> prints a summary with bounds, whiteness and the flight caution', async () => {
    const { code, out } = await run('replay', 'flight');
    expect(code).toBe(0);
    expect(out).toMatch(/NIS boxes +\d+\.\d+ \(dim 3, \d+ updates\), 95 % bounds \[\d+\.\d+, \d+\.\d+\]/);
    expect(out).toMatch(/whiteness +(white|NOT white)/);
    expect(out).toMatch(/truth +NEES/);
    expect(out).toContain('clear nothing for flight');
  });

  it('alight replay --out writes the state and covariance diagonal after every IMU step', async () => {
    const json = JSON.parse((await run('replay', 'flight', '--json', '--out', 'est.csv')).out);
    const lines = readFileSync(join(dir, 'est.csv'), 'utf8').trim().split('\n');
    expect(lines[0]).toBe('time,rx,ry,rz,vcx,vcy,vcz,vlx,vly,vlz,bax,bay,baz,P_rx,P_ry,P_rz,P_vcx,P_vcy,P_vcz,P_vlx,P_vly,P_vlz,P_bax,P_bay,P_baz');
    expect(lines.length - 1).toBe(json.filterSteps + 1);
    const last = lines.at(-1)!.split(',').map(Number);
    expect(last[0]).toBe(8);
    expect(last.every(Number.isFinite)).toBe(true);
    expect(last.slice(13).every((v) => v > 0)).toBe(true); // variances
  });

  it('alight replay --filter with the deck-scale state shows its estimate (text, --json) and writes its column with --out', async () => {
    writeFileSync(join(dir, 'scale.json'), '{ "deckScaleSigma": 0.05 }');
    const json = JSON.parse((await run('replay', 'flight', '--json', '--filter', 'scale.json', '--out', 'est-scale.csv')).out);
    expect(json.filter.deckScaleSigma).toBe(0.05);
    expect(json.deckScaleEstimate.sigma).toBeGreaterThan(0);
    expect(json.deckScaleEstimate.sigma).toBeLessThanOrEqual(0.05); // never above its prior
    const header = readFileSync(join(dir, 'est-scale.csv'), 'utf8').split('\n')[0]!.split(',');
    expect(header).toHaveLength(1 + 2 * 13);
    expect([header[13], header[26]]).toEqual(['deck_scale', 'P_deck_scale']);
    expect((await run('replay', 'flight', '--filter', 'scale.json')).out).toMatch(/\n {2}deck scale [+-]\d+\.\d % ± \d+\.\d % \(1 sigma\) at the end/);
    expect((await run('replay', 'flight')).out).not.toContain('deck scale');
    expect('deckScaleEstimate' in JSON.parse((await run('replay', 'flight', '--json')).out)).toBe(false);
  });

  it('alight replay --filter applies a partial FilterSpec and refuses a bad one with file, line and field', async () => {
    writeFileSync(join(dir, 'good.json'), '{ "rScale": 2, "gateScale": 1.5 }');
    const good = JSON.parse((await run('replay', 'flight', '--json', '--filter', 'good.json')).out);
    expect([good.filter.rScale, good.filter.gateScale, good.filter.pixelNoise]).toEqual([2, 1.5, 1.5]); // pixelNoise from the log's filter.json
    writeFileSync(join(dir, 'bad.json'), '{\n  "rScale": 1,\n  "qScale": -3,\n  "pixelNois": 2\n}');
    const bad = await run('replay', 'flight', '--filter', 'bad.json');
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('bad.json:3: qScale: must be > 0, got -3');
    expect(bad.err).toContain('bad.json:4: pixelNois: unknown key');
    expect(bad.err).not.toMatch(/\n\s+at /); // no stack trace
    writeFileSync(join(dir, 'broken.json'), '{ "rScale": }');
    const broken = await run('replay', 'flight', '--filter', 'broken.json');
    expect(broken.code).toBe(2);
    expect(broken.err).toMatch(/^alight replay: broken.json:1:\d+: /);
  });

  it('reports bad rows with file, line and column and counts them as skipped', async () => {
    const lines = readFileSync(join(dir, 'flight', 'attitude.csv'), 'utf8').split('\n');
    [lines[40], lines[41]] = [lines[41]!, lines[40]!]; // two rows out of order
    const folder = variant('unsorted', 'attitude.csv', lines.join('\n'));
    const { code, out } = await run('replay', folder, '--json');
    expect(code).toBe(0);
    const report = JSON.parse(out);
    expect(report.rows.attitude.skipped).toBe(1);
    expect(report.problems.shown).toEqual([{ kind: 'unsorted-time', file: 'attitude.csv', line: 42, column: 'time', message: expect.stringContaining('earlier than the previous row') }]);
    const text = await run('replay', folder);
    expect(text.out).toContain('attitude.csv:42 time: time 0.195 is earlier');
  });

  it('exits 2 with a message and no stack trace for a missing folder, file, column or a bad camera.json', async () => {
    const cases: [string[], string][] = [
      [['replay', 'nowhere'], 'alight replay: nowhere: no such log folder'],
      [['replay', variant('no-imu', 'imu.csv', null)], 'alight replay: imu.csv: missing'],
      [['replay', variant('no-column', 'boxes.csv', 'time,xMin,yMin,xMax\n1,2,3,4\n')], 'alight replay: boxes.csv:1 yMax: missing column "yMax"'],
      [['replay', variant('bad-camera', 'camera.json', '{"format":"alight-log","version":1,"width":640,"height":480,"intrinsics":{"fx":500,"fy":500,"cx":320,"cy":900},"targetSize":1}')], 'alight replay: camera.json:1 intrinsics.cy: expected a number in [0, height=480] (px), got 900'],
      [['replay', variant('old-camera', 'camera.json', '{"format":"alight-log","version":7}')], 'camera.json:1 version: this alight reads log layout version 1, got 7'],
      [['replay'], 'alight replay: give one log folder'],
      [['replay', 'flight', '--lags', '0'], '--lags expects an integer from 1 to 1000'],
    ];
    for (const [argv, message] of cases) {
      const { code, err } = await run(...argv);
      expect(code, argv.join(' ')).toBe(2);
      expect(err, argv.join(' ')).toContain(message);
      expect(err).not.toMatch(/\n\s+at /);
    }
  });
});
