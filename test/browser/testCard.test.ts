// The flight-test card study and the failure-cause links in Debian's chromium: the card shows the
// flight-safety caution first and the same flight counts as the library; a cause's replay link
// opens the landing study on exactly the trial the sweep flew.
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { setPaths } from '../../estimator/io/scenarioPath.js';
import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { testCard } from '../../estimator/study/testCard.js';
import { VERSION } from '../../estimator/version.js';
import { sweepJob } from '../../notebooks/jobs/sweepJob.js';
import { IMPAIRMENTS } from '../../notebooks/studies/detectionStudy.js';
import { startStaticServer, type RunningServer } from '../../notebooks/server/staticServer.node.js';
import { launchChromium, runBrowserTests, type Browser } from '../../notebooks/scripts/launchChromium.node.js';
import { openAnalysis, shownValue, waitIdle } from './studyPage.js';

const repo = fileURLToPath(new URL('../..', import.meta.url));
// a 3 s dropout burst mid-descent in 16 s flights: most trials abort and cannot land again in time
const scenario = setPaths(defaultScenario(), { duration: 16, 'detector.script': [{ kind: 'dropout', time: 7, duration: 3 }] });
const SEED = 5;
const TRIALS = 2;

describe.skipIf(!runBrowserTests)('flight-test card and cause links in chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;

  beforeAll(async () => {
    if (!existsSync(join(repo, 'dist', 'notebooks', 'app.js'))) execFileSync('node', ['build.mjs'], { cwd: repo, stdio: 'inherit' });
    server = await startStaticServer({ pageDir: join(repo, 'dist', 'notebooks'), demoDir: join(repo, 'data-demo'), port: 0 });
    browser = await launchChromium();
    page = await browser.context.newPage();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('shows the caution first, the library flight counts, and a replay link that opens exactly that trial', async () => {
    const parameters = { impairment: 'latency', limit: 0.15, rate: 0.5, level: 0.95, trials: TRIALS };
    await openAnalysis(page, server.url, { study: 'test-card', scenario, parameters, seed: SEED, toolVersion: VERSION });
    const first = await page.textContent('[data-figure="card"] .caution');
    expect(first).toContain(SAFETY_CAUTION);

    const sweep = sweepJob({ scenario, seed: SEED, trials: TRIALS, vary: [{ path: 'detector.latency', values: IMPAIRMENTS.latency!.values }] }, () => {});
    const card = testCard(sweep.header, sweep.records, { path: 'detector.latency', limit: 0.15, direction: 'up-to', rate: 0.5, confidence: 0.95 });
    const edge = card.conditions.find((c) => c.roles.includes('claim edge'))!;
    expect(await shownValue(page, 'card', 'allLand')).toBe(edge.counts.allLand);
    if (edge.counts.flights !== null) expect(await shownValue(page, 'card', 'edgeFlights')).toBe(edge.counts.flights);

    const link = page.locator('[data-figure="causes"] a').first();
    const text = (await link.textContent())!;
    const [, point, trial] = /point (\d+), trial (\d+)/.exec(text)!.map(Number);
    const record = sweep.records.find((r) => r.point === point && r.trial === trial)!;
    expect(record.outcome).not.toBe('landed');
    await link.click();
    await page.waitForFunction(() => document.querySelector('[data-figure="phases"]') !== null, undefined, { timeout: 30_000 });
    await waitIdle(page);
    expect((await page.textContent('[data-figure="phases"] dd[data-key="outcome"]'))!.trim()).toBe(record.outcome);
  });
});
