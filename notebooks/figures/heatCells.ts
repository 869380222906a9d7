// Cells of a heat map on log-spaced q x r grid: each sample gets a rectangle reaching halfway
// (geometrically) to its neighbours, so the map tiles the searched ranges.
import type { Layer } from './plot.js';

export interface HeatSample {
  x: number;
  y: number;
  fill: string;
  title: string;
}

function edges(levels: readonly number[]): Map<number, [number, number]> {
  const sorted = [...new Set(levels)].sort((a, b) => a - b);
  const out = new Map<number, [number, number]>();
  sorted.forEach((v, i) => {
    const below = i > 0 ? Math.sqrt(v * sorted[i - 1]!) : v / Math.sqrt(sorted[1] !== undefined ? sorted[1] / v : 2);
    const above = i < sorted.length - 1 ? Math.sqrt(v * sorted[i + 1]!) : v * Math.sqrt(sorted.length > 1 ? v / sorted[i - 1]! : 2);
    out.set(v, [below, above]);
  });
  return out;
}

export function heatCells(samples: readonly HeatSample[]): { layer: Layer; xDomain: [number, number]; yDomain: [number, number] } {
  const ex = edges(samples.map((s) => s.x));
  const ey = edges(samples.map((s) => s.y));
  const rects = samples.map((s) => {
    const [x0, x1] = ex.get(s.x)!;
    const [y0, y1] = ey.get(s.y)!;
    return { x0, x1, y0, y1, fill: s.fill, stroke: '#fffdf8', title: s.title };
  });
  const all = (m: Map<number, [number, number]>): [number, number] => {
    const v = [...m.values()].flat();
    return v.length ? [Math.min(...v), Math.max(...v)] : [0.1, 10];
  };
  return { layer: { kind: 'rects', rects }, xDomain: all(ex), yDomain: all(ey) };
}

/** Legend entries for a colour ramp: one swatch per (position on the ramp, label), no marks drawn. */
export function rampKey(color: (t: number) => string, stops: readonly (readonly [number, string])[]): Layer[] {
  return stops.map(([t, label]): Layer => ({ kind: 'rects', rects: [], label, legendColor: color(t) }));
}
