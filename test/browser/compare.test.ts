// A against B in chromium: the study as it stands kept as A, the seed changed for B, and each
// point's success compared with the Newcombe interval of B - A; the same A opened from a file
// gives the same table. Counts come from the library's own trials, so they are compared exactly.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { differenceInterval } from '../../estimator/study/statistics/differenceInterval.js';
import { simulateTrial } from '../../estimator/study/simulateTrial.js';
import { VERSION } from '../../estimator/version.js';
import { analysisToText, type Analysis } from '../../notebooks/analysis/Analysis.js';
import { IMPAIRMENTS } from '../../notebooks/studies/detectionStudy.js';
import { launchChromium, runBrowserTests, type Browser } from '../../notebooks/scripts/launchChromium.node.js';
import { startStaticServer, type RunningServer } from '../../notebooks/server/staticServer.node.js';
import { openAnalysis, waitIdle } from './studyPage.js';

const repo = fileURLToPath(new URL('../..', import.meta.url));
const TRIALS = 3;

/** Trials landed at each dropout value of the detection study's grid, by the library's trial function. */
function landed(seed: number): number[] {
  const values = IMPAIRMENTS.dropout!.values;
  return values.map((v, point) => {
    const s = applyParams(defaultScenario(), { 'detector.dropout': v });
    let k = 0;
    for (let trial = 0; trial < TRIALS; trial++) if (simulateTrial(s, { seed, point, trial }).outcome === 'landed') k++;
    return k;
  });
}

async function table(page: Page): Promise<{ row: string; low: number; high: number; reading: string }[]> {
  return page.$$eval('.compare-counts tbody tr', (rows) =>
    rows.map((r) => ({ row: r.getAttribute('data-row')!, low: Number(r.querySelector('[data-low]')!.getAttribute('data-low')), high: Number(r.querySelector('[data-low]')!.getAttribute('data-high')), reading: r.lastElementChild!.textContent! })),
  );
}

describe.skipIf(!runBrowserTests)('A against B in chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let work: string;

  beforeAll(async () => {
    work = mkdtempSync(join(tmpdir(), 'alight-compare-'));
    server = await startStaticServer({ pageDir: join(repo, 'dist', 'notebooks'), demoDir: join(repo, 'data-demo'), port: 0 });
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('keeps A, changes the seed for B, and gives each point Newcombe\'s interval of B - A', async () => {
    const page = await browser.context.newPage();
    const a: Analysis = { study: 'detection', scenario: defaultScenario(), parameters: { impairment: 'dropout', trials: TRIALS }, seed: 4, toolVersion: VERSION };
    await openAnalysis(page, server.url, a);
    await page.click('#keep-a');
    await page.waitForSelector('.comparison[data-ready="true"] .compare-counts');
    expect(await page.textContent('.comparison .hint')).toContain('B is the same analysis as A');
    const same = await table(page);
    expect(same.filter((r) => r.row.startsWith('success:'))).toHaveLength(4);
    for (const r of same) expect(r.reading).toBe('no difference shown');

    await page.fill('#control-seed', '5');
    await page.press('#control-seed', 'Enter');
    await page.waitForFunction(() => JSON.parse(window.alight!.analysisText()).seed === 5);
    await waitIdle(page);
    await page.waitForSelector('.comparison[data-ready="true"] .compare-counts');
    expect(await page.textContent('.comparison .hint')).toContain('B changes seed 4 → 5');
    const [ka, kb] = [landed(4), landed(5)];
    const rows = (await table(page)).filter((r) => r.row.startsWith('success:'));
    expect(rows.map((r) => r.row)).toEqual(IMPAIRMENTS.dropout!.values.map((v) => `success: detector.dropout = ${v}`));
    rows.forEach((r, i) => {
      const d = differenceInterval(kb[i]!, TRIALS, ka[i]!, TRIALS);
      // sqrt and arithmetic only: the browser's numbers are the library's to the bit
      expect(r.low, r.row).toBe(d.low);
      expect(r.high, r.row).toBe(d.high);
      expect(r.reading).toBe(d.low > 0 ? 'B higher' : d.high < 0 ? 'B lower' : 'no difference shown');
    });

    // The same A from a file, computed in the page's workers, gives the same table.
    writeFileSync(join(work, 'a.json'), analysisToText(a));
    await page.setInputFiles('#compare-analysis', join(work, 'a.json'));
    await page.waitForFunction(() => document.querySelector('.comparison[data-ready="true"] .hint')?.textContent?.includes('A: a.json'), undefined, { timeout: 60_000 });
    expect((await table(page)).filter((r) => r.row.startsWith('success:'))).toEqual(rows);

    await page.click('#stop-compare');
    expect(await page.isHidden('.comparison')).toBe(true);
    await page.close();
  });
});
