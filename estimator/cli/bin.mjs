#!/usr/bin/env node
// Launcher for the `alight` bin: runs the esbuild bundle made by `npm ci` (prepare) or `npm run build`.
import { existsSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';

const bundle = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'dist', 'alight.mjs');
if (!existsSync(bundle)) {
  process.stderr.write(`alight: ${bundle} is missing; run "npm run build" in the alight folder first\n`);
  process.exit(2);
}
await import(pathToFileURL(bundle).href);
