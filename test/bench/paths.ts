// Files of the repository for the bench, found from this module whether it runs from source
// (test/bench/) or bundled (dist/bench.mjs).
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository folder: the nearest parent holding data-demo/. */
export function repoRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  while (!existsSync(join(dir, 'data-demo'))) {
    const parent = dirname(dir);
    if (parent === dir) throw new Error('bench: data-demo/ not found above ' + fileURLToPath(import.meta.url));
    dir = parent;
  }
  return dir;
}

/** A demo scenario file by name (e.g. 'survey-rover'). */
export function demoScenarioPath(name: string): string {
  return join(repoRoot(), 'data-demo', `${name}.scenario.json`);
}

/**
 * The node arguments that run the module at `moduleUrl` again in a child process: the file itself
 * when bundled (dist/bench.mjs), the TypeScript source through tsx otherwise.
 */
export function rerunArgs(moduleUrl: string): string[] {
  const file = fileURLToPath(moduleUrl);
  return file.endsWith('.ts') ? ['--import', 'tsx', file] : [file];
}
