// Sharing and control of a running study in chromium: the analysis downloads as the file the
// page shows, an uploaded analysis file opens its study, figures export as SVG/PNG and tables
// as CSV, a bad link is explained instead of crashing, and Cancel stops a running sweep.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { VERSION } from '../../estimator/version.js';
import { AnalysisError, analysisToText, type Analysis } from '../../notebooks/analysis/Analysis.js';
import { parseAnalysis } from '../../notebooks/analysis/parseAnalysis.js';
import { studyById } from '../../notebooks/studies/studies.js';
import { startStaticServer, type RunningServer } from '../../notebooks/server/staticServer.node.js';
import { launchChromium, runBrowserTests, type Browser } from '../../notebooks/scripts/launchChromium.node.js';
import { openAnalysis, waitIdle } from './studyPage.js';

const repo = fileURLToPath(new URL('../..', import.meta.url));

async function downloaded(page: Page, click: () => Promise<void>): Promise<{ name: string; bytes: Buffer }> {
  const [download] = await Promise.all([page.waitForEvent('download'), click()]);
  const path = await download.path();
  return { name: download.suggestedFilename(), bytes: readFileSync(path) };
}

describe.skipIf(!runBrowserTests)('sharing a study in chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  let work: string;

  beforeAll(async () => {
    if (!existsSync(join(repo, 'dist', 'notebooks', 'app.js'))) execFileSync('node', ['build.mjs'], { cwd: repo, stdio: 'inherit' });
    work = mkdtempSync(join(tmpdir(), 'alight-share-'));
    server = await startStaticServer({ pageDir: join(repo, 'dist', 'notebooks'), demoDir: join(repo, 'data-demo'), port: 0 });
    browser = await launchChromium();
    page = await browser.context.newPage();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('downloads the analysis it shows and opens an uploaded one', async () => {
    const a: Analysis = { study: 'carrier', scenario: defaultScenario(), parameters: { maxSpeed: 4, trials: 1, target: 0.7, envelopeRule: 'lower' }, seed: 11, toolVersion: VERSION };
    await openAnalysis(page, server.url, a);
    const file = await downloaded(page, () => page.click('#download-analysis'));
    expect(file.name).toBe('carrier-analysis.json');
    expect(file.bytes.toString('utf8')).toBe(analysisToText(a));

    const b: Analysis = { ...a, study: 'detection', parameters: { impairment: 'dropout', trials: 1, confidence: '0.90' }, seed: 4 };
    writeFileSync(join(work, 'b.json'), analysisToText(b));
    await page.setInputFiles('#upload-analysis', join(work, 'b.json'));
    await page.waitForFunction(() => document.querySelector('h1')?.textContent === 'Detection quality');
    await waitIdle(page);
    expect(await page.inputValue('#control-impairment')).toBe('dropout');
    expect(await page.inputValue('#control-confidence')).toBe('0.90');
    // Controls the file leaves out take their defaults (own swept values: none; the claim target, 0.9).
    expect(await page.evaluate(() => window.alight!.analysisText())).toBe(analysisToText({ ...b, parameters: { impairment: 'dropout', trials: 1, values: '', confidence: '0.90', target: 0.9 } }));
  });

  it('swaps in a demo scenario from the server, and the link carries it', async () => {
    await page.selectOption('#control-scenario', 'highway-truck.scenario.json');
    await page.waitForFunction(() => window.alight!.analysisText().includes('"name": "highway truck"'));
    await waitIdle(page);
    const text = await page.evaluate(() => window.alight!.analysisText());
    expect(JSON.parse(text).scenario.carrier.speed).toBe(JSON.parse(readFileSync(join(repo, 'data-demo', 'highway-truck.scenario.json'), 'utf8')).carrier.speed);
    expect(await page.textContent('#control-scenario option:first-child')).toBe('highway truck');
  });

  it('exports a figure as SVG and PNG and its data as CSV', async () => {
    const svg = await downloaded(page, () => page.click('[data-figure="success"] button:text-is("SVG")'));
    expect(svg.name).toBe('detection-success.svg');
    expect(svg.bytes.toString('utf8')).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    const png = await downloaded(page, () => page.click('[data-figure="success"] button:text-is("PNG")'));
    expect(png.name).toBe('detection-success.png');
    expect([...png.bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.bytes.readUInt32BE(16)).toBe(880); // 2x the 440 px figure width
    const csv = await downloaded(page, () => page.click('[data-figure="success"] button:text-is("CSV")'));
    const lines = csv.bytes.toString('utf8').trim().split('\n');
    expect(lines[0]).toBe('detector.dropout,trials,landed,successRate,wilsonLow,wilsonHigh,z');
    expect(lines.length).toBe(5);
  });

  it('explains a damaged link and falls back to a default study', async () => {
    await page.goto(server.url + '#analysis=eyJzdHVkeSI6IndlYXRoZXIifQ');
    await page.waitForSelector('.message[role="alert"]');
    expect(await page.textContent('.message[role="alert"]')).toContain('field "study" must be one of');
    await waitIdle(page);
  });

  it('checks a scenario without eval (strict CSP) and says what Node says about it', async () => {
    const violations: string[] = [];
    page.on('console', (m) => void (/Content Security Policy|unsafe-eval/.test(m.text()) && violations.push(m.text())));
    const scenario = { ...JSON.parse(JSON.stringify(defaultScenario())), version: 2, detector: { ...defaultScenario().detector, pixelNoise: -1, colour: 'red' } };
    const text = JSON.stringify({ study: 'landing', scenario, parameters: {}, seed: 1, toolVersion: VERSION });
    let nodeProblems: readonly string[] = [];
    try {
      parseAnalysis(text, 'the link', (id) => studyById(id).parameters);
    } catch (error) {
      nodeProblems = (error as AnalysisError).problems;
    }
    expect(nodeProblems.length).toBeGreaterThanOrEqual(3); // version, pixelNoise and the unknown key
    await page.goto(server.url + '#analysis=' + Buffer.from(text).toString('base64url'));
    await page.waitForSelector('.message[role="alert"]');
    expect(await page.textContent('.message[role="alert"]')).toBe(`This link's analysis could not be used:\n${nodeProblems.join('\n')}`);
    await waitIdle(page);
    expect(violations).toEqual([]);
  });

  it('cancels a running sweep and keeps what it had', async () => {
    const big: Analysis = { study: 'detection', scenario: defaultScenario(), parameters: { impairment: 'pixelNoise', trials: 60, confidence: '0.95' }, seed: 1, toolVersion: VERSION };
    await page.goto(server.url + '#study=landing');
    await waitIdle(page);
    await page.goto(server.url + '#analysis=' + Buffer.from(analysisToText(big)).toString('base64url'));
    await page.waitForFunction(() => /running: [1-9]/.test(document.querySelector('[data-figure="success"] .status')?.textContent ?? ''), undefined, { timeout: 30_000 });
    await page.click('#cancel');
    await waitIdle(page, 10_000);
    const status = await page.textContent('[data-figure="success"] .status');
    expect(status).toMatch(/^cancelled after \d+ of 240 trials$/);
    expect(Number(/after (\d+)/.exec(status!)![1])).toBeLessThan(240);
    expect(await page.textContent('.run-text')).toBe('cancelled: partial results shown');
    // The same button now runs the study again, from the start.
    expect(await page.textContent('#cancel')).toBe('Run again');
    await page.click('#cancel');
    await page.waitForFunction(() => /running: /.test(document.querySelector('[data-figure="success"] .status')?.textContent ?? ''));
    await page.click('#cancel');
    await waitIdle(page, 10_000);
  });
});
