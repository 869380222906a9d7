import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { mapForLayout, recordingFromLayout } from '../io/ros/recordingFromLayout.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-ingest-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(...argv: string[]) {
  const io = fakeIo(dir);
  const code = await main(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

beforeAll(async () => {
  writeFileSync(join(dir, 'short.scenario.json'), JSON.stringify({ version: 1, name: 'short approach', duration: 20, seed: 4 }));
  expect((await run('record', 'short.scenario.json', '--out', 'log')).code).toBe(0);
  await recordingFromLayout(join(dir, 'log'), join(dir, 'flight.mcap'));
  writeFileSync(join(dir, 'flight.map.json'), JSON.stringify(mapForLayout(join(dir, 'log')), null, 2));
});

describe('alight ingest', () => {
  it('alight ingest <recording> --map --out writes a log that alight replay reads like the recorded one', async () => {
    const ingested = await run('ingest', 'flight.mcap', '--map', 'flight.map.json', '--out', 'from-ros');
    expect(ingested.err).toBe('');
    expect(ingested.code).toBe(0);
    expect(ingested.out).toContain('alight ingest: flight.mcap');
    expect(ingested.out).toMatch(/boxes\s+\/deck\/detections \(vision_msgs\/msg\/Detection2DArray\): \d+ messages -> \d+ rows/);
    expect(ingested.out).toMatch(/next +alight replay from-ros/);
    const a = JSON.parse((await run('replay', 'log', '--json')).out);
    const b = JSON.parse((await run('replay', 'from-ros', '--json')).out);
    expect(b.problems.total).toBe(0);
    expect(b.rows.boxes.used).toBe(a.rows.boxes.used);
    // 1e-9 relative: nanosecond stamps and centre/size boxes (see test/io/ros/ingestRosRecording.test.ts).
    expect(Math.abs(b.nisMean - a.nisMean)).toBeLessThan(1e-9 * a.nisMean);
  });

  it('--json prints the report; an existing log is kept without --force', async () => {
    const first = await run('ingest', 'flight.mcap', '--map', 'flight.map.json', '--out', 'twice', '--json');
    const report = JSON.parse(first.out);
    expect(report.indexed).toBe(true);
    expect(report.files['imu.csv']).toBeGreaterThan(1000);
    const refused = await run('ingest', 'flight.mcap', '--map', 'flight.map.json', '--out', 'twice');
    expect(refused.code).toBe(2);
    expect(refused.err).toContain('alight ingest: twice already holds a log');
    expect((await run('ingest', 'flight.mcap', '--map', 'flight.map.json', '--out', 'twice', '--force')).code).toBe(0);
  });

  it('a recording damaged mid-way leaves --force\'s old log whole and no staging folder behind', async () => {
    expect((await run('ingest', 'flight.mcap', '--map', 'flight.map.json', '--out', 'kept')).code).toBe(0);
    const before = Object.fromEntries(readdirSync(join(dir, 'kept')).map((f) => [f, readFileSync(join(dir, 'kept', f), 'utf8')]));
    const whole = readFileSync(join(dir, 'flight.mcap'));
    const broken = Buffer.from(whole);
    broken.fill(0xff, Math.floor(whole.length / 2), Math.floor(whole.length / 2) + 64); // a record damaged half-way through
    writeFileSync(join(dir, 'cut.mcap'), broken);
    const cut = await run('ingest', 'cut.mcap', '--map', 'flight.map.json', '--out', 'kept', '--force');
    expect(cut.code).toBe(2);
    expect(cut.err).toMatch(/^alight ingest: cut\.mcap: the recording is damaged after log time \d+ ns/); // failed mid-stream, after rows were written
    expect(Object.fromEntries(readdirSync(join(dir, 'kept')).map((f) => [f, readFileSync(join(dir, 'kept', f), 'utf8')]))).toEqual(before);
    expect(readdirSync(dir).filter((f) => f.endsWith('.partial'))).toEqual([]);
  });

  it('exits 2 with file, line and field for a bad map, and names a missing topic', async () => {
    writeFileSync(join(dir, 'bad.map.json'), '{\n  "format": "alight-ros-map",\n  "version": 2\n}\n');
    const bad = await run('ingest', 'flight.mcap', '--map', 'bad.map.json', '--out', 'x');
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('bad.map.json:3: version: must be 1, got 2');
    expect(bad.err).toContain('bad.map.json:1: camera: is required here but missing');

    const map = mapForLayout(join(dir, 'log'));
    writeFileSync(join(dir, 'wrong.map.json'), JSON.stringify({ ...map, imu: { topic: '/imu/raw' } }));
    const missing = await run('ingest', 'flight.mcap', '--map', 'wrong.map.json', '--out', 'y');
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/^alight ingest: flight\.mcap: topic \/imu\/raw \(imu\) is not in the recording; it has these topics: /);
    expect(missing.err).not.toMatch(/\n\s+at /); // no stack trace
    expect(existsSync(join(dir, 'y')) ? readdirSync(join(dir, 'y')) : []).toEqual([]); // nothing half-written

    expect((await run('ingest', 'flight.mcap', '--out', 'z')).err).toContain('say which topics to read with --map map.json');
    expect((await run('ingest', 'nowhere.mcap', '--map', 'flight.map.json', '--out', 'z')).err).toContain('alight ingest: nowhere.mcap: no such file');
  });
});
