// A sweep killed with SIGKILL (no clean-up at all) mid-run and continued with --resume writes
// exactly the bytes of an uninterrupted run: with 1 worker, with 2 workers, and for a shard.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { buildBundles, type Bundles } from './buildBundles.js';
import { fakeIo } from './fakeIo.js';

const scenario = resolve('data-demo/survey-rover.scenario.json');
const dir = mkdtempSync(join(tmpdir(), 'alight-kill-'));
let bundles: Bundles;
beforeAll(async () => {
  bundles = await buildBundles();
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
  if (bundles) rmSync(bundles.dir, { recursive: true, force: true });
});

const SWEEP = [scenario, '--vary', 'detector.latency=0.05,0.1', '--trials', '30', '--seed', '4'];
const read = (name: string) => readFileSync(join(dir, name), 'utf8');

async function alight(argv: string[]): Promise<string> {
  const io = fakeIo(dir, { ALIGHT_SWEEP_WORKER: bundles.worker });
  expect(await main(argv, io), io.err.join('')).toBe(0);
  return io.out.join('');
}

/** Run the bundled CLI, SIGKILL it once `records` trial lines are on disk; returns the lines left. */
async function killMidway(argv: string[], out: string, records: number): Promise<number> {
  const child = spawn(process.execPath, [bundles.cli, ...argv], { cwd: dir, stdio: 'ignore', env: { ...process.env, ALIGHT_SWEEP_WORKER: bundles.worker } });
  const exited = new Promise((done) => child.on('exit', done));
  for (let i = 0; i < 6000 && child.exitCode === null; i++) {
    if (existsSync(join(dir, out)) && read(out).split('\n').length > records + 1) break;
    await new Promise((r) => setTimeout(r, 5));
  }
  child.kill('SIGKILL');
  await exited;
  return read(out).split('\n').length - 2;
}

describe('kill -9 and --resume', () => {
  const cases: [string, string[], string][] = [
    ['1 worker', ['--workers', '1'], 'whole.jsonl'],
    ['2 workers', ['--workers', '2'], 'whole.jsonl'],
    ['shard 2/3 with 2 workers', ['--workers', '2', '--shard', '2/3'], 'shard-whole.jsonl'],
  ];
  beforeAll(async () => {
    await alight(['sweep', ...SWEEP, '--workers', '1', '--out', 'whole.jsonl']);
    await alight(['sweep', ...SWEEP, '--workers', '1', '--shard', '2/3', '--out', 'shard-whole.jsonl']);
  });
  for (const [label, options, reference] of cases) {
    it(`${label}: killed mid-run, resumed, byte-identical to an uninterrupted run`, async () => {
      const out = `killed-${label.replace(/\W+/g, '-')}.jsonl`;
      const left = await killMidway(['sweep', ...SWEEP, ...options, '--out', out], out, 4);
      const total = read(reference).split('\n').length - 2;
      expect(left).toBeGreaterThanOrEqual(3);
      expect(left).toBeLessThan(total); // it really was interrupted
      const note = await alight(['sweep', ...SWEEP, ...options, '--out', out, '--resume']);
      expect(note).toMatch(/ran \d+, kept \d+ already written/);
      expect(read(out)).toBe(read(reference));
    });
  }
});
