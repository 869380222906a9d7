import { describe, expect, it } from 'vitest';
import { successFigure } from '../../../estimator/study/figures/successFigure.js';
import { SAFETY_CAUTION, SAFETY_CAUTION_SHORT } from '../../../estimator/safetyCaution.js';
import { expectWellFormedSvg } from './expectWellFormedSvg.js';

describe('successFigure', () => {
  it('successFigure draws the rate line, the Wilson band and the target as well-formed SVG', () => {
    const svg = successFigure([
      { x: 0, rate: 1, low: 0.9, high: 1, trials: 35 },
      { x: 2, rate: 0.8, low: 0.65, high: 0.9, trials: 40 },
      { x: 4, rate: 0.4, low: 0.26, high: 0.55, trials: 40 },
    ], { xLabel: 'detector.pixelNoise <px>', target: 0.9 });
    expectWellFormedSvg(svg);
    expect(svg).toContain('detector.pixelNoise &lt;px&gt;');
    expect(svg).toContain('Wilson 95 % interval');
    expect((svg.match(/<circle /g) ?? []).length).toBe(3);
    // the footer carries the short form of the one caution text, cut from it
    expect(SAFETY_CAUTION_SHORT).toBe('Simulation and replay results clear nothing for flight.');
    expect(SAFETY_CAUTION.startsWith(SAFETY_CAUTION_SHORT)).toBe(true);
    expect(svg).toContain(`>alight · ${SAFETY_CAUTION_SHORT}</text>`);
  });
});
