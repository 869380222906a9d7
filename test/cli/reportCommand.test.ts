import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { main } from '../../estimator/cli/main.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { simulateTrial } from '../../estimator/study/simulateTrial.js';
import { summarizeGroup } from '../../estimator/study/summarize.js';
import { VERSION } from '../../estimator/version.js';
import { analysisToText } from '../../notebooks/analysis/Analysis.js';
import { logSourceFromFolder } from '../../estimator/io/log/logSourceFromFolder.node.js';
import { replayLog } from '../../estimator/io/log/replayLog.js';
import { fileURLToPath } from 'node:url';

let work: string;

async function run(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await main(argv, { stdout: (t) => (out += t), stderr: (t) => (err += t), interactive: false, cwd: work, env: {} });
  return { code, out, err };
}

function value(html: string, key: string): number {
  return Number(new RegExp(`data-key="${key}" data-value="([^"]*)"`).exec(html)![1]);
}

describe('alight report', () => {
  beforeAll(() => {
    work = mkdtempSync(join(tmpdir(), 'alight-report-'));
  });
  afterAll(() => rmSync(work, { recursive: true, force: true }));

  it('renders a study into one self-contained HTML file with the library\'s numbers and the caution', async () => {
    const scenario = defaultScenario();
    writeFileSync(join(work, 'a.json'), analysisToText({ study: 'detection', scenario, parameters: { impairment: 'latency', trials: 2, confidence: '0.95' }, seed: 9, toolVersion: VERSION }));
    const { code, out } = await run(['report', 'a.json', '--out', 'a.html']);
    expect(code).toBe(0);
    expect(out).toContain('a.html');
    const html = readFileSync(join(work, 'a.html'), 'utf8');
    // Point 0 of the latency sweep is latency 0 s; its summary straight from the library.
    const params = { 'detector.latency': 0 };
    const s = applyParams(scenario, params);
    const records = [0, 1].map((trial) => ({ v: 1 as const, point: 0, trial, params, ...simulateTrial(s, { seed: 9, point: 0, trial }) }));
    const expected = summarizeGroup(params, records);
    expect(value(html, 'successRate0')).toBe(expected.successRate);
    expect(value(html, 'wilsonLow0')).toBe(expected.wilsonLow);
    expect(html).toContain(SAFETY_CAUTION);
    expect(html.match(/<svg /g)!.length).toBeGreaterThanOrEqual(2);
    // Self-contained: no script and no external resource.
    expect(html).not.toMatch(/<script|<link |src="http|href="http/);
    // The analysis travels with the report.
    expect(html).toContain('&quot;study&quot;: &quot;detection&quot;');
  });

  it('replays a demo log by name with replayLog\'s own numbers', async () => {
    writeFileSync(join(work, 'r.json'), analysisToText({ study: 'replay', scenario: defaultScenario(), parameters: { log: 'logs/delivery-van-no-truth', qScale: '2', rScale: '1' }, seed: 1, toolVersion: VERSION }));
    const { code, err } = await run(['report', 'r.json', '--out', 'r.html']);
    expect(code, err).toBe(0);
    const html = readFileSync(join(work, 'r.html'), 'utf8');
    const folder = fileURLToPath(new URL('../../data-demo/logs/delivery-van-no-truth', import.meta.url));
    const expected = await replayLog(logSourceFromFolder(folder), { filter: { qScale: 2, rScale: 1 }, filterSource: 'study controls' });
    expect(value(html, 'nisMean')).toBe(expected.nisMean);
    expect(value(html, 'gateRejections')).toBe(expected.gateRejections);
    expect(value(html, 'filterSteps')).toBe(expected.filterSteps);
  });

  it('says when the analysis was made by another version', async () => {
    writeFileSync(join(work, 'old.json'), analysisToText({ study: 'carrier', scenario: defaultScenario(), parameters: { maxSpeed: 4, trials: 1 }, seed: 1, toolVersion: '0.0.9' }));
    const { code } = await run(['report', 'old.json', '--out', 'old.html']);
    expect(code).toBe(0);
    expect(readFileSync(join(work, 'old.html'), 'utf8')).toContain(`This analysis was made with alight 0.0.9 and rendered by ${VERSION}: numbers may differ from the original.`);
  });

  it('names the file and each bad field, exit 2', async () => {
    writeFileSync(join(work, 'bad.json'), JSON.stringify({ study: 'detection', scenario: defaultScenario(), parameters: { trials: 0 }, seed: 1.5, toolVersion: VERSION }));
    const { code, err } = await run(['report', 'bad.json', '--out', 'bad.html']);
    expect(code).toBe(2);
    expect(err).toBe('alight report: bad.json:1: field "seed" must be a non-negative whole number, got 1.5\nalight report: bad.json:1: parameters.trials must be within [1, 1000] trials, got 0\n');
  });

  it('refuses a missing file and a missing argument with a message, exit 2', async () => {
    const missing = await run(['report', 'nope.json']);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/^alight report: cannot read nope\.json: ENOENT/);
    const none = await run(['report']);
    expect(none.code).toBe(2);
    expect(none.err).toContain('expected one analysis file');
  });
});
