// Bad input in chromium, as a person meets it: a wrong seed is named and nothing reruns; a broken
// link keeps its address and names the problem on the study it was meant for; an analysis file
// dropped on the page opens (and the log drop zone refuses one); a failed job is said once; a
// demo log can be chosen after a drop; Back undoes a control change; landmarks, labels, table
// headers and contrast hold.
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { VERSION } from '../../estimator/version.js';
import { analysisToText, type Analysis } from '../../notebooks/analysis/Analysis.js';
import { launchChromium, runBrowserTests, type Browser } from '../../notebooks/scripts/launchChromium.node.js';
import { startStaticServer, type RunningServer } from '../../notebooks/server/staticServer.node.js';
import { contrastRatio } from './contrast.js';
import { computeCounts, openAnalysis, waitIdle } from './studyPage.js';

const repo = fileURLToPath(new URL('../..', import.meta.url));

/** Drop files on an element the way a file manager does (a DataTransfer of File objects). */
async function dropFiles(page: Page, selector: string, files: { name: string; text: string }[]): Promise<boolean> {
  return page.evaluate(
    ([sel, list]) => {
      const transfer = new DataTransfer();
      for (const f of list) transfer.items.add(new File([f.text], f.name));
      const target = document.querySelector(sel)!;
      const over = new DragEvent('dragover', { dataTransfer: transfer, bubbles: true, cancelable: true });
      target.dispatchEvent(over);
      target.dispatchEvent(new DragEvent('drop', { dataTransfer: transfer, bubbles: true, cancelable: true }));
      return over.defaultPrevented;
    },
    [selector, files] as const,
  );
}

const analysisText = (page: Page): Promise<string> => page.evaluate(() => window.alight!.analysisText());

describe.skipIf(!runBrowserTests)('bad input and history in chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    if (!existsSync(join(repo, 'dist', 'notebooks', 'app.js'))) execFileSync('node', ['build.mjs'], { cwd: repo, stdio: 'inherit' });
    server = await startStaticServer({ pageDir: join(repo, 'dist', 'notebooks'), demoDir: join(repo, 'data-demo'), port: 0 });
    browser = await launchChromium();
    page = await browser.context.newPage();
    page.on('pageerror', (error) => pageErrors.push(error.message));
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('names each wrong seed beside the field and reruns nothing until a good one', async () => {
    await page.goto(server.url + '#study=landing');
    await waitIdle(page);
    const runs = (await computeCounts(page)).run;
    const cases: [string, string][] = [
      ['-5', 'The seed -5 is negative'],
      ['1.5', 'The seed 1.5 is not a whole number'],
      ['1e20', 'The seed 1e20 is too large'],
      ['abc', 'The seed "abc" is not a number'],
      ['', 'The seed is empty'],
    ];
    for (const [typed, said] of cases) {
      await page.fill('#control-seed', typed);
      await page.press('#control-seed', 'Enter');
      expect(await page.textContent('#seed-problem'), typed).toBe(`${(await import('../../notebooks/host/seedProblem.js')).seedProblem(typed)} The study still uses seed 1.`);
      expect(await page.textContent('#seed-problem'), typed).toContain(said);
      expect(await page.isVisible('#seed-problem')).toBe(true);
      expect(await page.getAttribute('#control-seed', 'aria-invalid')).toBe('true');
      expect(JSON.parse(await analysisText(page)).seed, typed).toBe(1);
    }
    expect((await computeCounts(page)).run).toBe(runs);
    await page.fill('#control-seed', '7');
    await page.press('#control-seed', 'Enter');
    await waitIdle(page);
    expect(await page.isVisible('#seed-problem')).toBe(false);
    expect(JSON.parse(await analysisText(page)).seed).toBe(7);
    expect((await computeCounts(page)).run).toBe(runs + 1);
  });

  it('keeps each bad link in the address bar and names the problem on the study it was meant for', async () => {
    const utf8 = Buffer.concat([Buffer.from('{"study":"carrier","x":"'), Buffer.from([0xff, 0xfe]), Buffer.from('"}')]).toString('base64url');
    const refused = Buffer.from(JSON.stringify({ study: 'tuning', scenario: defaultScenario(), parameters: {}, seed: 1.5, toolVersion: VERSION })).toString('base64url');
    const links: { fragment: string; title: string; said: string }[] = [
      { fragment: '#analysis=not$base64', title: 'One landing, step by step', said: 'character "$" at position 4 is not base64url' },
      { fragment: '#analysis=' + utf8, title: 'Carrier speed and path', said: 'its bytes are not UTF-8 text' },
      { fragment: '#analysis=' + refused, title: 'Filter tuning', said: 'field "seed" must be a non-negative whole number' },
      { fragment: '#analysis=' + Buffer.from('{"study":"weather"}').toString('base64url'), title: 'One landing, step by step', said: 'field "study" must be one of' },
      { fragment: '#study=nonsense', title: 'One landing, step by step', said: 'a study named "nonsense", and there is none' },
    ];
    for (const link of links) {
      await page.goto('about:blank');
      await page.goto(server.url + link.fragment);
      await page.waitForSelector('.message[role="alert"]');
      await waitIdle(page);
      expect(await page.textContent('.message[role="alert"]'), link.fragment).toContain(link.said);
      expect(await page.textContent('h1'), link.fragment).toBe(link.title);
      expect(new URL(page.url()).hash, link.fragment).toBe(link.fragment);
    }
  });

  it('opens an analysis file dropped on the page body, and never lets the browser navigate to it', async () => {
    await page.goto(server.url + '#study=landing');
    await waitIdle(page);
    const a: Analysis = { study: 'carrier', scenario: defaultScenario(), parameters: { maxSpeed: 4, trials: 1, target: 0.7, envelopeRule: 'lower' }, seed: 9, toolVersion: VERSION };
    const handled = await dropFiles(page, 'main h1', [{ name: 'mine.json', text: analysisToText(a) }]);
    expect(handled).toBe(true); // dragover prevented: the browser will not open the file itself
    await page.waitForFunction(() => document.querySelector('h1')?.textContent === 'Carrier speed and path');
    await waitIdle(page);
    expect(await analysisText(page)).toBe(analysisToText(a));
    // A dropped file that is no analysis is refused in words, and the study stays.
    await dropFiles(page, '.setup', [{ name: 'notes.txt', text: 'hello' }]);
    await page.waitForSelector('.message[data-source="open"]');
    expect(await page.textContent('.message[data-source="open"]')).toContain('notes.txt is neither an analysis file');
    expect(await page.textContent('h1')).toBe('Carrier speed and path');
    // Back returns to the study before the drop.
    await page.goBack();
    await page.waitForFunction(() => document.querySelector('h1')?.textContent === 'One landing, step by step');
    await waitIdle(page);
  });

  it('replay: the log drop zone refuses an analysis, a broken log is said once, and the demo select works after a drop', async () => {
    await page.goto(server.url + '#study=replay');
    await waitIdle(page);
    const a: Analysis = { study: 'landing', scenario: defaultScenario(), parameters: {}, seed: 1, toolVersion: VERSION };
    await dropFiles(page, '.dropzone', [{ name: 'landing-analysis.json', text: analysisToText(a) }]);
    await page.waitForSelector('.dropzone .message:not([hidden])');
    expect(await page.textContent('.dropzone .message')).toContain('landing-analysis.json is an analysis file, not part of a flight log');
    expect(await page.textContent('h1')).toBe('Flight-log replay');
    expect(await page.textContent('[data-figure="source"] th[scope="row"]')).toBe('data-demo/logs/harbour-boat/');

    // A folder without camera.json fails the replay: one message, not one per figure.
    const folder = join(repo, 'data-demo', 'logs', 'harbour-boat');
    const files = readdirSync(folder).filter((n) => n !== 'camera.json').map((name) => ({ name, text: readFileSync(join(folder, name), 'utf8') }));
    await dropFiles(page, '.dropzone', files);
    await page.waitForSelector('.message[data-source="compute"]');
    await waitIdle(page);
    expect(await page.locator('.message[role="alert"]:visible').count()).toBe(1);
    expect(await page.textContent('.message[data-source="compute"]')).toContain('camera.json');
    expect(await page.locator('.plate', { hasText: 'Not drawn: see the problem at the top of the study.' }).count()).toBeGreaterThanOrEqual(3);

    // The demo select replaces the dropped folder.
    await page.selectOption('#control-log', 'logs/delivery-van-no-truth');
    await page.waitForFunction(() => document.querySelector('[data-figure="source"] th[scope="row"]')?.textContent === 'data-demo/logs/delivery-van-no-truth/');
    await waitIdle(page);
    expect(await page.locator('.message[data-source="compute"]').count()).toBe(0);
    expect(await page.getAttribute('[data-figure="rows"] dd[data-key="filterSteps"]', 'data-value')).toMatch(/^[1-9]\d*$/);
  });

  it('replay: every problem row is listed with file, line and field, and downloads as CSV', async () => {
    await page.goto(server.url + '#study=replay');
    await waitIdle(page);
    const folder = join(repo, 'data-demo', 'logs', 'harbour-boat');
    const files = readdirSync(folder).map((name) => ({ name, text: readFileSync(join(folder, name), 'utf8') }));
    const boxes = files.find((f) => f.name === 'boxes.csv')!;
    const lines = boxes.text.split('\n');
    // Spoil the first field of twelve data rows (lines 3, 5, ... 25 of the file): each is skipped and named.
    for (let k = 0; k < 12; k++) lines[2 + 2 * k] = lines[2 + 2 * k]!.replace(/^[^,]*/, 'oops');
    boxes.text = lines.join('\n');
    await dropFiles(page, '.dropzone', files);
    await page.waitForFunction(() => document.querySelectorAll('[data-figure="rows"] table').length === 2);
    await waitIdle(page);
    const rows = await page.$$eval('[data-figure="rows"] table:nth-of-type(2) tbody tr', (trs) => trs.map((tr) => [...tr.children].map((c) => c.textContent)));
    expect(rows).toHaveLength(12);
    expect(rows[0]!.slice(0, 2)).toEqual(['boxes.csv', '3']);
    expect(rows[11]!.slice(0, 2)).toEqual(['boxes.csv', '25']);
    expect(await page.textContent('[data-figure="rows"] .plate-body')).toContain('12 problem rows were skipped');
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-figure="rows"] button:text-is("Problems (CSV)")')]);
    expect(download.suggestedFilename()).toBe('replay-problems.csv');
    const csv = readFileSync(await download.path(), 'utf8').trim().split('\n');
    expect(csv[0]).toBe('file,line,field,kind,problem');
    expect(csv).toHaveLength(13);
  });

  it('detection: own swept values are checked as typed, and a value the scenario refuses is said once', async () => {
    const a: Analysis = { study: 'detection', scenario: defaultScenario(), parameters: { impairment: 'dropout', trials: 1 }, seed: 2, toolVersion: VERSION };
    await openAnalysis(page, server.url, a);
    await page.fill('#control-values', '0, x');
    await page.press('#control-values', 'Enter');
    expect(await page.textContent('#control-values-problem')).toBe('Swept values (empty: the default grid): "x" is not a number (got "0, x"). The study still uses its default values.');
    await page.fill('#control-values', '0.3, 0');
    await page.press('#control-values', 'Enter');
    await page.waitForFunction(() => document.querySelectorAll('[data-figure="claims"] tbody tr').length === 2);
    await waitIdle(page);
    expect(await page.$$eval('[data-figure="claims"] tbody th', (ths) => ths.map((t) => t.textContent))).toEqual(['0', '0.3']);
    expect(JSON.parse(await analysisText(page)).parameters.values).toBe('0.3, 0');
    await page.fill('#control-values', '0, 1.5');
    await page.press('#control-values', 'Enter');
    await page.waitForSelector('.message[data-source="compute"]');
    await waitIdle(page);
    expect(await page.locator('.message[role="alert"]:visible').count()).toBe(1);
    expect(await page.textContent('.message[data-source="compute"]')).toContain('detector.dropout');
  });

  it('Back undoes a control change; a held arrow key commits once', async () => {
    await page.goto(server.url + '#study=landing');
    await waitIdle(page);
    const before = await analysisText(page);
    const runs = (await computeCounts(page)).run;
    await page.focus('#control-speed');
    for (let i = 0; i < 4; i++) await page.keyboard.press('ArrowRight');
    await page.waitForFunction((r) => window.alight!.computeCounts().run! > r, runs);
    await waitIdle(page);
    await page.waitForTimeout(800); // longer than the slider's pause: no second commit comes
    expect((await computeCounts(page)).run).toBe(runs + 1);
    expect(JSON.parse(await analysisText(page)).parameters.speed).toBe(5);
    await page.goBack();
    await page.waitForFunction(() => (document.querySelector('#control-speed') as HTMLInputElement).value === '3');
    await waitIdle(page);
    expect(await analysisText(page)).toBe(before);
    expect((await computeCounts(page)).run).toBe(runs + 2);
    expect(await page.textContent('#control-speed ~ output, .control:has(#control-speed) output')).toBe('3 m/s');
    await page.goForward();
    await page.waitForFunction(() => (document.querySelector('#control-speed') as HTMLInputElement).value === '5');
    await waitIdle(page);
    expect(JSON.parse(await analysisText(page)).parameters.speed).toBe(5);
  });

  it('has landmarks, labelled controls, table headers and 3:1 focus ring and series', async () => {
    const a: Analysis = { study: 'detection', scenario: defaultScenario(), parameters: { impairment: 'dropout', trials: 1 }, seed: 2, toolVersion: VERSION };
    await openAnalysis(page, server.url, a);
    const audit = await page.evaluate(() => {
      const unlabelled = [...document.querySelectorAll('input:not([hidden]), select, button')].filter((el) => {
        const id = el.id;
        const byFor = id && document.querySelector(`label[for="${id}"]`);
        return !byFor && !el.getAttribute('aria-label') && !(el.textContent ?? '').trim() && !el.closest('label');
      });
      const tables = [...document.querySelectorAll('main table')];
      return {
        main: document.querySelectorAll('main').length,
        nav: document.querySelectorAll('nav[aria-label]').length,
        aside: document.querySelectorAll('aside[aria-label]').length,
        unlabelled: unlabelled.map((el) => el.outerHTML.slice(0, 80)),
        tables: tables.length,
        captionless: tables.filter((t) => !t.querySelector('caption')?.textContent?.trim()).length,
        unscoped: tables.flatMap((t) => [...t.querySelectorAll('th')]).filter((th) => !th.getAttribute('scope')).length,
        slidersWithoutText: [...document.querySelectorAll('input[type=range]')].filter((r) => !r.getAttribute('aria-valuetext')).length,
      };
    });
    expect(audit.main).toBe(1);
    expect(audit.nav).toBe(1);
    expect(audit.aside).toBe(1);
    expect(audit.unlabelled).toEqual([]);
    expect(audit.tables).toBeGreaterThanOrEqual(2);
    expect(audit.captionless).toBe(0);
    expect(audit.unscoped).toBe(0);
    expect(audit.slidersWithoutText).toBe(0);
    // Focus ring: the outline colour a keyboard user sees, against the page behind it.
    await page.focus('#control-trials');
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    const ring = await page.evaluate(() => {
      const el = document.activeElement!;
      const style = getComputedStyle(el);
      return { outline: style.outlineColor, width: style.outlineWidth, paper: getComputedStyle(document.body).backgroundColor, plate: getComputedStyle(document.querySelector('.setup')!).backgroundColor };
    });
    expect(ring.width).toBe('3px');
    expect(contrastRatio(ring.outline, ring.paper)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(ring.outline, ring.plate)).toBeGreaterThanOrEqual(3);
    // Every stroked data series drawn in the figures, against the plate they sit on.
    // Grid lines (GRID, #e4e0d6) are left out: they are a faint guide, not data; so are the halos
    // in the plate's own colour (#fffdf8) that part markers from the lines beneath them.
    const strokes = await page.evaluate(() => [...new Set([...document.querySelectorAll('.plate-body svg path[stroke], .plate-body svg circle[stroke], .plate-body svg line[stroke]')].map((e) => e.getAttribute('stroke')!).filter((s) => s.startsWith('#') && !['#e4e0d6', '#fffdf8'].includes(s.toLowerCase())))]);
    const plate = await page.evaluate(() => getComputedStyle(document.querySelector('.plate')!).backgroundColor);
    expect(strokes.length).toBeGreaterThanOrEqual(2);
    for (const s of strokes) expect(contrastRatio(s, plate), s).toBeGreaterThanOrEqual(3);
    // A point's tooltip shows on keyboard focus too, not on hover alone.
    await page.focus('[data-figure="success"] [data-tip]');
    const tip = await page.getAttribute('[data-figure="success"] [data-tip]', 'data-tip');
    expect(tip).toMatch(/^\d+ of 1 landed$/);
    expect(await page.isVisible('#focus-tip')).toBe(true);
    expect(await page.textContent('#focus-tip')).toBe(tip);
    await page.keyboard.press('Tab');
    expect(pageErrors).toEqual([]);
  });
});
