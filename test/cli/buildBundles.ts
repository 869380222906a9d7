// Builds the CLI and the sweep worker into a temporary folder for tests that spawn them, so a
// plain `npx vitest run` needs no prior `npm run build` (and never sees a stale dist/).
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'esbuild';

export interface Bundles {
  dir: string;
  cli: string;
  worker: string;
}

/** @param parent folder to build in (default the system's temporary folder) */
export async function buildBundles(parent = tmpdir()): Promise<Bundles> {
  const dir = mkdtempSync(join(parent, 'alight-bundles-'));
  const common = {
    bundle: true, platform: 'node' as const, format: 'esm' as const, target: 'node20', logLevel: 'error' as const,
    loader: { '.wasm': 'file' as const }, // the ROS 2 reader's zstd/lz4 decoders ship .wasm files beside their code
    banner: { js: "import { createRequire as __alightRequire } from 'node:module'; const require = __alightRequire(import.meta.url);" },
  };
  await build({ ...common, entryPoints: ['estimator/cli/node.ts'], outfile: join(dir, 'alight.mjs') });
  await build({ ...common, entryPoints: ['estimator/study/sweepWorker.node.ts'], outfile: join(dir, 'sweep-worker.mjs') });
  return { dir, cli: join(dir, 'alight.mjs'), worker: join(dir, 'sweep-worker.mjs') };
}
