// Tuning surface: score over two log-scaled multipliers as a cividis heat map, best cell marked.
import { interpolateCividis, scaleLog, scaleSequential } from 'd3';
import { INK } from './palette.js';
import { bottomAxis, escapeXml, leftAxis, px, svgDocument, type Frame } from './svg.js';

export interface HeatCell {
  x: number;
  y: number;
  value: number;
}

export interface HeatMapOptions {
  xLabel: string;
  yLabel: string;
  valueLabel: string;
  title?: string;
  /** Lower values are better (costs): colour them bright. */
  lowerIsBetter?: boolean;
  best?: { x: number; y: number };
}

/** Cells on a log-spaced grid (each distinct x and y is a column / row). */
export function heatMapFigure(cells: readonly HeatCell[], options: HeatMapOptions): string {
  const frame: Frame = { width: 660, height: 480, margin: { top: 56, right: 150, bottom: 56, left: 72 } };
  const { margin, width, height } = frame;
  const xs = [...new Set(cells.map((c) => c.x))].sort((a, b) => a - b);
  const ys = [...new Set(cells.map((c) => c.y))].sort((a, b) => a - b);
  const half = (v: number[], i: number, side: -1 | 1) => {
    const j = i + side;
    const other = v[j] ?? v[i]! * (v.length > 1 ? (side > 0 ? v[i]! / v[i - 1]! : v[i + 1]! / v[i]!) ** side : Math.SQRT2 ** side);
    return Math.sqrt(v[i]! * other);
  };
  const x = scaleLog().domain([half(xs, 0, -1), half(xs, xs.length - 1, 1)]).range([margin.left, width - margin.right]);
  const y = scaleLog().domain([half(ys, 0, -1), half(ys, ys.length - 1, 1)]).range([height - margin.bottom, margin.top]);
  const finite = cells.map((c) => c.value).filter(Number.isFinite);
  const lo = Math.min(...finite), hi = Math.max(...finite);
  const colour = scaleSequential(interpolateCividis).domain(options.lowerIsBetter ? [hi, lo === hi ? hi - 1 : lo] : [lo, lo === hi ? lo + 1 : hi]);
  let body = '';
  for (const c of cells) {
    const i = xs.indexOf(c.x), j = ys.indexOf(c.y);
    const x0 = x(half(xs, i, -1)), x1 = x(half(xs, i, 1)), y0 = y(half(ys, j, 1)), y1 = y(half(ys, j, -1));
    const fill = Number.isFinite(c.value) ? colour(c.value) : '#ffffff';
    body += `<rect x="${px(x0)}" y="${px(y0)}" width="${px(x1 - x0)}" height="${px(y1 - y0)}" fill="${fill}"><title>${escapeXml(`${options.xLabel} ${c.x.toPrecision(3)}, ${options.yLabel} ${c.y.toPrecision(3)}: ${c.value.toPrecision(4)}`)}</title></rect>\n`;
  }
  // Ticks at the grid values themselves, as plain numbers (no SI prefixes: 0.1 is not "100m").
  const plain = (v: number) => String(Number(v.toPrecision(3)));
  body += bottomAxis(x, frame, options.xLabel, { values: xs, format: plain, grid: false }) + leftAxis(y, frame, options.yLabel, { values: ys, format: plain, grid: false });
  if (options.best) body += `<circle cx="${px(x(options.best.x))}" cy="${px(y(options.best.y))}" r="7" fill="none" stroke="#ffffff" stroke-width="3"/><circle cx="${px(x(options.best.x))}" cy="${px(y(options.best.y))}" r="7" fill="none" stroke="${INK}" stroke-width="1.5"><title>recommended</title></circle>\n`;
  // Colour legend.
  const lx = width - margin.right + 24, top = margin.top, bottom = height - margin.bottom, steps = 24;
  for (let k = 0; k < steps; k++) {
    const v = hi - ((hi - lo) * k) / (steps - 1);
    body += `<rect x="${lx}" y="${px(top + ((bottom - top) * k) / steps)}" width="16" height="${px((bottom - top) / steps + 0.5)}" fill="${colour(v)}"/>`;
  }
  body += `\n<text x="${lx + 20}" y="${top + 8}">${escapeXml(hi.toPrecision(3))}</text><text x="${lx + 20}" y="${bottom}">${escapeXml(lo.toPrecision(3))}</text>`;
  body += `<text x="${lx}" y="${top - 10}" font-size="11">${escapeXml(options.valueLabel)}</text>\n`;
  return svgDocument(frame, options.title ?? `${options.valueLabel} over ${options.xLabel} and ${options.yLabel}`, body);
}
