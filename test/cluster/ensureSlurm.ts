// Debian's Slurm and MUNGE for the cluster test: present -> nothing to do; missing and root ->
// apt-get update once, then install (slurmctld, slurmd, the client commands and munge, without
// recommends); missing and not root -> a note saying how, and the test skips (CI fails instead).
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

/** The programs the cluster test starts or calls. */
export const SLURM_PROGRAMS = ['/usr/sbin/munged', '/usr/sbin/slurmctld', '/usr/sbin/slurmd', '/usr/bin/sbatch', '/usr/bin/squeue', '/usr/bin/scontrol', '/usr/bin/sinfo'];
const PACKAGES = ['slurm-wlm', 'munge'];

export const isRoot = (): boolean => typeof process.getuid === 'function' && process.getuid() === 0;

export type SlurmAvailability = { ready: true } | { ready: false; note: string };

/** Install when needed and allowed; say why not otherwise. Takes a minute or two on a fresh machine. */
export function ensureSlurm(): SlurmAvailability {
  const missing = () => SLURM_PROGRAMS.filter((p) => !existsSync(p));
  if (missing().length === 0) return { ready: true };
  if (!isRoot()) return { ready: false, note: `Slurm/MUNGE missing (${missing().join(', ')}) and not root; install with: sudo apt-get update && sudo apt-get install -y --no-install-recommends ${PACKAGES.join(' ')}` };
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', '--no-install-recommends', ...PACKAGES]]) {
    const run = spawnSync('apt-get', args, { stdio: ['ignore', 'ignore', 'pipe'], env, encoding: 'utf8' });
    if (run.status !== 0) return { ready: false, note: `"apt-get ${args.join(' ')}" failed (exit ${run.status ?? run.signal}): ${run.stderr.trim().split('\n').slice(-3).join(' | ')}` };
  }
  const still = missing();
  return still.length === 0 ? { ready: true } : { ready: false, note: `installed ${PACKAGES.join(' ')} but still missing ${still.join(', ')}` };
}
