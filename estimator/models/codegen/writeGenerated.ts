// `npm run codegen`: rewrite the generated kernels from their generators.
import { writeFileSync } from 'node:fs';
import { predictConstantVelocitySource } from './predictConstantVelocitySource.js';

const target = new URL('../predictConstantVelocity.generated.ts', import.meta.url);
writeFileSync(target, predictConstantVelocitySource());
process.stdout.write(`wrote ${target.pathname}\n`);
