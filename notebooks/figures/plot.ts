// One plot builder for every figure: axes from d3 scales, layers drawn as SVG strings.
// Lines break at non-finite values instead of drawing through them.
import { area, line, scaleLinear, scaleLog, type ScaleContinuousNumeric } from 'd3';
import { DASHES, GRID, INK, MUTED } from './palette.js';
import { el, escapeXml, formatNumber } from './svg.js';

export interface Axis {
  label: string;
  domain: [number, number];
  log?: boolean;
  ticks?: number;
  format?: (value: number) => string;
  /** Named ticks instead of numbers (e.g. path shapes at 0, 1, 2...). */
  tickLabels?: readonly { value: number; label: string }[];
}

export type Layer =
  | { kind: 'line'; x: ArrayLike<number>; y: ArrayLike<number>; color: string; dash?: number; width?: number; label?: string }
  | { kind: 'band'; x: ArrayLike<number>; low: ArrayLike<number>; high: ArrayLike<number>; color: string; opacity?: number; label?: string }
  | { kind: 'points'; x: ArrayLike<number>; y: ArrayLike<number>; color: string; radius?: number; shape?: 'circle' | 'square' | 'diamond'; titles?: readonly string[]; label?: string }
  | { kind: 'errorbars'; x: ArrayLike<number>; low: ArrayLike<number>; high: ArrayLike<number>; color: string }
  | { kind: 'rects'; rects: readonly { x0: number; x1: number; y0: number; y1: number; fill: string; stroke?: string; title?: string }[]; label?: string; legendColor?: string }
  | { kind: 'outline'; x: readonly number[]; y: readonly number[]; color: string; fill?: string; dash?: number; label?: string }
  | { kind: 'rule'; axis: 'x' | 'y'; value: number; color: string; dash?: number; label?: string }
  | { kind: 'text'; x: number; y: number; text: string; color?: string; anchor?: 'start' | 'middle' | 'end' };

export interface PlotSpec {
  /** Accessible name of the figure. */
  title: string;
  width: number;
  height: number;
  x: Axis;
  y: Axis;
  layers: readonly Layer[];
  /** Same metres per pixel on both axes (maps, camera image): domains grow to fit. */
  equalAspect?: boolean;
  /** Image-style y axis: grows downwards. */
  yDown?: boolean;
  /** A note in the top-left corner (e.g. "partial: 12 of 40 trials"). */
  note?: string;
  /** Left margin (px) for long category labels; default 58. */
  marginLeft?: number;
  /** Legend in rows under the plot (default), so it never hides data; false: over the top-right corner. */
  legendBelow?: boolean;
}

const BASE_MARGIN = { top: 14, right: 14, bottom: 42, left: 58 };

function makeScale(axis: Axis, range: [number, number]): ScaleContinuousNumeric<number, number> {
  const [a, b] = axis.domain;
  const domain: [number, number] = a === b ? [a - 1, b + 1] : [a, b];
  return (axis.log ? scaleLog() : scaleLinear()).domain(domain).range(range);
}

/**
 * A mark with a tooltip can take keyboard focus and names itself to screen readers; the page
 * shows the same text beside it on focus (data-tip), as the SVG title shows it on hover.
 */
function focusTip(text: string | undefined): Record<string, string> {
  return text ? { tabindex: '0', role: 'img', 'aria-label': text, 'data-tip': text } : {};
}

/** Tick values; a log axis over two or more decades ticks at the decades only (1, 10, 100...), else at 1, 2 and 5 of each. */
function axisTicks(scale: ScaleContinuousNumeric<number, number>, axis: Axis, count: number): number[] {
  const ticks = scale.ticks(axis.ticks ?? count);
  if (!axis.log) return ticks;
  const mantissa = (v: number): number => Math.round(v / 10 ** Math.floor(Math.log10(v) + 1e-9));
  const decades = ticks.filter((v) => mantissa(v) === 1);
  return decades.length >= 2 ? decades : ticks.filter((v) => [1, 2, 5].includes(mantissa(v)));
}

function widen(domain: [number, number], span: number): [number, number] {
  const mid = (domain[0] + domain[1]) / 2;
  return [mid - span / 2, mid + span / 2];
}

export function plotSvg(spec: PlotSpec): string {
  // A legend below wraps into rows; each row takes 16 px off the plot's height.
  const legendBelow = spec.legendBelow ?? true;
  const below = legendBelow ? legendRows(spec.layers, spec.width - 20) : [];
  const MARGIN = { ...BASE_MARGIN, left: spec.marginLeft ?? BASE_MARGIN.left, bottom: BASE_MARGIN.bottom + 16 * below.length + (below.length > 0 ? 2 : 0) };
  const innerW = spec.width - MARGIN.left - MARGIN.right;
  const innerH = spec.height - MARGIN.top - MARGIN.bottom;
  let xAxis = spec.x;
  let yAxis = spec.y;
  if (spec.equalAspect) {
    const perPx = Math.max((xAxis.domain[1] - xAxis.domain[0]) / innerW, (yAxis.domain[1] - yAxis.domain[0]) / innerH);
    xAxis = { ...xAxis, domain: widen(xAxis.domain, perPx * innerW) };
    yAxis = { ...yAxis, domain: widen(yAxis.domain, perPx * innerH) };
  }
  const x = makeScale(xAxis, [MARGIN.left, MARGIN.left + innerW]);
  const y = makeScale(yAxis, spec.yDown ? [MARGIN.top, MARGIN.top + innerH] : [MARGIN.top + innerH, MARGIN.top]);
  const parts: string[] = [];

  // Grid and axes.
  const xTicks = xAxis.tickLabels ?? axisTicks(x, xAxis, 6).map((v) => ({ value: v, label: (xAxis.format ?? formatNumber)(v) }));
  const yTicks = yAxis.tickLabels ?? axisTicks(y, yAxis, 5).map((v) => ({ value: v, label: (yAxis.format ?? formatNumber)(v) }));
  // Labels that would touch the previous one are left out (their grid line stays).
  let lastRight = -Infinity;
  for (const t of xTicks) {
    const px = x(t.value);
    parts.push(el('line', { x1: px, x2: px, y1: MARGIN.top, y2: MARGIN.top + innerH, stroke: GRID }));
    const half = (t.label.length * 6.2) / 2;
    if (px - half < lastRight + 4) continue;
    lastRight = px + half;
    parts.push(el('text', { x: px, y: MARGIN.top + innerH + 16, 'text-anchor': 'middle', fill: MUTED, 'font-size': 11 }, escapeXml(t.label)));
  }
  let lastY = Infinity;
  for (const t of yTicks) {
    const py = y(t.value);
    parts.push(el('line', { x1: MARGIN.left, x2: MARGIN.left + innerW, y1: py, y2: py, stroke: GRID }));
    if (Math.abs(py - lastY) < 13) continue;
    lastY = py;
    parts.push(el('text', { x: MARGIN.left - 6, y: py + 4, 'text-anchor': 'end', fill: MUTED, 'font-size': 11 }, escapeXml(t.label)));
  }
  parts.push(el('rect', { x: MARGIN.left, y: MARGIN.top, width: innerW, height: innerH, fill: 'none', stroke: MUTED, 'stroke-width': 0.8 }));
  parts.push(el('text', { x: MARGIN.left + innerW / 2, y: MARGIN.top + innerH + 36, 'text-anchor': 'middle', fill: INK, 'font-size': 12 }, escapeXml(xAxis.label)));
  parts.push(
    el('text', { transform: `translate(14 ${MARGIN.top + innerH / 2}) rotate(-90)`, 'text-anchor': 'middle', fill: INK, 'font-size': 12 }, escapeXml(yAxis.label)),
  );

  // Layers, clipped to the plot area.
  const clipId = 'clip-' + Math.abs(hash(spec.title)).toString(36);
  const drawn: string[] = [];
  const legend: { label: string; color: string; dash: number; kind: Layer['kind']; shape: 'circle' | 'square' | 'diamond' }[] = [];
  for (const layer of spec.layers) {
    drawn.push(drawLayer(layer, x, y));
    if ('label' in layer && layer.label) {
      const color = layer.kind === 'rects' ? (layer.legendColor ?? layer.rects[0]?.fill ?? INK) : layer.color;
      // rules are dashed unless told otherwise (drawLayer), and the legend shows them so
      const dash = layer.kind === 'rule' ? (layer.dash ?? 1) : 'dash' in layer ? (layer.dash ?? 0) : 0;
      legend.push({ label: layer.label, color, dash, kind: layer.kind, shape: layer.kind === 'points' ? (layer.shape ?? 'circle') : 'circle' });
    }
  }
  parts.push(el('clipPath', { id: clipId }, el('rect', { x: MARGIN.left, y: MARGIN.top, width: innerW, height: innerH })));
  parts.push(el('g', { 'clip-path': `url(#${clipId})` }, ...drawn));

  // Legend: top right (or in a row below), one entry per labelled layer, each with its own dash as well as colour.
  legend.forEach((item, i) => {
    const slot = below.flatMap((row, r) => row.map((x) => ({ r, x })))[i];
    const ly = slot ? spec.height - 6 - 16 * (below.length - 1 - slot.r) : MARGIN.top + 12 + i * 15;
    const lx = slot ? slot.x + 154 : MARGIN.left + innerW - 8;
    const swatch =
      item.kind === 'band' || item.kind === 'rects'
        ? el('rect', { x: lx - 150, y: ly - 6, width: 18, height: 9, fill: item.color, 'fill-opacity': item.kind === 'band' ? 0.3 : 1, stroke: item.kind === 'rects' ? MUTED : null, 'stroke-width': item.kind === 'rects' ? 0.5 : null })
        : item.kind === 'points'
          ? pointMark(item.shape, lx - 141, ly - 2, 3.5, { fill: item.color })
          : el('line', { x1: lx - 150, x2: lx - 132, y1: ly - 2, y2: ly - 2, stroke: item.color, 'stroke-width': 2, 'stroke-dasharray': DASHES[item.dash] || null });
    const ground = legendBelow ? '' : el('rect', { x: lx - 154, y: ly - 10, width: 154, height: 15, fill: '#fffdf8', 'fill-opacity': 0.85 });
    parts.push(el('g', { class: 'legend' }, ground, swatch, el('text', { x: lx - 128, y: ly + 2, fill: INK, 'font-size': 11 }, escapeXml(item.label))));
  });
  if (spec.note) parts.push(el('text', { x: MARGIN.left + 6, y: MARGIN.top + 14, fill: MUTED, 'font-size': 11, 'font-style': 'italic' }, escapeXml(spec.note)));

  return el(
    'svg',
    { xmlns: 'http://www.w3.org/2000/svg', viewBox: `0 0 ${spec.width} ${spec.height}`, width: spec.width, height: spec.height, role: 'img', 'aria-label': spec.title, 'font-family': 'system-ui, sans-serif' },
    el('title', {}, escapeXml(spec.title)),
    ...parts,
  );
}

type Scale = ScaleContinuousNumeric<number, number>;

function finite(...values: number[]): boolean {
  return values.every((v) => Number.isFinite(v));
}

function drawLayer(layer: Layer, x: Scale, y: Scale): string {
  switch (layer.kind) {
    case 'line': {
      const idx = Array.from({ length: layer.x.length }, (_, i) => i);
      const path = line<number>().defined((i) => finite(layer.x[i]!, layer.y[i]!)).x((i) => x(layer.x[i]!)).y((i) => y(layer.y[i]!))(idx);
      return el('path', { d: path ?? '', fill: 'none', stroke: layer.color, 'stroke-width': layer.width ?? 1.8, 'stroke-dasharray': DASHES[layer.dash ?? 0] || null });
    }
    case 'band': {
      const idx = Array.from({ length: layer.x.length }, (_, i) => i);
      const path = area<number>().defined((i) => finite(layer.x[i]!, layer.low[i]!, layer.high[i]!))
        .x((i) => x(layer.x[i]!)).y0((i) => y(layer.low[i]!)).y1((i) => y(layer.high[i]!))(idx);
      return el('path', { d: path ?? '', fill: layer.color, 'fill-opacity': layer.opacity ?? 0.22, stroke: 'none' });
    }
    case 'points': {
      const marks: string[] = [];
      for (let i = 0; i < layer.x.length; i++) {
        const px = x(layer.x[i]!);
        const py = y(layer.y[i]!);
        if (!finite(px, py)) continue;
        const r = layer.radius ?? 3.5;
        const text = layer.titles?.[i];
        const title = text ? el('title', {}, escapeXml(text)) : '';
        const shape = layer.shape ?? 'circle';
        marks.push(pointMark(shape, px, py, r, { fill: layer.color, stroke: '#fffdf8', 'stroke-width': 0.8, ...focusTip(text) }, title));
      }
      return marks.join('');
    }
    case 'errorbars': {
      const marks: string[] = [];
      for (let i = 0; i < layer.x.length; i++) {
        const px = x(layer.x[i]!);
        const lo = y(layer.low[i]!);
        const hi = y(layer.high[i]!);
        if (!finite(px, lo, hi)) continue;
        marks.push(el('path', { d: `M${px - 4} ${lo}H${px + 4}M${px} ${lo}V${hi}M${px - 4} ${hi}H${px + 4}`, stroke: layer.color, 'stroke-width': 1.3, fill: 'none' }));
      }
      return marks.join('');
    }
    case 'rects':
      return layer.rects
        .map((r) => {
          const x0 = x(r.x0), x1 = x(r.x1), y0 = y(r.y0), y1 = y(r.y1);
          if (!finite(x0, x1, y0, y1)) return '';
          return el('rect', { x: Math.min(x0, x1), y: Math.min(y0, y1), width: Math.abs(x1 - x0), height: Math.abs(y1 - y0), fill: r.fill, stroke: r.stroke ?? null, ...focusTip(r.title) },
            ...(r.title ? [el('title', {}, escapeXml(r.title))] : []));
        })
        .join('');
    case 'outline': {
      const pts = layer.x.map((v, i) => [x(v), y(layer.y[i]!)] as const).filter(([a, b]) => finite(a, b));
      if (pts.length < 2) return '';
      return el('path', { d: 'M' + pts.map(([a, b]) => `${Math.round(a * 10) / 10} ${Math.round(b * 10) / 10}`).join('L') + 'Z', fill: layer.fill ?? 'none', stroke: layer.color, 'stroke-width': 1.6, 'stroke-dasharray': DASHES[layer.dash ?? 0] || null });
    }
    case 'rule': {
      if (layer.axis === 'y') {
        const py = y(layer.value);
        if (!finite(py)) return '';
        return el('line', { x1: x.range()[0]!, x2: x.range()[1]!, y1: py, y2: py, stroke: layer.color, 'stroke-width': 1.3, 'stroke-dasharray': DASHES[layer.dash ?? 1] || null });
      }
      const px = x(layer.value);
      if (!finite(px)) return '';
      return el('line', { x1: px, x2: px, y1: y.range()[0]!, y2: y.range()[1]!, stroke: layer.color, 'stroke-width': 1.3, 'stroke-dasharray': DASHES[layer.dash ?? 1] || null });
    }
    case 'text':
      return el('text', { x: x(layer.x), y: y(layer.y), fill: layer.color ?? INK, 'font-size': 11, 'text-anchor': layer.anchor ?? 'start' }, escapeXml(layer.text));
  }
}

/** One marker of a points layer (also its legend swatch): circle, square or diamond of radius r around (px, py). */
function pointMark(shape: 'circle' | 'square' | 'diamond', px: number, py: number, r: number, attrs: Record<string, string | number>, title = ''): string {
  const children = title ? [title] : [];
  if (shape === 'square') return el('rect', { x: px - r, y: py - r, width: 2 * r, height: 2 * r, ...attrs }, ...children);
  if (shape === 'diamond') return el('path', { d: `M${px} ${py - r * 1.3}L${px + r * 1.3} ${py}L${px} ${py + r * 1.3}L${px - r * 1.3} ${py}Z`, ...attrs }, ...children);
  return el('circle', { cx: px, cy: py, r, ...attrs }, ...children);
}

/** Approximate width (px) of a legend entry at 11 px type: swatch, gap and text. */
function entryWidth(label: string): number {
  return 30 + label.length * 6.8; // generous: wide letters (m, w) must not run into the next entry
}

/** Left x of each labelled layer's legend entry, wrapped into rows that fit `width`. */
function legendRows(layers: readonly Layer[], width: number): number[][] {
  const rows: number[][] = [];
  let x = Infinity;
  for (const layer of layers) {
    if (!('label' in layer) || !layer.label) continue;
    const w = entryWidth(layer.label);
    if (x + w > width) {
      rows.push([]);
      x = 14;
    }
    rows[rows.length - 1]!.push(x);
    x += w;
  }
  return rows;
}

function hash(text: string): number {
  let h = 0;
  for (let i = 0; i < text.length; i++) h = (Math.imul(h, 31) + text.charCodeAt(i)) | 0;
  return h;
}

/** Domain covering all finite values, padded by a fraction on each side. */
export function extent(values: Iterable<number>, pad = 0.05, fallback: [number, number] = [0, 1]): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (lo === Infinity) return fallback;
  const span = hi - lo || Math.abs(hi) || 1;
  return [lo - span * pad, hi + span * pad];
}
