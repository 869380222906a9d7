// Bench section `page`: wall time of the detection study at 200 trials per point over its default
// grid (box centre noise at 4 values: 800 trials), in Debian's chromium, from opening the link to
// the last figure final. The page splits the sweep over the browser's cores (navigator
// .hardwareConcurrency); the goal on this 2-core machine is under 30 s.
import { join } from 'node:path';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { VERSION } from '../../estimator/version.js';
import { analysisToText, type Analysis } from '../../notebooks/analysis/Analysis.js';
import { permalinkFragment } from '../../notebooks/analysis/permalink.js';
import { CHROMIUM, launchChromium } from '../../notebooks/scripts/launchChromium.node.js';
import { startStaticServer } from '../../notebooks/server/staticServer.node.js';
import { existsSync } from 'node:fs';
import { repoRoot } from './paths.js';
import type { BenchSection } from './sections.js';

const TRIALS = 200;

export const pageBench: BenchSection = {
  name: 'page',
  async run() {
    if (!existsSync(CHROMIUM)) return { skipped: `no chromium at ${CHROMIUM}` };
    const root = repoRoot();
    const server = await startStaticServer({ pageDir: join(root, 'dist', 'notebooks'), demoDir: join(root, 'data-demo'), port: 0 });
    const browser = await launchChromium();
    try {
      const page = await browser.context.newPage();
      const analysis: Analysis = { study: 'detection', scenario: defaultScenario(), parameters: { impairment: 'pixelNoise', trials: TRIALS }, seed: 1, toolVersion: VERSION };
      // Load the page once first, so the wall time is the study's, not the first bundle fetch's.
      await page.goto(server.url + '#study=landing');
      await page.waitForFunction(() => document.body.dataset.state === 'idle', undefined, { timeout: 120_000 });
      const started = Date.now();
      await page.goto(server.url + permalinkFragment(analysisToText(analysis)));
      await page.waitForFunction(() => document.body.dataset.state === 'idle' && document.querySelector('[data-figure="success"] .status')?.textContent === `${4 * 200} trials`, undefined, { timeout: 600_000, polling: 100 });
      const wallMs = Date.now() - started;
      const cores = await page.evaluate(() => navigator.hardwareConcurrency);
      const status = await page.textContent('[data-figure="success"] .status');
      return { study: 'detection', trialsPerPoint: TRIALS, points: 4, trials: Number(/^(\d+)/.exec(status ?? '')?.[1] ?? NaN), workers: cores, wallMs, goalMs: 30_000, msPerTrial: Number((wallMs / (4 * TRIALS)).toFixed(2)) };
    } finally {
      await browser.close();
      await server.close();
    }
  },
};
