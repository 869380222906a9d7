// `npm run bench [-- --json] [-- --only=NAME]`: a benchmark, not a test. Each section runs in a
// fresh Node process of its own and measures its figures within that process, so ratios compare
// like with like. A shared process let one section's code shape another's JIT: run after the
// ekf, world, sweep and replay sections, the same demo trials cost 40 % more CPU than alone
// (the relay demo 45 ms instead of 26), as the shared filter and world functions had compiled
// for the other sections' inputs. Sections register in sections.ts.
import { spawnSync } from 'node:child_process';
import { rerunArgs } from './paths.js';
import { CHILD_FLAG } from './replay.js';
import { IMPORT_CHILD_FLAG } from './importBench.js';
import { sections } from './sections.js';

const SECTION_FLAG = '--section=';

/** A section name the bench does not have: say which it has, exit 2. */
function refuseSection(name: string | undefined): never {
  process.stderr.write(`bench: no section named ${name}; sections: ${sections.map((s) => s.name).join(', ')}\n`);
  process.exit(2);
}

const args = process.argv.slice(2);
const json = args.includes('--json');
const only = args.find((a) => a.startsWith('--only='))?.slice('--only='.length);
const single = args.find((a) => a.startsWith(SECTION_FLAG))?.slice(SECTION_FLAG.length);

if (single !== undefined) {
  // Child: run one section and print its figures as the last line.
  const section = sections.find((s) => s.name === single);
  if (!section) refuseSection(single);
  process.stdout.write(JSON.stringify(await section.run()) + '\n');
} else if (!args.includes(CHILD_FLAG) && !args.includes(IMPORT_CHILD_FLAG)) {
  // A replay child (replay.ts) or an import child (importBench.ts) is this same file when bundled: it runs only its own job.
  const names = sections.map((s) => s.name).filter((name) => !only || name === only);
  if (names.length === 0) refuseSection(only);
  const report: Record<string, unknown> = {};
  for (const name of names) {
    if (!json) process.stderr.write(`bench: ${name} ...\n`);
    const child = spawnSync(process.execPath, [...rerunArgs(import.meta.url), `${SECTION_FLAG}${name}`], { encoding: 'utf8', maxBuffer: 1 << 24, stdio: ['ignore', 'pipe', 'inherit'] });
    if (child.status !== 0) {
      process.stderr.write(`bench: section ${name} failed (exit ${child.status})\n`);
      process.exit(1);
    }
    report[name] = JSON.parse(child.stdout.trim().split('\n').at(-1)!);
    if (!json) process.stdout.write(`${name}: ${JSON.stringify(report[name])}\n`);
  }
  if (json) process.stdout.write(JSON.stringify(report) + '\n');
}
