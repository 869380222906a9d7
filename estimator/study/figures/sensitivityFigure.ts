// Sensitivity ranking as horizontal bars: success lost over each impairment's plausible range,
// with its 95 % interval as a whisker; zero marked, largest loss on top.
import { scaleBand, scaleLinear } from 'd3';
import { ACCENT, INK } from './palette.js';
import { bottomAxis, escapeXml, px, svgDocument, type Frame } from './svg.js';

export interface SensitivityBar {
  label: string;
  loss: number;
  low: number;
  high: number;
}

export function sensitivityFigure(bars: readonly SensitivityBar[], title = 'Landing success lost over each plausible range'): string {
  const rowHeight = 28;
  const frame: Frame = { width: 720, height: 110 + rowHeight * bars.length, margin: { top: 48, right: 32, bottom: 70, left: 300 } };
  const { margin, width, height } = frame;
  const lo = Math.min(0, ...bars.map((b) => b.low));
  const hi = Math.max(0.05, ...bars.map((b) => b.high));
  const x = scaleLinear().domain([lo, hi]).range([margin.left, width - margin.right]).nice();
  const y = scaleBand<number>().domain(bars.map((_, i) => i)).range([margin.top, height - margin.bottom]).padding(0.3);
  let body = bottomAxis(x, frame, 'success lost (fraction of trials), 95 % interval', { format: (v) => `${Math.round(v * 100)} %` });
  body += `<line x1="${px(x(0))}" x2="${px(x(0))}" y1="${margin.top}" y2="${height - margin.bottom}" stroke="${INK}"/>\n`;
  bars.forEach((b, i) => {
    const top = y(i)!, h = y.bandwidth(), mid = top + h / 2;
    const x0 = Math.min(x(0), x(b.loss)), x1 = Math.max(x(0), x(b.loss));
    body += `<text x="${margin.left - 8}" y="${px(mid)}" dy="0.32em" text-anchor="end">${escapeXml(b.label)}</text>`;
    body += `<rect x="${px(x0)}" y="${px(top)}" width="${px(x1 - x0)}" height="${px(h)}" fill="${ACCENT}" fill-opacity="0.75"><title>${escapeXml(`${b.label}: ${(100 * b.loss).toFixed(1)} % (${(100 * b.low).toFixed(1)} to ${(100 * b.high).toFixed(1)} %)`)}</title></rect>`;
    body += `<line x1="${px(x(b.low))}" x2="${px(x(b.high))}" y1="${px(mid)}" y2="${px(mid)}" stroke="${INK}" stroke-width="1.5"/>`;
    body += `<line x1="${px(x(b.low))}" x2="${px(x(b.low))}" y1="${px(mid - 5)}" y2="${px(mid + 5)}" stroke="${INK}"/><line x1="${px(x(b.high))}" x2="${px(x(b.high))}" y1="${px(mid - 5)}" y2="${px(mid + 5)}" stroke="${INK}"/>\n`;
  });
  return svgDocument(frame, title, body);
}
