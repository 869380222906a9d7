// End-to-end sweeps with the real closed-loop trial: bit-identical results for any worker
// count, any sharding, and after a kill followed by --resume.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { buildBundles, type Bundles } from './buildBundles.js';
import { fakeIo } from './fakeIo.js';

const scenario = resolve('data-demo/survey-rover.scenario.json');
const dir = mkdtempSync(join(tmpdir(), 'alight-sweep-cli-'));
let bundles: Bundles;
beforeAll(async () => {
  bundles = await buildBundles();
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
  if (bundles) rmSync(bundles.dir, { recursive: true, force: true });
});

const SWEEP = [scenario, '--vary', 'detector.pixelNoise=1:3:2', '--trials', '6', '--seed', '5'];

async function alight(argv: string[], env: Record<string, string> = {}): Promise<string> {
  const io = fakeIo(dir, { ALIGHT_SWEEP_WORKER: bundles.worker, ...env });
  const code = await main(argv, io);
  expect(code, io.err.join('')).toBe(0);
  return io.out.join('');
}

const read = (name: string) => readFileSync(join(dir, name), 'utf8');

describe('alight sweep (real trials)', () => {
  it('alight sweep --workers 1 and --workers 2 write identical files and summaries', async () => {
    await alight(['sweep', ...SWEEP, '--workers', '1', '--out', 'w1.jsonl']);
    const quiet = fakeIo(dir, { ALIGHT_SWEEP_WORKER: bundles.worker });
    expect(await main(['sweep', ...SWEEP, '--workers', '2', '--out', 'w2.jsonl'], quiet)).toBe(0);
    expect(quiet.err).toEqual([]); // no progress bar when stderr is not a terminal
    expect(read('w1.jsonl').split('\n')).toHaveLength(1 + 12 + 1);
    expect(read('w2.jsonl')).toBe(read('w1.jsonl'));
    const s1 = await alight(['summarize', 'w1.jsonl', '--json']);
    expect(await alight(['summarize', 'w2.jsonl', '--json'])).toBe(s1);
    const rows = JSON.parse(s1) as { trials: number; outcomes: Record<string, number> }[];
    expect(rows.map((r) => r.trials)).toEqual([6, 6]);
    expect(rows.every((r) => Object.values(r.outcomes).reduce((a, b) => a + b, 0) === 6)).toBe(true);
  });

  it('three shards (by --shard, Slurm and Kubernetes indices) merge into the unsharded file byte for byte', async () => {
    await alight(['sweep', ...SWEEP, '--workers', '1', '--shard', '1/3', '--out', 's-{shard}.jsonl']);
    await alight(['sweep', ...SWEEP, '--workers', '2', '--out', 's-{shard}.jsonl'], { SLURM_ARRAY_TASK_ID: '2', SLURM_ARRAY_TASK_MIN: '1', SLURM_ARRAY_TASK_COUNT: '3' });
    await alight(['sweep', ...SWEEP, '--workers', '1', '--shard-count', '3', '--out', 's-{shard}.jsonl'], { JOB_COMPLETION_INDEX: '2' });
    expect(read('s-2.jsonl')).toContain('"shard":{"index":2,"count":3}');
    await alight(['merge', 's-2.jsonl', 's-3.jsonl', 's-1.jsonl', '--out', 'merged.jsonl']);
    expect(read('merged.jsonl')).toBe(read('w1.jsonl'));
    expect(await alight(['summarize', 'merged.jsonl', '--json'])).toBe(await alight(['summarize', 'w1.jsonl', '--json']));
  });

  it('a sweep killed mid-run and resumed equals an uninterrupted one byte for byte', async () => {
    const long = [scenario, '--vary', 'detector.latency=0.05,0.1', '--trials', '40', '--seed', '8'];
    const out = join(dir, 'killed.jsonl');
    const child = spawn(process.execPath, [bundles.cli, 'sweep', ...long, '--workers', '2', '--out', out], { stdio: 'ignore' });
    const exited = new Promise((done) => child.on('exit', done));
    // Kill (SIGKILL: no clean-up) once a few records are on disk.
    for (let i = 0; i < 3000 && child.exitCode === null; i++) {
      if (existsSync(out) && readFileSync(out, 'utf8').split('\n').length > 6) break;
      await new Promise((r) => setTimeout(r, 10));
    }
    child.kill('SIGKILL');
    await exited;
    const partial = readFileSync(out, 'utf8').split('\n').length - 2;
    expect(partial).toBeGreaterThan(4);
    expect(partial).toBeLessThan(80); // it really was interrupted
    const note = fakeIo(dir, { ALIGHT_SWEEP_WORKER: bundles.worker });
    expect(await main(['sweep', ...long, '--workers', '2', '--out', 'killed.jsonl', '--resume'], note)).toBe(0);
    expect(note.out.join('')).toMatch(/ran \d+, kept \d+ already written/);
    await alight(['sweep', ...long, '--workers', '1', '--out', 'whole.jsonl']);
    expect(read('killed.jsonl')).toBe(read('whole.jsonl'));
    expect(await alight(['summarize', 'killed.jsonl', '--json'])).toBe(await alight(['summarize', 'whole.jsonl', '--json']));
  });

  it('alight sweep refuses bad input with a message and exit 2', async () => {
    const cases: [string[], RegExp][] = [
      [[scenario, '--vary', 'detector.pixelNoise=1:3', '--trials', '2', '--out', 'x.jsonl'], /PATH=FROM:TO:COUNT/],
      [[scenario, '--vary', 'detector.noSuchField=1:3:2', '--trials', '2', '--out', 'x.jsonl', '--workers', '2'], /sweep point 0 \{"detector\.noSuchField":1\}: .*unknown scenario field "detector\.noSuchField"/],
      [[scenario, '--vary', 'detector.pixelNoise=-1,1', '--trials', '2', '--out', 'x.jsonl'], /sweep point 0 .*detector\.pixelNoise/],
      [[scenario, '--trials', '2'], /--out FILE is required/],
      [[scenario, '--trials', '2', '--out', 'w1.jsonl'], /already exists: add --resume/],
      [[scenario, '--trials', '2', '--out', 'x.jsonl', '--shard', '4/3'], /1 <= I <= N/],
      [[scenario, '--trials', '2', '--out', 'x.jsonl', '--points', '5'], /--points applies to --design random or lhs/],
    ];
    for (const [argv, message] of cases) {
      const io = fakeIo(dir);
      expect(await main(['sweep', ...argv], io), argv.join(' ')).toBe(2);
      expect(io.err.join('')).toMatch(message);
    }
    expect(existsSync(join(dir, 'x.jsonl'))).toBe(false); // refused before any file was written
  });
});
