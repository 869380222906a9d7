import { describe, expect, it } from 'vitest';
import { sensitivityFigure } from '../../../estimator/study/figures/sensitivityFigure.js';
import { expectWellFormedSvg } from './expectWellFormedSvg.js';

describe('sensitivityFigure', () => {
  it('sensitivityFigure draws one bar and one whisker per impairment, in the given order', () => {
    const svg = sensitivityFigure([
      { label: 'detector.pixelNoise 0.5 → 8', loss: 0.36, low: 0.24, high: 0.47 },
      { label: 'lander.wind.speed 0 → 8', loss: -0.02, low: -0.1, high: 0.06 },
    ]);
    expectWellFormedSvg(svg);
    const labels = [...svg.matchAll(/text-anchor="end">([^<]+)</g)].map((m) => m[1]);
    expect(labels).toEqual(['detector.pixelNoise 0.5 → 8', 'lander.wind.speed 0 → 8']);
    expect((svg.match(/<rect [^>]*fill-opacity="0.75"/g) ?? []).length).toBe(2);
    expect(svg).toContain('36.0 % (24.0 to 47.0 %)');
  });
});
