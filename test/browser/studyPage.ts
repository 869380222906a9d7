// Helpers for driving a study page in chromium: open an analysis by permalink, wait until every
// figure is complete, read the numbers and redraw counts the page exposes.
import type { Page } from 'playwright-core';
import { analysisToText, type Analysis } from '../../notebooks/analysis/Analysis.js';
import { permalinkFragment } from '../../notebooks/analysis/permalink.js';

export async function openAnalysis(page: Page, baseUrl: string, analysis: Analysis): Promise<void> {
  await page.goto(baseUrl + permalinkFragment(analysisToText(analysis)));
  await waitIdle(page);
}

export async function waitIdle(page: Page, timeout = 90_000): Promise<void> {
  await page.waitForFunction(() => document.body.dataset.state === 'idle' && window.alight !== undefined, undefined, { timeout, polling: 50 });
}

export function renders(page: Page): Promise<Record<string, number>> {
  return page.evaluate(() => window.alight!.renders());
}

export function computeCounts(page: Page): Promise<Record<string, number>> {
  return page.evaluate(() => window.alight!.computeCounts());
}

/** The full-precision value behind a number shown under a figure. */
export async function shownValue(page: Page, figure: string, key: string): Promise<number> {
  const text = await page.getAttribute(`[data-figure="${figure}"] dd[data-key="${key}"]`, 'data-value');
  if (text === null || text === '') throw new Error(`no number ${key} under figure ${figure}`);
  return Number(text);
}

/**
 * Change a control the way a person would (select an option, or arrow keys on a slider), then
 * wait until `dependent` has redrawn and the page is idle again; returns redraws before and after.
 */
export async function changeControl(page: Page, change: () => Promise<void>, dependent: string): Promise<{ before: Record<string, number>; after: Record<string, number> }> {
  const before = await renders(page);
  await change();
  await page.waitForFunction(([name, count]) => window.alight!.renders()[name as string]! > (count as number), [dependent, before[dependent]!] as const, { timeout: 90_000, polling: 50 });
  await waitIdle(page);
  // Let any straggling recomputation show itself before counting.
  await page.waitForTimeout(250);
  await waitIdle(page);
  return { before, after: await renders(page) };
}

/** Numbers in a report's HTML by key, from the same data-key / data-value attributes the page uses. */
export function reportValue(html: string, key: string): number {
  const match = new RegExp(`data-key="${key}" data-value="([^"]*)"`).exec(html);
  if (!match || match[1] === '') throw new Error(`report has no number ${key}`);
  return Number(match[1]);
}

/** The text a reader sees for a number in a report. */
export function reportText(html: string, key: string): string {
  const match = new RegExp(`data-key="${key}" data-value="[^"]*">([^<]*)<`).exec(html);
  if (!match) throw new Error(`report has no number ${key}`);
  return match[1]!;
}
