// Success rate versus one parameter, with its Wilson 95 % band and an optional target line.
import { area, line, scaleLinear } from 'd3';
import { ACCENT, BAND, INK, TARGET } from './palette.js';
import { bottomAxis, DEFAULT_FRAME, escapeXml, leftAxis, px, svgDocument } from './svg.js';

export interface SuccessPoint {
  x: number;
  rate: number;
  low: number;
  high: number;
  trials: number;
}

export interface SuccessFigureOptions {
  title?: string;
  xLabel: string;
  /** Required success rate drawn as a dashed line. */
  target?: number;
}

export function successFigure(points: readonly SuccessPoint[], options: SuccessFigureOptions): string {
  const frame = DEFAULT_FRAME;
  const { margin, width, height } = frame;
  const sorted = points.slice().sort((a, b) => a.x - b.x);
  const xs = sorted.map((p) => p.x);
  const lo = Math.min(...xs), hi = Math.max(...xs);
  const x = scaleLinear().domain(lo === hi ? [lo - 1, hi + 1] : [lo, hi]).range([margin.left, width - margin.right]).nice();
  const y = scaleLinear().domain([0, 1]).range([height - margin.bottom, margin.top]);
  const band = area<SuccessPoint>().x((p) => x(p.x)).y0((p) => y(p.low)).y1((p) => y(p.high)).digits(2);
  const path = line<SuccessPoint>().x((p) => x(p.x)).y((p) => y(p.rate)).digits(2);
  let body = bottomAxis(x, frame, options.xLabel) + leftAxis(y, frame, 'landing success rate');
  body += `<path d="${band(sorted) ?? ''}" fill="${BAND}" fill-opacity="0.35" stroke="none"><title>Wilson 95 % interval</title></path>\n`;
  body += `<path d="${path(sorted) ?? ''}" fill="none" stroke="${ACCENT}" stroke-width="2"/>\n`;
  for (const p of sorted) {
    body += `<circle cx="${px(x(p.x))}" cy="${px(y(p.rate))}" r="3.5" fill="${ACCENT}"><title>${escapeXml(`${p.x}: ${(p.rate * 100).toFixed(1)} % (${(p.low * 100).toFixed(1)}–${(p.high * 100).toFixed(1)} %), ${p.trials} trials`)}</title></circle>\n`;
  }
  if (options.target !== undefined) {
    const ty = px(y(options.target));
    body += `<line x1="${margin.left}" x2="${width - margin.right}" y1="${ty}" y2="${ty}" stroke="${TARGET}" stroke-dasharray="6 4"/>`;
    body += `<text x="${width - margin.right}" y="${ty}" dy="-4" text-anchor="end" fill="${TARGET}">target ${escapeXml(String(options.target))}</text>\n`;
  }
  body += `<text x="${margin.left}" y="40" font-size="11" fill="${INK}" opacity="0.8">line: observed rate · band: Wilson 95 % interval</text>\n`;
  return svgDocument(frame, options.title ?? `Landing success vs ${options.xLabel}`, body);
}
