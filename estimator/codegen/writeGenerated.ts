// `npm run codegen`: rewrite the generated kernels from their generators.
import { writeFileSync } from 'node:fs';
import { josephUpdate12Source } from './josephUpdate12Source.js';
import { predictLandingSource } from './predictLandingSource.js';

const targets: Array<[string, () => string]> = [
  ['../models/predictLanding.generated.ts', predictLandingSource],
  ['../filter/josephUpdate12.generated.ts', josephUpdate12Source],
];
for (const [path, source] of targets) {
  const target = new URL(path, import.meta.url);
  writeFileSync(target, source());
  process.stdout.write(`wrote ${target.pathname}\n`);
}
