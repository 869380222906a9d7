// One self-contained HTML file for an analysis: the study's prose, its figures inline as SVG,
// the same key numbers the page shows (same data-key / data-value), the analysis file itself,
// and the flight-safety caution. No script, no external resource.
import { VERSION } from '../../estimator/version.js';
import { analysisToText, type Analysis } from '../analysis/Analysis.js';
import { escapeXml } from '../figures/svg.js';
import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { PAGE_CSS } from '../host/styles.js';
import type { FigureOutput, Study } from '../studies/Study.js';
import { withCaptions } from '../studies/figureOutput.js';

export function renderReport(study: Study, analysis: Analysis, figures: ReadonlyMap<string, FigureOutput>): string {
  // A study that flies no scenario (replay) does not list the one its analysis carries.
  const fliesScenario = [...study.cells, ...study.figures].some((c) => c.inputs.includes('scenario'));
  const meta: [string, string][] = [
    ['study', study.title],
    ...(fliesScenario ? [['scenario', `${analysis.scenario.name}: ${analysis.scenario.description}`] as [string, string]] : []),
    ['master seed', String(analysis.seed)],
    ['analysis made with', `alight ${analysis.toolVersion}`],
    ['report rendered by', `alight ${VERSION}`],
    ...study.parameters.map((p): [string, string] => {
      const value = analysis.parameters[p.name] ?? p.default;
      // Choices read as their words ("its Wilson lower bound"), not their stored values ("lower").
      if (p.kind === 'choice') return [p.label, p.options.find((o) => o.value === value)?.label ?? String(value)];
      if (p.kind === 'list') return [p.label, value === '' ? 'the default values' : String(value)];
      return [p.label, String(value) + (p.unit ? ` ${p.unit}` : '')];
    }),
  ];
  const parts: string[] = [];
  let open = false;
  for (const block of study.blocks) {
    if ('figure' in block) {
      if (!open) parts.push('<div class="plates">');
      open = true;
      const figure = study.figures.find((f) => f.name === block.figure)!;
      const output = figures.get(block.figure);
      parts.push(
        `<figure class="plate${figure.wide ? ' wide' : ''}" data-figure="${escapeXml(figure.name)}" data-final="true"><header><h3>${escapeXml(figure.title)}</h3><p>${escapeXml(figure.caption)}</p></header>` +
          `<div class="plate-body">${output ? withCaptions(output.markup, figure.title) : '<p class="message">no result</p>'}</div>` +
          `<dl class="numbers">${(output?.numbers ?? [])
            .map((n) => `<div><dt>${escapeXml(n.label)}</dt><dd data-key="${escapeXml(n.key)}" data-value="${n.value === null ? '' : String(n.value)}">${escapeXml(n.text)}</dd></div>`)
            .join('')}</dl>` +
          `<div class="plate-foot"><span class="status">${escapeXml(output?.status ?? '')}</span></div></figure>`,
      );
      continue;
    }
    if (open) parts.push('</div>');
    open = false;
    if ('prose' in block) {
      if (!block.pageOnly) parts.push(`<p class="prose">${escapeXml(block.prose)}</p>`);
    }
    else parts.push(`<p class="prose">This report replays the demo log the analysis names (${escapeXml(String(analysis.parameters.log ?? ''))}); a folder dropped in the page is not part of an analysis.</p>`);
  }
  if (open) parts.push('</div>');
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeXml(study.title)} · alight report</title>
<style>${PAGE_CSS}</style>
</head>
<body data-state="idle">
<header class="masthead"><div class="wordmark">alight<small>study report</small></div></header>
<main class="report-main study">
<h1>${escapeXml(study.title)}</h1>
<p class="lede">${escapeXml(study.lede)}</p>
<p class="caution" role="note">${escapeXml(SAFETY_CAUTION)}</p>
${analysis.toolVersion === VERSION ? '' : `<p class="message">This analysis was made with alight ${escapeXml(analysis.toolVersion)} and rendered by ${VERSION}: numbers may differ from the original.</p>`}
<table class="report-meta">${meta.map(([k, v]) => `<tr><td>${escapeXml(k)}</td><td>${escapeXml(v)}</td></tr>`).join('')}</table>
${parts.join('\n')}
<details><summary>Analysis file (reproduces every number above: open it in the notebook page or run alight report on it)</summary><pre>${escapeXml(analysisToText(analysis))}</pre></details>
</main>
</body>
</html>
`;
}
