// `npm run codegen`: rewrite the generated kernels from their generators.
import { writeFileSync } from 'node:fs';
import { josephUpdateSource } from './josephUpdateSource.js';
import { predictLandingSource } from './predictLandingSource.js';

const targets: Array<[string, () => string]> = [
  ['../models/predictLanding.generated.ts', predictLandingSource],
  ['../filter/josephUpdate.generated.ts', josephUpdateSource],
];
for (const [path, source] of targets) {
  const target = new URL(path, import.meta.url);
  writeFileSync(target, source());
  process.stdout.write(`wrote ${target.pathname}\n`);
}
