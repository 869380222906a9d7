// Study sizes are refused before any work, with the limit named (a huge sweep once crashed V8
// with a native stack trace); more workers than cores are capped with a note.
import { availableParallelism } from 'node:os';
import { appendFileSync, cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { MAX_SCENARIO_BYTES } from '../../estimator/io/loadScenario.js';
import { MAX_LINE_CHARS } from '../../estimator/io/log/LogStreamReader.js';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { MAX_POINTS, MAX_TRIALS_PER_FILE, MAX_TRIALS_PER_POINT } from '../../estimator/study/studyLimits.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-limits-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
writeFileSync(join(dir, 'sc.json'), '{"version": 1, "duration": 1}\n');

async function run(...argv: string[]) {
  const io = fakeIo(dir);
  const code = await main(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

describe('study limits', () => {
  it('sweep --trials 1e9, 1e8 and 2e7 are refused at once, naming the limit; no file written', async () => {
    for (const trials of ['1e9', '1e8', '2e7']) {
      const started = Date.now();
      const r = await run('sweep', 'sc.json', '--trials', trials, '--workers', '1', '--out', 'big.jsonl');
      expect(r.code).toBe(2);
      expect(r.err).toBe(`alight sweep: ${Number(trials)} trials per point is over the limit of ${MAX_TRIALS_PER_POINT}; a success rate is known to about ±0.3 % at that count, split a bigger study into several sweeps\n`);
      expect(Date.now() - started).toBeLessThan(5000); // refused, not attempted (generous: shared machine)
    }
    expect(existsSync(join(dir, 'big.jsonl'))).toBe(false);
  });

  it('too many points, and too many trials in one file, are refused', async () => {
    const count = await run('sweep', 'sc.json', '--trials', '1', '--vary', `detector.pixelNoise=0:1:${MAX_POINTS + 1}`, '--workers', '1', '--out', 'p.jsonl');
    expect(count.err).toBe(`alight sweep: --vary "detector.pixelNoise=0:1:${MAX_POINTS + 1}": COUNT ${MAX_POINTS + 1} is over the limit of ${MAX_POINTS} points\n`);
    const grid = await run('sweep', 'sc.json', '--trials', '1', '--vary', 'detector.pixelNoise=0:1:200', '--vary', 'detector.latency=0:0.1:200', '--workers', '1', '--out', 'p.jsonl');
    expect(grid.err).toBe(`alight sweep: 40000 sweep points is over the limit of ${MAX_POINTS}; sweep fewer values or use --design lhs with --points M\n`);
    const file = await run('sweep', 'sc.json', '--trials', '1000', '--vary', 'detector.pixelNoise=0:1:1000', '--workers', '1', '--out', 'p.jsonl');
    expect(file.err).toMatch(new RegExp(`^alight sweep: 1000 points x 1000 trials = 1000000 trials is over the limit of ${MAX_TRIALS_PER_FILE} per results file`));
    expect([count.code, grid.code, file.code]).toEqual([2, 2, 2]);
  });

  it('require, sensitivity and tune refuse more trials per point than the limit', async () => {
    const over = String(MAX_TRIALS_PER_POINT + 1);
    for (const argv of [['require', 'sc.json', '--param', 'detector.pixelNoise', '--target', '0.9'], ['sensitivity', 'sc.json'], ['tune', 'sc.json']]) {
      const r = await run(...argv, '--trials', over);
      expect(r.code).toBe(2);
      expect(r.err).toBe(`alight ${argv[0]}: --trials expects an integer from 1 to ${MAX_TRIALS_PER_POINT}, got "${over}"\n`);
    }
  });

  it('a log CSV line of megabytes without a line end is refused naming file and line; an oversized scenario file too', async () => {
    cpSync(resolve('data-demo/logs/harbour-boat'), join(dir, 'long-line'), { recursive: true });
    appendFileSync(join(dir, 'long-line', 'attitude.csv'), '1'.repeat(MAX_LINE_CHARS + 10));
    const lines = readFileSync(join(dir, 'long-line', 'attitude.csv'), 'utf8').split('\n').length;
    const r = await run('replay', 'long-line');
    expect(r.code).toBe(2);
    expect(r.err).toBe(`alight replay: attitude.csv:${lines}: a line of more than ${MAX_LINE_CHARS} characters without a line end: not a CSV of the flight-log layout\n`);
    writeFileSync(join(dir, 'big.json'), `{"version": 1, "name": "${'x'.repeat(MAX_SCENARIO_BYTES)}"}`);
    const big = await run('camera', 'big.json');
    expect(big.code).toBe(2);
    expect(big.err).toMatch(/^alight camera: big\.json: \d+ bytes is over the limit of 16777216 for a scenario file/);
  });

  it('--workers above the core count runs with one worker per core and says so', async () => {
    const cores = availableParallelism();
    const r = await run('sweep', 'sc.json', '--trials', '1', '--workers', String(cores + 62), '--out', 'w.jsonl');
    expect(r.err).toBe(`alight sweep: note: --workers ${cores + 62} is more than the ${cores} cores here; using ${cores}\n`);
    expect(r.code).toBe(0);
  });
});
