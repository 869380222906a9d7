import { describe, expect, it } from 'vitest';
import { FOCUS, PAPER, PLATE, SERIES } from '../../../notebooks/figures/palette.js';
import { contrastRatio } from '../../browser/contrast.js';

describe('palette contrast (WCAG 2.1, success criterion 1.4.11: 3:1 for graphical objects)', () => {
  it('computes the reference ratios: black on white 21, white on white 1', () => {
    // Extremes of the WCAG 2.1 formula ((1 + 0.05) / (0 + 0.05) = 21).
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(contrastRatio('#ffffff', '#ffffff')).toBe(1);
  });

  it('every data series stands 3:1 against the plate', () => {
    for (const colour of SERIES) expect(contrastRatio(colour, PLATE), colour).toBeGreaterThanOrEqual(3);
  });

  it('the focus ring stands 3:1 against the page and the plate', () => {
    expect(contrastRatio(FOCUS, PAPER)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(FOCUS, PLATE)).toBeGreaterThanOrEqual(3);
  });
});
