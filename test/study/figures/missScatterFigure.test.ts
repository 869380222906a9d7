import { describe, expect, it } from 'vitest';
import { missScatterFigure } from '../../../estimator/study/figures/missScatterFigure.js';
import { expectWellFormedSvg } from './expectWellFormedSvg.js';

describe('missScatterFigure', () => {
  it('missScatterFigure draws deck, pad and a legend by outcome', () => {
    const svg = missScatterFigure([{ x: 0.1, y: -0.2, outcome: 'landed' }, { x: 1.4, y: 0.2, outcome: 'off-pad' }], { padRadius: 0.5, deckLength: 2, deckWidth: 1.6, cep50: 0.3 });
    expectWellFormedSvg(svg);
    expect(svg).toContain('landed (1)');
    expect(svg).toContain('off-pad (1)');
    expect(svg).toContain('<title>landing pad</title>');
  });
});

describe('missScatterFigure with a contact off the carrier', () => {
  it('keeps the deck in view and lists the contacts outside it, farthest first', () => {
    const points = [
      { x: 0.1, y: -0.2, outcome: 'landed' as const },
      { x: 12.7, y: 0.4, outcome: 'off-carrier' as const },
      { x: -3, y: 1, outcome: 'off-carrier' as const },
    ];
    const options = { padRadius: 0.5, deckLength: 2, deckWidth: 1.6, cep50: 0.3 };
    const svg = missScatterFigure(points, options);
    expectWellFormedSvg(svg);
    // the axes span the deck's view (+-2 m: twice the half-length), not +-13 m
    const ticks = [...svg.matchAll(/>(-?\d+(?:\.\d+)?)<\/text>/g)].map((m) => Number(m[1]));
    expect(Math.max(...ticks.map(Math.abs))).toBeLessThanOrEqual(2);
    expect(svg).toContain('outside the view: 2');
    expect(svg.indexOf('off-carrier 12.7 m')).toBeGreaterThan(0);
    expect(svg.indexOf('off-carrier 12.7 m')).toBeLessThan(svg.indexOf('off-carrier 3.2 m')); // farthest first
    expect(svg).toContain('off-carrier (2)'); // the legend counts every contact
    // one dot drawn per contact inside the view (legend dots have r="4")
    expect(svg.match(/r="3"/g)!.length).toBe(1);
  });
});
