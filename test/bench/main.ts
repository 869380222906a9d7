// `npm run bench [-- --json]`: a benchmark, not a test. Each section measures its figures
// within this one run so ratios compare like with like. Sections register below.
import { CHILD_FLAG } from './replay.js';
import { sections } from './sections.js';

// A replay child (see replay.ts) runs only its replay: in the bundle it is this same file.
const isChild = process.argv.includes(CHILD_FLAG);
const json = process.argv.includes('--json');
const only = process.argv.find((a) => a.startsWith('--only='))?.slice(7);
const report: Record<string, unknown> = {};
for (const section of isChild ? [] : sections) {
  if (only && section.name !== only) continue;
  if (!json) process.stderr.write(`bench: ${section.name} ...\n`);
  report[section.name] = await section.run();
  if (!json) process.stdout.write(`${section.name}: ${JSON.stringify(report[section.name])}\n`);
}
if (json && !isChild) process.stdout.write(JSON.stringify(report) + '\n');
