// The benchmark is a promise to users' scripts (`npm run bench -- --json`): it must bundle, find
// its sections and refuse an unknown one. Runs none of the timed work.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { build } from 'esbuild';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
let dir = '';
let bundle = '';

beforeAll(async () => {
  // inside dist/ so the bundle finds data-demo/ above it, as dist/bench.mjs does
  mkdirSync(join(root, 'dist'), { recursive: true });
  dir = mkdtempSync(join(root, 'dist', 'bench-test-'));
  bundle = join(dir, 'bench.mjs');
  await build({ entryPoints: [join(root, 'test/bench/main.ts')], outfile: bundle, bundle: true, platform: 'node', format: 'esm', target: 'node20', packages: 'external', logLevel: 'error' });
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('the bundled benchmark', () => {
  it('lists its sections when asked for one it does not have, and exits 2', () => {
    const run = spawnSync(process.execPath, [bundle, '--json', '--only=no-such-section'], { encoding: 'utf8' });
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('bench: no section named no-such-section; sections: ekf, world, sweep, replay, trial, page, import, tune');
    expect(run.stdout).toBe('');
  });

  it('refuses an unknown section run on its own the same way, without a stack trace', () => {
    const run = spawnSync(process.execPath, [bundle, '--section=no-such-section'], { encoding: 'utf8' });
    expect(run.status).toBe(2);
    expect(run.stderr).toBe('bench: no section named no-such-section; sections: ekf, world, sweep, replay, trial, page, import, tune\n');
  });
});
