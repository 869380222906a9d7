import { describe, expect, it } from 'vitest';
import { defaultAnalysis } from '../../../notebooks/analysis/defaultAnalysis.js';
import { renderReport } from '../../../notebooks/report/renderReport.js';
import { studyById } from '../../../notebooks/studies/studies.js';

describe('renderReport prose', () => {
  it('leaves out prose about working the page and writes choices as their words', () => {
    const study = studyById('carrier');
    const analysis = { ...defaultAnalysis(study), parameters: { ...defaultAnalysis(study).parameters, envelopeRule: 'lower' } };
    const html = renderReport(study, analysis, new Map());
    expect(html).not.toContain('redraws only this figure');
    expect(html).toContain('<td>Envelope uses</td><td>its Wilson lower bound</td>');
    expect(html).not.toContain('<td>lower</td>');
    expect(html).toContain('<td>Trials per point</td><td>2 trials</td>');
  });

  it('detection: no page-only instruction, no fixed five-of-five sentence, no download without a button', () => {
    const html = renderReport(studyById('detection'), defaultAnalysis(studyById('detection')), new Map());
    expect(html).not.toMatch(/on the left|five (landings )?out of five|Download/i);
    expect(html).toContain('n landings out of n leave a Wilson lower bound of n / (n + z²)');
  });

  it('replay: lists no scenario, says which demo log it replays', () => {
    const study = studyById('replay');
    const html = renderReport(study, defaultAnalysis(study), new Map());
    expect(html).not.toContain('<td>scenario</td>');
    expect(html).not.toContain('Drop a log folder');
    expect(html).toContain('This report replays the demo log the analysis names (logs/harbour-boat)');
    expect(html).toContain('<td>Demo log</td><td>harbour-boat</td>');
  });
});
