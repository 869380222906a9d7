// Makes sure Debian's chromium is there for the browser tests (run by `npm test` before vitest).
// Missing and root: installs it with apt-get (about 45 s). Missing and not root: says how to
// install it and lets the browser tests skip — except under CI=true, where it is a failure.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const CHROMIUM = '/usr/bin/chromium';
const ci = process.env.CI === 'true';

if (existsSync(CHROMIUM)) process.exit(0);

const root = typeof process.getuid === 'function' && process.getuid() === 0;
if (root) {
  process.stderr.write('ensureChromium: /usr/bin/chromium is missing; installing Debian\'s chromium (about 45 s)...\n');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const steps = [
    ['apt-get', ['update', '-qq']],
    ['apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'chromium']],
  ];
  for (const [command, args] of steps) {
    const run = spawnSync(command, args, { stdio: ['ignore', 'ignore', 'inherit'], env });
    if (run.status !== 0) {
      process.stderr.write(`ensureChromium: "${command} ${args.join(' ')}" failed (exit ${run.status ?? run.signal}).\n`);
      process.exit(ci ? 1 : 0);
    }
  }
  if (existsSync(CHROMIUM)) process.exit(0);
  process.stderr.write(`ensureChromium: chromium installed but ${CHROMIUM} is still missing.\n`);
  process.exit(ci ? 1 : 0);
}

process.stderr.write(
  `ensureChromium: ${CHROMIUM} is missing, so the browser tests will be skipped.\n` +
    '  Install it with:  sudo apt-get update && sudo apt-get install -y chromium\n',
);
process.exit(ci ? 1 : 0);
