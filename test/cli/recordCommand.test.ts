import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-record-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
beforeAll(() => {
  writeFileSync(join(dir, 'short.scenario.json'), JSON.stringify({ version: 1, name: 'short approach', duration: 20, seed: 4 }));
});

async function run(...argv: string[]) {
  const io = fakeIo(dir);
  const code = await main(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

describe('alight record', () => {
  it('alight record <scenario> --out <folder> writes a log that alight replay reproduces exactly', async () => {
    const recorded = await run('record', 'short.scenario.json', '--out', 'log', '--seed', '9');
    expect(recorded.err).toBe('');
    expect(recorded.code).toBe(0);
    expect(recorded.out).toContain('alight record: short approach (seed 9) -> log');
    expect(recorded.out).toContain(SAFETY_CAUTION);
    for (const f of ['camera.json', 'filter.json', 'boxes.csv', 'imu.csv', 'attitude.csv', 'odometry.csv', 'truth.csv', 'onboard.csv']) expect(existsSync(join(dir, 'log', f)), f).toBe(true);
    expect(readFileSync(join(dir, 'log', 'boxes.csv'), 'utf8').split('\n')[0]).toBe('time,arrival,xMin,yMin,xMax,yMax,score');
    const replay = JSON.parse((await run('replay', 'log', '--json')).out);
    // Exact: shortest round-trip numbers, same calls in the same order (see test/io/log/recordTrial.test.ts).
    expect(replay.onboard.maxStateDifference).toBe(0);
    expect(replay.onboard.compared).toBeGreaterThan(100);
    expect(replay.problems.total).toBe(0);
  });

  it('refuses to overwrite a log without --force, and --no-truth leaves truth.csv out', async () => {
    await run('record', 'short.scenario.json', '--out', 'again');
    const refused = await run('record', 'short.scenario.json', '--out', 'again');
    expect(refused.code).toBe(2);
    expect(refused.err).toContain('alight record: again already holds a log');
    const forced = await run('record', 'short.scenario.json', '--out', 'again', '--force', '--no-truth');
    expect(forced.code).toBe(0);
    expect(existsSync(join(dir, 'again', 'truth.csv'))).toBe(false); // the old log's truth does not linger
    expect(existsSync(join(dir, 'again', 'onboard.csv'))).toBe(true);
  });

  it('exits 2 with a message for a missing --out, a bad seed or a bad scenario', async () => {
    writeFileSync(join(dir, 'bad.scenario.json'), '{ "version": 1, "duration": -5 }');
    const cases: [string[], string][] = [
      [['record', 'short.scenario.json'], 'alight record: say where to write the log with --out <log-folder>'],
      [['record', 'short.scenario.json', '--out', 'x', '--seed', '-1'], '--seed expects a non-negative integer'],
      [['record', 'bad.scenario.json', '--out', 'y'], 'duration'],
      [['record', 'short.scenario.json', '--out', 'short.scenario.json/log'], 'alight record: cannot write short.scenario.json/log (ENOTDIR)'],
    ];
    for (const [argv, message] of cases) {
      const { code, err } = await run(...argv);
      expect(code, argv.join(' ')).toBe(2);
      expect(err).toContain(message);
      expect(err).not.toMatch(/\n\s+at /);
    }
  });
});
