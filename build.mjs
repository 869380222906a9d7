// Builds the Node bundles (CLI, workers) and the notebook host page with esbuild.
// Run by `npm ci` (prepare), `npm test`, `npm start` and `npm run bench`.
import { build } from 'esbuild';
import { existsSync } from 'node:fs';

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
for (const [source, outfile] of browserEntries) {
  if (!existsSync(source)) { console.warn(`build: skipping missing ${source}`); continue; }
  await build({ bundle: true, platform: 'browser', format: 'esm', target: 'es2022', sourcemap: true, logLevel: 'warning', entryPoints: [source], outfile });
}
