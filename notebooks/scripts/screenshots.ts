// `npm run screenshots`: serves the built page, opens every study in Debian's chromium at
// 1280x800, waits until all its figures are complete, and saves dist/screenshots/<study>.png,
// the whole page as <study>-full.png, and each figure's plate as <study>/<figure>.png (for a
// close look at labels and legends).
import { mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { startStaticServer } from '../server/staticServer.node.js';
import { STUDY_IDS } from '../analysis/Analysis.js';
import { CHROMIUM, launchChromium } from './launchChromium.node.js';
import { existsSync } from 'node:fs';

const repo = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const out = join(repo, 'dist', 'screenshots');

async function main(): Promise<void> {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: sudo apt-get install -y chromium`);
  if (!existsSync(join(repo, 'dist', 'notebooks', 'app.js'))) throw new Error('dist/notebooks/app.js is missing: run "node build.mjs" first');
  mkdirSync(out, { recursive: true });
  const server = await startStaticServer({ pageDir: join(repo, 'dist', 'notebooks'), demoDir: join(repo, 'data-demo'), port: 0 });
  const browser = await launchChromium();
  try {
    const page = await browser.context.newPage();
    for (const id of STUDY_IDS) {
      const started = Date.now();
      await page.goto(`${server.url}#study=${id}`);
      await page.waitForSelector('body[data-state="idle"]', { timeout: 180_000 });
      // Switching study only changes the fragment: start each view at the top of the page.
      await page.evaluate(() => window.scrollTo(0, 0));
      const file = join(out, `${id}.png`);
      await page.screenshot({ path: file });
      process.stdout.write(`screenshots: ${file} (${((Date.now() - started) / 1000).toFixed(1)} s)\n`);
      // A second, full-page view for review of everything below the fold.
      await page.screenshot({ path: join(out, `${id}-full.png`), fullPage: true });
      mkdirSync(join(out, id), { recursive: true });
      for (const plate of await page.locator('[data-figure]').all()) {
        const name = await plate.getAttribute('data-figure');
        if (name) await plate.screenshot({ path: join(out, id, `${name}.png`) });
      }
    }
  } finally {
    await browser.close();
    await server.close();
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`screenshots: ${(error as Error).message ?? String(error)}\n`);
  process.exitCode = 1;
});
