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
