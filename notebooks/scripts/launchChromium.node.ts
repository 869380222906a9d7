// Node-only: launching Debian's chromium through playwright-core, the one way the project allows: a
// persistent context on a fresh temporary profile, never a browser downloaded by a test tool.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';

/** Browser tests run when chromium exists; under CI=true they run regardless (and fail if it is missing). */
export const runBrowserTests = existsSync(CHROMIUM) || process.env.CI === 'true';

export interface Browser {
  context: BrowserContext;
  close(): Promise<void>;
}

export async function launchChromium(): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), 'alight-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    viewport: { width: 1280, height: 800 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
