// Study: from a simulated claim to a flight-test card. One impairment is swept as in the
// detection study; the card says which conditions to fly, how many flights confirm or refute
// the claim (exact binomial, planned on the simulated rates) and when to abort. The card prints
// as one HTML page (download beside it), the flight-safety caution at its top.
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { testCard, TestCardError } from '../../estimator/study/testCard.js';
import { testCardFragment, testCardHtml } from '../../estimator/study/testCardHtml.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { SweepOutput } from '../jobs/sweepJob.js';
import { causeFigure } from './causeFigure.js';
import { IMPAIRMENTS } from './detectionStudy.js';
import { escapeXml } from '../figures/svg.js';
import { fromState, keyNumber, toCsv } from './figureOutput.js';
import type { Study } from './Study.js';

/** Impairments whose claim holds down to a limit (more is better); the others hold up to it. */
const DOWN_TO = new Set(['rate']);

export const testCardStudy: Study = {
  id: 'test-card',
  title: 'From a claim to a flight-test card',
  lede: 'State a claim such as “success at least 90 % at 95 % confidence up to 0.15 s of latency”. The sweep below simulates it; the card says which conditions to fly, how many flights confirm or refute the claim, and when to abort. It plans a test; it clears nothing for flight.',
  parameters: [
    {
      kind: 'choice',
      name: 'impairment',
      label: 'Claim ranges over',
      options: Object.entries(IMPAIRMENTS).map(([value, i]) => ({ value, label: i.label })),
      default: 'latency',
    },
    { kind: 'number', name: 'limit', label: 'Claimed up to (frame rate: down to)', unit: '', min: 0, max: 1000, step: 0.01, default: 0.15 },
    { kind: 'number', name: 'rate', label: 'Claim: success at least', unit: '', min: 0.5, max: 0.99, step: 0.01, default: 0.9 },
    { kind: 'number', name: 'level', label: 'Claimed at confidence', unit: '', min: 0.8, max: 0.99, step: 0.01, default: 0.95 },
    { kind: 'number', name: 'trials', label: 'Simulated trials per point', unit: 'trials', min: 1, max: 1000, step: 1, default: 20, integer: true },
  ],
  cells: [
    {
      name: 'sweep',
      inputs: ['jobs', 'scenario', 'seed', 'impairment', 'trials'],
      compute: (jobs: JobRunner, scenario: Scenario, seed: number, impairment: string, trials: number) => {
        const i = IMPAIRMENTS[impairment]!;
        const base = i.prepare ? i.prepare(scenario) : scenario;
        return jobs.run('sweep', { scenario: base, seed, trials, vary: [{ path: i.path, values: i.values }] }, `${i.label} sweep`);
      },
    },
  ],
  figures: [
    {
      name: 'card',
      title: 'Flight-test card',
      caption: 'Conditions to fly, flights each needs, the failure counts that confirm or refute the claim, and abort criteria. Download the card to print it as one page.',
      wide: true,
      inputs: ['sweep', 'impairment', 'limit', 'rate', 'level'],
      compute: (state: JobState<SweepOutput>, impairment: string, limit: number, rate: number, level: number) =>
        fromState(state, 'trials', (value) => {
          const claim = { path: IMPAIRMENTS[impairment]!.path, limit, direction: DOWN_TO.has(impairment) ? ('down-to' as const) : ('up-to' as const), rate, confidence: level };
          let card;
          try {
            card = testCard(value.header, value.records, claim);
          } catch (error) {
            // a claim the sweep cannot speak to is said in words, not thrown
            if (error instanceof TestCardError) return { kind: 'table', markup: `<p class="message">${escapeXml(error.message)}</p>` };
            throw error;
          }
          const edge = card.conditions.find((c) => c.roles.includes('claim edge'))!;
          return {
            kind: 'table',
            markup: testCardFragment(card),
            csv: toCsv(['value', 'roles', 'trials', 'landed', 'simulatedRate', 'expect', 'flights', 'confirmMaxFailures', 'refuteMinFailures', 'allLand'],
              card.conditions.map((c) => [c.value, c.roles.join('; '), c.trials, c.landed, c.simulatedRate, c.counts.expect, c.counts.flights, c.counts.confirmMaxFailures, c.counts.refuteMinFailures, c.counts.allLand])),
            numbers: [keyNumber('edgeFlights', 'flights at the claim edge', edge.counts.flights, edge.counts.flights === null ? 'no plan' : String(edge.counts.flights)), keyNumber('allLand', 'flights if every one lands', edge.counts.allLand, String(edge.counts.allLand))],
            attachment: { label: 'Printable card (HTML)', fileName: 'flight-test-card.html', text: testCardHtml(card) },
          };
        }),
    },
    causeFigure((impairment) => IMPAIRMENTS[impairment]!.path, 'impairment'),
  ],
  blocks: [
    { prose: 'The flight counts take each condition’s simulated success rate as the planning value; if the real rate is nearer the claim, the test needs more flights. The verdict depends only on the flights flown.' },
    { figure: 'card' },
    { prose: 'What made the simulated trials fail, per point: the failures to watch for in flight. Each link replays one such trial step by step.' },
    { figure: 'causes' },
  ],
};
