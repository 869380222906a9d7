import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { formatHeader, formatRecord } from '../../estimator/study/resultsFile.js';
import { header, records } from '../study/testCardFixture.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-test-card-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
writeFileSync(join(dir, 'r.jsonl'), [formatHeader(header), ...records.map(({ v, point, trial, params, ...result }) => formatRecord(point, trial, params, result))].join('\n') + '\n');

describe('alight test-card', () => {
  it('prints the card and writes the printable page', async () => {
    const io = fakeIo(dir);
    expect(await main(['test-card', 'r.jsonl', '--path', 'detector.latency', '--up-to', '0.15', '--rate', '0.9', '--html', 'card.html'], io)).toBe(0);
    const text = io.out.join('');
    expect(text).toMatch(/^CAUTION: /);
    expect(text).toContain('detector.latency = 0.1 (nominal)');
    expect(text).toContain('if every flight lands: 29 flights confirm the claim');
    expect(readFileSync(join(dir, 'card.html'), 'utf8')).toContain('<h1>Flight-test card: default</h1>');
  });

  it('--json carries the conditions and their flight counts', async () => {
    const io = fakeIo(dir);
    expect(await main(['test-card', 'r.jsonl', '--path', 'detector.latency', '--up-to', '0.15', '--rate', '0.9', '--json'], io)).toBe(0);
    const card = JSON.parse(io.out.join('')) as { conditions: { value: number; counts: { allLand: number } }[] };
    expect(card.conditions.map((c) => c.value)).toEqual([0.1, 0.15, 0.2]);
    expect(card.conditions[0]!.counts.allLand).toBe(29);
  });

  it('refuses bad input with a message and exit 2', async () => {
    for (const [argv, message] of [
      [['r.jsonl', '--path', 'detector.latency', '--up-to', '0.15'], /give --rate RATE/],
      [['r.jsonl', '--path', 'detector.latency', '--rate', '0.9'], /exactly one of --up-to V or --down-to V/],
      [['r.jsonl', '--path', 'detector.rate', '--up-to', '0.15', '--rate', '0.9'], /detector\.rate was not varied/],
      [['r.jsonl', '--path', 'detector.latency', '--up-to', '0.15', '--rate', '1.5'], /--rate/],
      [['missing.jsonl', '--path', 'detector.latency', '--up-to', '0.15', '--rate', '0.9'], /missing\.jsonl: no such file/],
    ] as const) {
      const io = fakeIo(dir);
      expect(await main(['test-card', ...argv], io)).toBe(2);
      expect(io.err.join('')).toMatch(message);
      expect(io.err.join('')).not.toMatch(/\bat \w+ \(/);
    }
  });
});
