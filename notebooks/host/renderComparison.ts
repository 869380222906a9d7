// A against B as HTML: what differs between the two analyses, success per matched point with the
// Newcombe interval of B - A, and the figures' key numbers side by side. Both tables carry
// captions and header scopes; every number carries its full value in data-value for checks.
import type { Analysis } from '../analysis/Analysis.js';
import { escapeXml, formatNumber, formatPercent } from '../figures/svg.js';
import type { Comparison } from '../studies/compareOutputs.js';

/** What B changes against A, in words: study, parameters, seed, scenario. */
export function analysisDifferences(a: Analysis, b: Analysis): string[] {
  const out: string[] = [];
  // Different studies have different controls: the study is the difference worth saying.
  if (a.study !== b.study) return [`study ${a.study} → ${b.study}`];
  const names = new Set([...Object.keys(a.parameters), ...Object.keys(b.parameters)]);
  for (const name of names) if (a.parameters[name] !== b.parameters[name]) out.push(`${name} ${a.parameters[name] ?? '–'} → ${b.parameters[name] ?? '–'}`);
  if (a.seed !== b.seed) out.push(`seed ${a.seed} → ${b.seed}`);
  if (a.scenario.name !== b.scenario.name) out.push(`scenario ${a.scenario.name} → ${b.scenario.name}`);
  else if (JSON.stringify(a.scenario) !== JSON.stringify(b.scenario)) out.push(`scenario ${a.scenario.name} edited`);
  return out;
}

const cell = (text: string, value: number | null): string => `<td data-value="${value === null ? '' : String(value)}">${escapeXml(text)}</td>`;

export function comparisonHtml(a: Analysis, b: Analysis, comparison: Comparison, aName: string): string {
  const changes = analysisDifferences(a, b);
  const parts = [`<h2 id="compare-heading">A against B</h2><p class="hint">A: ${escapeXml(aName)}. B: what the page shows now. ${changes.length > 0 ? `B changes ${escapeXml(changes.join('; '))}.` : 'B is the same analysis as A.'}</p>`];
  if (comparison.counts.length > 0) {
    parts.push(
      `<table class="compare-counts"><caption>Landing success, B against A, with the Newcombe 95 % interval of B − A (from the two Wilson intervals)</caption><thead><tr><th scope="col">figure and point</th><th scope="col">A landed</th><th scope="col">B landed</th><th scope="col">B − A</th><th scope="col">interval</th><th scope="col">reading</th></tr></thead><tbody>${comparison.counts
        .map(
          (d) =>
            `<tr data-row="${escapeXml(`${d.figure}: ${d.row}`)}"><th scope="row">${escapeXml(`${d.figure}: ${d.row}`)}</th>${cell(`${d.a.landed} / ${d.a.trials}`, d.a.landed / d.a.trials)}${cell(`${d.b.landed} / ${d.b.trials}`, d.b.landed / d.b.trials)}${cell(formatPercent(d.difference), d.difference)}<td data-low="${d.low}" data-high="${d.high}">${escapeXml(`${formatPercent(d.low)} to ${formatPercent(d.high)}`)}</td><td>${escapeXml(d.reading)}</td></tr>`,
        )
        .join('')}</tbody></table>`,
    );
  }
  if (comparison.numbers.length > 0) {
    parts.push(
      `<table class="compare-numbers"><caption>Key numbers under each figure, A and B (no interval: these are not counts)</caption><thead><tr><th scope="col">figure: number</th><th scope="col">A</th><th scope="col">B</th><th scope="col">B − A</th></tr></thead><tbody>${comparison.numbers
        .map((n) => `<tr><th scope="row">${escapeXml(`${n.figure}: ${n.label}`)}</th>${cell(n.aText, n.a)}${cell(n.bText, n.b)}${cell(formatNumber(n.b - n.a), n.b - n.a)}</tr>`)
        .join('')}</tbody></table>`,
    );
  }
  if (comparison.counts.length === 0 && comparison.numbers.length === 0) parts.push('<p>A and B share no point or number to compare (different studies or sweeps).</p>');
  return parts.join('');
}
