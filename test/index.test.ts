import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';
import * as alight from '../estimator/index.js';

describe('estimator/index', () => {
  it('bundles for the browser: the public face imports no Node-only module', async () => {
    const result = await build({ entryPoints: ['estimator/index.ts'], bundle: true, platform: 'browser', format: 'esm', write: false, logLevel: 'silent', metafile: true });
    const inputs = Object.keys(result.metafile.inputs);
    expect(inputs.some((p) => p.endsWith('.node.ts'))).toBe(false);
    expect(inputs.some((p) => p.startsWith('node:'))).toBe(false);
  });

  it('flies a default trial through the re-exports alone', () => {
    const result = alight.runTrial(alight.defaultScenario(), { key: { seed: 3, point: 0, trial: 0 } });
    expect(alight.OUTCOMES).toContain(result.outcome);
    const again = alight.runTrial(alight.defaultScenario(), { key: { seed: 3, point: 0, trial: 0 } });
    expect(JSON.stringify(again)).toBe(JSON.stringify(result)); // determinism through the public face
  });
});
