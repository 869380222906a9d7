import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { flightCounts } from '../../estimator/study/flightCounts.js';
import { testCard } from '../../estimator/study/testCard.js';
import { testCardHtml } from '../../estimator/study/testCardHtml.js';
import { testCardText } from '../../estimator/study/testCardText.js';
import { header, records } from './testCardFixture.js';

const claim = { path: 'detector.latency', limit: 0.15, direction: 'up-to' as const, rate: 0.9, confidence: 0.95 };

describe('testCard', () => {
  const card = testCard(header, records, claim);

  it('picks the nominal point, the claim edge and the point just beyond it', () => {
    expect(card.conditions.map((c) => [c.value, c.roles])).toEqual([[0.1, ['nominal']], [0.15, ['claim edge']], [0.2, ['beyond the claim']]]);
    expect(card.statement).toBe('success >= 90 % at 95 % confidence for detector.latency up to 0.15');
  });

  it('plans each condition on its simulated rate with the exact binomial counts', () => {
    const edge = card.conditions[1]!;
    expect(edge.simulatedRate).toBe(36 / 40);
    expect(edge.counts).toEqual(flightCounts(0.9, 0.95, 36 / 40, { power: 0.8 }));
    expect(edge.countsAtLow).toEqual(flightCounts(0.9, 0.95, edge.wilsonLow, { power: 0.8 })); // the simulation's own uncertainty, planned too
    expect(edge.counts.expect).toBe('undecided'); // simulated exactly at the claim: no test separates them
    const nominal = card.conditions[0]!;
    expect(nominal.counts.expect).toBe('confirm');
    expect(nominal.counts.allLand).toBe(29); // 0.9^29 = 0.047 <= 0.05 < 0.9^28 (exact binomial, zero failures)
    expect(nominal.causes[0]).toMatchObject({ cause: 'dropout-burst', count: 1 });
  });

  it('takes abort criteria from the scenario envelope and guidance', () => {
    const s = defaultScenario();
    const text = card.abortCriteria.join('\n');
    expect(text).toContain(`${s.envelope.maxClosingSpeed} m/s`);
    expect(text).toContain(`${s.envelope.maxTiltDeg} deg`);
    expect(text).toContain(`more than ${s.guidance.lostTimeout} s`);
    expect(text).toContain('1.45 m at the trailing height'); // funnelBase 0.25 + funnelSlope 0.2 x trailHeight 6 m
  });

  it('puts the flight-safety caution first in the text and at the top of the printable page', () => {
    expect(testCardText(card).startsWith(`CAUTION: ${SAFETY_CAUTION}`)).toBe(true);
    const html = testCardHtml(card);
    expect(html.indexOf(SAFETY_CAUTION)).toBeLessThan(html.indexOf('<h1>'));
    expect(html).toMatch(/^<!doctype html>/);
    expect(html).toContain('@media print');
  });

  it('refuses a path that was not varied and a claim no point lies in', () => {
    expect(() => testCard(header, records, { ...claim, path: 'detector.rate' })).toThrow(/detector\.rate was not varied in this sweep \(varied: detector\.latency\)/);
    expect(() => testCard(header, records, { ...claim, limit: 0.01 })).toThrow(/no sweep point lies inside the claim/);
  });
});
