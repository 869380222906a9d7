// The README's Slurm array job on a real (one-node) Slurm cluster: 4 array tasks run the shards,
// `alight merge` joins them, and the merged file must equal, byte for byte, what one unsharded
// run of the same script writes. Runs as root (installs Debian's slurm-wlm and munge when
// missing); elsewhere it skips with a note, except under CI=true where that is a failure.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureSlurm, isRoot } from './ensureSlurm.js';
import { OneNodeCluster } from './OneNodeCluster.js';

const REPO = join(__dirname, '../..');
const ci = process.env.CI === 'true';
const TASKS = 4;
/** Trials per point: the README's 12 x 10 grid at 1 trial is 120 closed-loop trials, 30 per task. */
const TRIALS = '1';

/** The array job script of README.md, section "Sweeps on a cluster: job arrays". */
function readmeJobScript(): string {
  const readme = readFileSync(join(REPO, 'README.md'), 'utf8');
  const script = /```sh\n(#!\/bin\/sh\n#SBATCH --array[^`]*?)```/.exec(readme)?.[1];
  if (!script) throw new Error('README.md: the Slurm array job script (```sh block starting #!/bin/sh / #SBATCH --array) is missing');
  return script;
}

/** A working folder like a user's checkout: data-demo/ and `npx alight` resolving to this repository. */
function workFolder(path: string): string {
  mkdirSync(join(path, 'node_modules', '.bin'), { recursive: true });
  symlinkSync(join(REPO, 'data-demo'), join(path, 'data-demo'));
  symlinkSync(join(REPO, 'estimator', 'cli', 'bin.mjs'), join(path, 'node_modules', '.bin', 'alight'));
  return path;
}

const availability = isRoot() ? ensureSlurm() : { ready: false as const, note: 'not root: the Slurm test installs and starts daemons, so it runs as root only' };
if (!availability.ready) {
  process.stderr.write(`slurmArray.test: skipped: ${availability.note}\n`);
}

describe.skipIf(!availability.ready && !ci)('the README array job on a one-node Slurm cluster', () => {
  let cluster: OneNodeCluster | null = null;
  let jobId: string | null = null;

  beforeAll(async () => {
    if (!availability.ready) throw new Error(`Slurm is needed under CI: ${availability.note}`);
    cluster = new OneNodeCluster();
    await cluster.start(2);
  }, 180_000);

  afterAll(async () => {
    if (cluster && jobId !== null) cluster.run('/usr/bin/scancel', [jobId]); // no-op when the job finished
    await cluster?.stop();
  }, 60_000);

  it('runs 4 array tasks whose merged shards equal an unsharded run byte for byte', async () => {
    const c = cluster!;
    const script = join(c.dir, 'van-array.sh');
    writeFileSync(script, readmeJobScript(), { mode: 0o755 });
    const sharded = workFolder(join(c.dir, 'sharded'));
    // Command-line options override the script's #SBATCH lines: 4 tasks, one CPU each on this 2-core node.
    const submitted = c.run('/usr/bin/sbatch', ['--parsable', `--array=1-${TASKS}`, '--cpus-per-task=1', `--chdir=${sharded}`, `--output=${join(c.dir, 'task-%a.out')}`, '--export=ALL', script], { TRIALS });
    expect(submitted.status, submitted.stderr).toBe(0);
    jobId = submitted.stdout.trim().split(';')[0]!;

    // The unsharded reference meanwhile, the same script outside Slurm.
    const whole = workFolder(join(c.dir, 'whole'));
    const reference = spawnSync('/bin/sh', [script], { cwd: whole, env: { ...process.env, TRIALS, SLURM_CPUS_PER_TASK: '1' }, encoding: 'utf8', timeout: 300_000 });
    expect(reference.status, reference.stderr).toBe(0);

    for (let i = 0; i < 1500; i++) {
      if (c.run('/usr/bin/squeue', ['-h', '-j', jobId]).stdout.trim() === '') break;
      await new Promise((r) => setTimeout(r, 200));
    }
    const states = c.run('/usr/bin/scontrol', ['-o', 'show', 'job', jobId]).stdout;
    const tasks = states.trim().split('\n').map((line) => [/ArrayTaskId=(\d+)/.exec(line)?.[1], /JobState=(\w+)/.exec(line)?.[1], /ExitCode=(\S+)/.exec(line)?.[1]].join(' '));
    const outputs = readdirSync(c.dir).filter((f) => f.startsWith('task-')).map((f) => `${f}: ${readFileSync(join(c.dir, f), 'utf8')}`).join('\n');
    expect(tasks.sort(), `${outputs}\n${c.logs()}`).toEqual(['1 COMPLETED 0:0', '2 COMPLETED 0:0', '3 COMPLETED 0:0', '4 COMPLETED 0:0']);

    const shards = readdirSync(join(sharded, 'results')).sort();
    expect(shards).toEqual(['van-1.jsonl', 'van-2.jsonl', 'van-3.jsonl', 'van-4.jsonl']);
    // The README's merge step, as written there.
    const merged = spawnSync('/bin/sh', ['-c', 'npx alight merge results/van-*.jsonl --out van.jsonl'], { cwd: sharded, encoding: 'utf8', timeout: 120_000 });
    expect(merged.status, merged.stderr).toBe(0);
    const unsharded = readFileSync(join(whole, 'results', 'van-{shard}.jsonl'));
    expect(unsharded.toString('utf8').trim().split('\n')).toHaveLength(1 + 120); // header + 12 x 10 points x 1 trial
    expect(readFileSync(join(sharded, 'van.jsonl')).equals(unsharded)).toBe(true);
    expect(existsSync(join(sharded, 'results', 'van-{shard}.jsonl'))).toBe(false);
  }, 600_000);
});
