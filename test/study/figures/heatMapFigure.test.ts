import { describe, expect, it } from 'vitest';
import { heatMapFigure } from '../../../estimator/study/figures/heatMapFigure.js';
import { expectWellFormedSvg } from './expectWellFormedSvg.js';

describe('heatMapFigure', () => {
  it('heatMapFigure draws one cell per grid setting and marks the best', () => {
    const cells = [0.1, 1, 10].flatMap((x) => [0.1, 1, 10].map((y) => ({ x, y, value: Math.log(x) ** 2 + Math.log(y) ** 2 })));
    const svg = heatMapFigure(cells, { xLabel: 'q', yLabel: 'r', valueLabel: 'cost', lowerIsBetter: true, best: { x: 1, y: 1 } });
    expectWellFormedSvg(svg);
    expect((svg.match(/<rect [^>]*><title>q /g) ?? []).length).toBe(9);
    expect(svg).toContain('<title>recommended</title>');
  });
});
