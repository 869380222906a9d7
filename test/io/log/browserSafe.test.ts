import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The notebook replays dropped files in the page: these modules must bundle for a browser,
// i.e. import no Node built-in (esbuild refuses to resolve node:fs & co. for platform 'browser').
describe('browser-safe log replay', () => {
  it('replayLog, logSourceFromFiles and tuneLogSource bundle for the browser', async () => {
    const entry = (f: string) => fileURLToPath(new URL(`../../../estimator/io/log/${f}`, import.meta.url));
    const result = await build({
      entryPoints: [entry('replayLog.ts'), entry('LogSource.ts'), entry('tuneLogSource.ts')],
      bundle: true,
      platform: 'browser',
      format: 'esm',
      write: false,
      outdir: 'out',
      logLevel: 'silent',
    });
    expect(result.errors).toEqual([]);
    const text = result.outputFiles.map((f) => f.text).join('\n');
    expect(text).not.toMatch(/from\s*["']node:/);
    expect(text).toContain('function replayLog(');
  });
});
