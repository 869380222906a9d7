// An own scenario in chromium: a scenario file opened in the page (refused with the CLI's own
// file:line message when it is wrong), one field edited in the form generated from the schema,
// the result carried through the permalink into a fresh page, and the same analysis rendered by
// `alight report`: the numbers agree (counts exactly, continuous values as text).
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { parseScenario } from '../../estimator/io/parseScenario.js';
import { reportCommand } from '../../estimator/cli/reportCommand.js';
import { VERSION } from '../../estimator/version.js';
import type { Analysis } from '../../notebooks/analysis/Analysis.js';
import { launchChromium, runBrowserTests, type Browser } from '../../notebooks/scripts/launchChromium.node.js';
import { startStaticServer, type RunningServer } from '../../notebooks/server/staticServer.node.js';
import { openAnalysis, reportText, reportValue, shownValue, waitIdle } from './studyPage.js';

const repo = fileURLToPath(new URL('../..', import.meta.url));
const analysisText = (page: Page): Promise<string> => page.evaluate(() => window.alight!.analysisText());

describe.skipIf(!runBrowserTests)('an own scenario in chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let work: string;

  beforeAll(async () => {
    work = mkdtempSync(join(tmpdir(), 'alight-own-'));
    server = await startStaticServer({ pageDir: join(repo, 'dist', 'notebooks'), demoDir: join(repo, 'data-demo'), port: 0 });
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('opens, edits and shares an own scenario; the permalink gives what alight report gives', async () => {
    const page = await browser.context.newPage();
    const a: Analysis = { study: 'detection', scenario: defaultScenario(), parameters: { impairment: 'dropout', trials: 3 }, seed: 4, toolVersion: VERSION };
    await openAnalysis(page, server.url, a);

    // A wrong file is refused with the validator's file:line:column message, as the CLI prints it.
    const bad = JSON.stringify({ ...JSON.parse(JSON.stringify(defaultScenario())), name: 'broken', detector: { ...defaultScenario().detector, pixelNoise: -1 } }, null, 2);
    writeFileSync(join(work, 'broken.scenario.json'), bad);
    let expected = '';
    try {
      parseScenario(bad, 'broken.scenario.json');
    } catch (error) {
      expected = (error as Error).message;
    }
    expect(expected).toMatch(/^broken\.scenario\.json:\d+:\d+: detector\.pixelNoise/m);
    await page.setInputFiles('#open-scenario-file', join(work, 'broken.scenario.json'));
    await page.waitForSelector('#scenario-problem:not([hidden])');
    expect(await page.textContent('#scenario-problem')).toBe(expected);
    expect(JSON.parse(await analysisText(page)).scenario.name).toBe('default');

    // A good one replaces the scenario; the study reruns on it.
    const own = { ...JSON.parse(JSON.stringify(defaultScenario())), name: 'my rover', description: 'invented for this test', detector: { ...defaultScenario().detector, pixelNoise: 3 } };
    writeFileSync(join(work, 'rover.scenario.json'), JSON.stringify(own, null, 2));
    await page.setInputFiles('#open-scenario-file', join(work, 'rover.scenario.json'));
    await page.waitForFunction(() => JSON.parse(window.alight!.analysisText()).scenario.name === 'my rover');
    await waitIdle(page);
    expect(await page.textContent('#control-scenario option:first-child')).toBe('my rover');

    // Edit one field in the generated form: a refused value is named, a good one commits.
    await page.click('.scenario-form > summary');
    await page.click('.scenario-section:has(#scenario-detector-latency) > summary');
    await page.fill('#scenario-detector-latency', '-0.1');
    await page.press('#scenario-detector-latency', 'Tab');
    await page.waitForSelector('#scenario-detector-latency-problem:not([hidden])');
    expect(await page.textContent('#scenario-detector-latency-problem')).toContain('detector.latency');
    expect(JSON.parse(await analysisText(page)).scenario.detector.latency).toBe(defaultScenario().detector.latency);
    await page.fill('#scenario-detector-latency', '0.15');
    await page.press('#scenario-detector-latency', 'Tab');
    await page.waitForFunction(() => JSON.parse(window.alight!.analysisText()).scenario.detector.latency === 0.15);
    await waitIdle(page);
    const text = await analysisText(page);
    const link = page.url();

    // The link alone, in a fresh page, carries the edited scenario and gives the same numbers.
    const fresh = await browser.context.newPage();
    await fresh.goto(link);
    await waitIdle(fresh);
    expect(await analysisText(fresh)).toBe(text);
    const keys = ['successRate0', 'wilsonLow0', 'wilsonHigh0'];
    const shown = await Promise.all(keys.map((k) => shownValue(fresh, 'success', k)));
    expect(shown).toEqual(await Promise.all(keys.map((k) => shownValue(page, 'success', k))));

    // alight report on the analysis the page shows.
    writeFileSync(join(work, 'own.json'), text);
    let said = '';
    const io = { stdout: (t: string) => (said += t), stderr: (t: string) => (said += t), interactive: false, cwd: work, env: {} };
    expect(await reportCommand.run(['own.json', '--out', 'own.html'], io), said).toBe(0);
    const html = readFileSync(join(work, 'own.html'), 'utf8');
    keys.forEach((k, i) => expect(reportValue(html, k), k).toBe(shown[i])); // counts: exact
    // continuous: the text a reader sees (3 significant digits) is the same
    expect(reportText(html, 'cep50_0')).toBe(await fresh.textContent('[data-figure="miss"] dd[data-key="cep50_0"]'));
    expect(html).toContain('my rover');
    await fresh.close();
    await page.close();
  });
});
