// Every shell example in README.md runs, as a new user would type it, on a fresh build in a
// temporary folder holding a copy of data-demo/. Blocks fenced ```sh run in order in that
// folder (later examples read what earlier ones wrote); a block fenced ```sh norun is not run
// (installs and servers: `npm test` itself is what CI runs), see DEVELOPERS.md. A block that
// uses Slurm's variables runs once per array task of its #SBATCH --array line, with the
// variables Slurm would set. JSON blocks that are analysis files or camera.json are parsed by
// the same code the commands use.
//
// Sizes only are reduced (and one worker thread), so the examples stay lean on CI's two cores (see leanArgs in
// readmeShim.mjs): trials per point, COUNT of --vary ranges, require's probes, tune's
// recorded logs, grid and identified terms.
// Options, files and the order of commands are the README's own.
import { execFileSync } from 'node:child_process';
import { chmodSync, cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseLogCameraText } from '../../estimator/io/log/parseLogCamera.js';
import { parseAnalysis } from '../../notebooks/analysis/parseAnalysis.js';
import { studyById } from '../../notebooks/studies/studies.js';
import { buildBundles, type Bundles } from '../cli/buildBundles.js';
import { readmeBlocks, shellCommands } from './readmeBlocks.js';

const repo = resolve('.');
const readme = readFileSync(join(repo, 'README.md'), 'utf8');
const blocks = readmeBlocks(readme);
const work = mkdtempSync(join(tmpdir(), 'alight-readme-'));
let bundles: Bundles;

beforeAll(async () => {
  // Built inside dist/ so the bundle finds the installation's data-demo/ (alight report does).
  bundles = await buildBundles(join(repo, 'dist'));
  cpSync(join(repo, 'data-demo'), join(work, 'data-demo'), { recursive: true });
  const bin = join(work, '.bin');
  cpSync(join(repo, 'test', 'readme', 'readmeShim.mjs'), join(bin, 'readmeShim.mjs'));
  for (const name of ['alight', 'npx']) {
    writeFileSync(join(bin, name), `#!/bin/sh\nexec "${process.execPath}" "${join(bin, 'readmeShim.mjs')}" "${name}" "$@"\n`);
    chmodSync(join(bin, name), 0o755);
  }
}, 120_000);
afterAll(() => {
  rmSync(work, { recursive: true, force: true });
  if (bundles) rmSync(bundles.dir, { recursive: true, force: true });
});

function runShell(script: string, extraEnv: Record<string, string> = {}): { code: number; output: string } {
  const env = { ...process.env, PATH: `${join(work, '.bin')}:${process.env.PATH}`, ALIGHT_README_CLI: bundles.cli, ALIGHT_SWEEP_WORKER: bundles.worker, ...extraEnv };
  try {
    const output = execFileSync('/bin/sh', ['-e', '-c', script], { cwd: work, env, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], maxBuffer: 64 << 20 });
    return { code: 0, output };
  } catch (error) {
    const e = error as { status?: number; stdout?: string; stderr?: string };
    return { code: e.status ?? -1, output: `${e.stdout ?? ''}${e.stderr ?? ''}` };
  }
}

describe('README.md examples', () => {
  it('has shell examples to run, and every line of a runnable block is an alight command (or mkdir -p)', () => {
    const runnable = blocks.filter((b) => b.lang === 'sh' && !b.norun);
    expect(runnable.length).toBeGreaterThanOrEqual(3);
    for (const block of runnable) {
      for (const command of shellCommands(block.text)) {
        expect(command, `README.md:${block.line}: mark the block \`\`\`sh norun or make it an alight command`).toMatch(/^((npx )?alight( |$)|mkdir -p )/);
      }
    }
    // The marker is used sparingly: the two install blocks (what CI runs) and ROS 2 ingest, whose
    // demo recording (flight.mcap) is not shipped yet.
    expect(blocks.filter((b) => b.norun).length).toBeLessThanOrEqual(3);
  });

  const runnable = blocks.filter((b) => b.lang === 'sh' && !b.norun);
  for (const block of runnable) {
    const first = shellCommands(block.text)[0] ?? '';
    it(`README.md:${block.line}: ${first.slice(0, 70)}`, () => {
      const array = /^#SBATCH --array=(\d+)-(\d+)/m.exec(block.text);
      if (block.text.includes('$SLURM_') && array) {
        const [lo, hi] = [Number(array[1]), Number(array[2])];
        for (let id = lo; id <= hi; id++) {
          const r = runShell(block.text, { SLURM_ARRAY_TASK_ID: String(id), SLURM_ARRAY_TASK_MIN: String(lo), SLURM_ARRAY_TASK_MAX: String(hi), SLURM_ARRAY_TASK_COUNT: String(hi - lo + 1), SLURM_CPUS_PER_TASK: '1' });
          expect(r.code, `array task ${id}:\n${r.output}`).toBe(0);
        }
        return;
      }
      const r = runShell(block.text);
      expect(r.code, r.output).toBe(0);
      expect(r.output).not.toMatch(/internal error|\bat \w+ \(/);
    }, 300_000);
  }

  it('the analysis files and camera.json shown as JSON are accepted by the code that reads them', () => {
    const json = blocks.filter((b) => b.lang === 'json');
    const analyses = json.filter((b) => b.text.includes('"study"'));
    const cameras = json.filter((b) => b.text.includes('"alight-log"'));
    expect(analyses.length + cameras.length).toBeGreaterThanOrEqual(2);
    for (const b of analyses) expect(() => parseAnalysis(b.text, `README.md:${b.line}`, (id) => studyById(id).parameters)).not.toThrow();
    for (const b of cameras) expect(() => parseLogCameraText(b.text)).not.toThrow();
  });
});
