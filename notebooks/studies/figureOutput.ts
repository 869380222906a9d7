// Turning a job's state into a figure value: waiting, partial, final, cancelled or failed.
import type { JobState } from '../jobs/JobState.js';
import { progressText } from '../jobs/JobState.js';
import { escapeXml, formatNumber } from '../figures/svg.js';
import type { FigureOutput, KeyNumber } from './Study.js';

/** Plate sizes (px, SVG user units): half-width plates and full-width plates at 1280 px. */
export const HALF = { width: 440, height: 270 };
export const WIDE = { width: 900, height: 290 };

export interface Drawn {
  kind?: 'svg' | 'table';
  markup: string;
  csv?: string | null;
  numbers?: readonly KeyNumber[];
  attachment?: { label: string; fileName: string; text: string };
}

export function fromState<T>(state: JobState<T>, unit: string, draw: (value: T, partial: boolean) => Drawn): FigureOutput {
  const status = progressText(state, unit);
  if (state.error) return { kind: 'table', markup: `<p class="message">${escapeXml(state.error)}</p>`, csv: null, numbers: [], final: true, status, failure: state.error };
  if (state.value === null) return { kind: 'table', markup: '<p>waiting for the first results…</p>', csv: null, numbers: [], final: state.final, status };
  const drawn = draw(state.value, !state.final || state.cancelled);
  const output: FigureOutput = { kind: drawn.kind ?? 'svg', markup: drawn.markup, csv: drawn.csv ?? null, numbers: drawn.numbers ?? [], final: state.final, status };
  if (drawn.attachment) output.attachment = drawn.attachment;
  return output;
}

export function keyNumber(key: string, label: string, value: number | null, text = formatNumber(value)): KeyNumber {
  return { key, label, value, text };
}

/** CSV with a header row; numbers at full precision, text quoted when needed. */
export function toCsv(header: readonly string[], rows: readonly (readonly (number | string | null)[])[]): string {
  const cell = (v: number | string | null): string => {
    if (v === null) return '';
    if (typeof v === 'number') return String(v);
    return /[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
  };
  return [header.map(cell).join(','), ...rows.map((r) => r.map(cell).join(','))].join('\n') + '\n';
}

/**
 * A plain HTML table (the page and the report both show it): a caption for screen readers and
 * the report's reader, column headers with scope, and each row's first cell as its row header.
 */
export function htmlTable(header: readonly string[], rows: readonly (readonly string[])[], caption = ''): string {
  const head = `<thead><tr>${header.map((h) => `<th scope="col">${escapeXml(h)}</th>`).join('')}</tr></thead>`;
  const body = rows.map((r) => `<tr>${r.map((c, i) => (i === 0 ? `<th scope="row">${escapeXml(c)}</th>` : `<td>${escapeXml(c)}</td>`)).join('')}</tr>`).join('');
  return `<table>${caption ? `<caption>${escapeXml(caption)}</caption>` : ''}${head}<tbody>${body}</tbody></table>`;
}

/** Tables drawn without a caption get the figure's title as theirs (page and report alike). */
export function withCaptions(markup: string, title: string): string {
  return markup.replace(/<table>(?!<caption>)/g, `<table><caption>${escapeXml(title)}</caption>`);
}
