// Builds the Node bundles (CLI, workers) and the notebook host page with esbuild.
// Run by `npm ci` (prepare), `npm test`, `npm start` and `npm run bench` (which adds --bench:
// the benchmark is bundled like the CLI, so it times the code users run, not tsx's per-file
// transform of the sources, which ran a demo trial about 25 % slower).
import { build } from 'esbuild';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { SCENARIO_CHECK_MODULE, writeScenarioValidator } from './notebooks/scripts/buildScenarioValidator.mjs';

const node = {
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  sourcemap: true,
  logLevel: 'warning',
  banner: { js: "import { createRequire as __alightRequire } from 'node:module'; const require = __alightRequire(import.meta.url);" },
};

// One line per Node entry point: [source, output]. Missing sources are skipped with a note.
const nodeEntries = [
  ['estimator/cli/node.ts', 'dist/alight.mjs'],
  ['notebooks/serve.node.ts', 'dist/serve.mjs'],
  ['estimator/study/sweepWorker.node.ts', 'dist/sweep-worker.mjs'],
  ['estimator/io/ros/ingestWorker.node.ts', 'dist/ingest-worker.mjs'],
  ...(process.argv.includes('--bench') ? [['test/bench/main.ts', 'dist/bench.mjs']] : []),
];

// One line per browser entry point: [source, output].
const browserEntries = [
  ['notebooks/host/app.ts', 'dist/notebooks/app.js'],
  ['notebooks/worker/jobWorker.ts', 'dist/notebooks/worker.js'],
];

for (const [source, outfile] of nodeEntries) {
  if (!existsSync(source)) { console.warn(`build: skipping missing ${source}`); continue; }
  await build({ ...node, entryPoints: [source], outfile });
}
// The page validates scenarios with ajv's standalone code generated here (no eval under its CSP).
const scenarioCheck = resolve('dist/generated/scenarioSchemaCheck.mjs');
await writeScenarioValidator(scenarioCheck);
const pregenerated = { name: 'pregenerated-scenario-check', setup: (b) => b.onResolve({ filter: /scenarioSchemaCheck\.js$/ }, (args) => (SCENARIO_CHECK_MODULE.test(resolve(args.resolveDir, args.path)) ? { path: scenarioCheck } : undefined)) };
for (const [source, outfile] of browserEntries) {
  if (!existsSync(source)) { console.warn(`build: skipping missing ${source}`); continue; }
  await build({ bundle: true, platform: 'browser', format: 'esm', target: 'es2022', sourcemap: true, logLevel: 'warning', entryPoints: [source], outfile, plugins: [pregenerated] });
}
