import { describe, expect, it } from 'vitest';
import { extent, plotSvg } from '../../../notebooks/figures/plot.js';

describe('plotSvg', () => {
  const base = { title: 'T', width: 400, height: 250, x: { label: 'x (m)', domain: [0, 10] as [number, number] }, y: { label: 'y', domain: [0, 1] as [number, number] } };

  it('maps data to pixels through the scales (margins 58 left, 14 right, 14 top, 42 bottom)', () => {
    const svg = plotSvg({ ...base, layers: [{ kind: 'points', x: [0, 10], y: [0, 1], color: '#000' }] });
    // x: 0 -> 58, 10 -> 386; y: 0 -> 208 (250 - 42), 1 -> 14.
    expect(svg).toContain('cx="58" cy="208"');
    expect(svg).toContain('cx="386" cy="14"');
    expect(svg).toContain('aria-label="T"');
  });

  it('breaks a line at non-finite values instead of drawing through them', () => {
    const svg = plotSvg({ ...base, layers: [{ kind: 'line', x: [0, 1, 2, 3, 4], y: [0, 0.5, NaN, 0.5, 0], color: '#000' }] });
    const d = /<path d="([^"]*)" fill="none"/.exec(svg)![1]!;
    expect(d.match(/M/g)!.length).toBe(2);
    expect(d).not.toContain('NaN');
  });

  it('escapes text and draws a legend entry per labelled layer', () => {
    const svg = plotSvg({ ...base, layers: [{ kind: 'line', x: [0, 1], y: [0, 1], color: '#000', label: 'a<b' }] });
    expect(svg).toContain('a&lt;b');
    expect(svg).not.toContain('a<b');
  });

  it('keeps metres per pixel equal on both axes when asked', () => {
    const svg = plotSvg({ ...base, equalAspect: true, layers: [{ kind: 'outline', x: [0, 10, 10, 0], y: [0, 0, 10, 10], color: '#000' }] });
    const d = /<path d="M([^"]*)Z"/.exec(svg)![1]!;
    const pts = d.split('L').map((p) => p.split(' ').map(Number));
    const w = Math.abs(pts[1]![0]! - pts[0]![0]!);
    const h = Math.abs(pts[2]![1]! - pts[1]![1]!);
    expect(Math.abs(w - h)).toBeLessThan(0.2);
  });
});

describe('log axis labels', () => {
  it('labels only the decades over several decades, so labels never overlap', () => {
    const svg = plotSvg({ title: 'log', width: 440, height: 270, x: { label: 't', domain: [0, 1] }, y: { label: 'NIS', domain: [0.01, 100], log: true, ticks: 4 }, layers: [] });
    const labels = [...svg.matchAll(/<text x="52" y="[^"]*" text-anchor="end"[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
    expect(labels).toEqual(['0.01', '0.1', '1', '10', '100']);
  });
});

describe('extent', () => {
  it('pads the finite range and ignores NaN', () => {
    expect(extent([1, NaN, 3], 0.5)).toEqual([0, 4]);
    expect(extent([], 0.1, [2, 5])).toEqual([2, 5]);
  });
});
