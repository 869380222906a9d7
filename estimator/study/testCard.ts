// A flight-test card from a study: for a claim the user states ("success >= 0.9 at 95 %
// confidence for detector.latency up to 0.15 s"), which conditions to fly, how many flights
// each needs to confirm or refute the claim (flightCounts, planned on the simulated rate), what
// refutes it, and abort criteria from the scenario's envelope. It plans; it clears nothing.
//
// Conditions, from the points of the sweep along the claim's path (other varied paths pooled):
//   nominal          the point nearest the scenario's own value inside the claimed range
//   claim edge       the point inside the claimed range nearest its limit
//   beyond the claim the point outside the range nearest the limit (the margin; optional)
import { SAFETY_CAUTION } from '../safetyCaution.js';
import { getPath } from '../io/scenarioPath.js';
import type { Scenario } from '../sim/Scenario.js';
import { blindHeight } from '../sim/supervisor.js';
import { intrinsicsFromSpec } from '../sim/world/cameraFromSpec.js';
import type { CauseCount } from './failureCauses.js';
import { flightCounts, type FlightCounts } from './flightCounts.js';
import type { SweepHeader, SweepRecord } from './resultsFile.js';
import { summarize } from './summarize.js';

export interface FlightClaim {
  /** The varied scenario path the claim ranges over, and its limit. */
  path: string;
  limit: number;
  /** 'up-to': the claim covers values <= limit (latency, noise); 'down-to': values >= limit (frame rate). */
  direction: 'up-to' | 'down-to';
  /** Claimed success rate and the confidence it is claimed at, both in (0, 1). */
  rate: number;
  confidence: number;
  /** Wanted chance that the planned flights give the expected verdict (default 0.8). */
  power?: number;
}

export type ConditionRole = 'nominal' | 'claim edge' | 'beyond the claim';

export interface CardCondition {
  roles: ConditionRole[];
  /** The claim path's value at this condition. */
  value: number;
  /** Simulated trials and landings there, with the Wilson 95 % interval of the rate. */
  trials: number;
  landed: number;
  simulatedRate: number;
  wilsonLow: number;
  wilsonHigh: number;
  counts: FlightCounts;
  /** The same plan if the real rate were the low end of the simulation's Wilson interval (few simulated trials leave it uncertain). */
  countsAtLow: FlightCounts;
  /** Why simulated trials failed there, most frequent first (what to watch for in flight). */
  causes: CauseCount[];
}

export interface TestCard {
  caution: string;
  scenario: string;
  claim: Required<FlightClaim>;
  /** The claim in words. */
  statement: string;
  planningNote: string;
  conditions: CardCondition[];
  /** How to read the series' result. */
  decisionRules: string[];
  abortCriteria: string[];
}

export class TestCardError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'TestCardError';
  }
}

const fmt = (v: number) => String(Number(v.toPrecision(4)));
const pct = (v: number) => `${fmt(100 * v)} %`;

/** Build the card from a sweep's header and records. */
export function testCard(header: SweepHeader, records: readonly SweepRecord[], claim: FlightClaim): TestCard {
  const full: Required<FlightClaim> = { power: 0.8, ...claim };
  const varied = header.vary.map((v) => v.path);
  if (!varied.includes(claim.path)) throw new TestCardError(`the claim's path ${claim.path} was not varied in this sweep (varied: ${varied.join(', ') || 'none'})`);
  const inside = (v: number) => (claim.direction === 'up-to' ? v <= claim.limit : v >= claim.limit);
  const summaries = summarize(header, records, claim.path).filter((s) => typeof s.point[claim.path] === 'number');
  if (summaries.length === 0) throw new TestCardError(`no numeric values of ${claim.path} with trials in this sweep`);
  const valueOf = (s: (typeof summaries)[number]) => s.point[claim.path] as number;
  const within = summaries.filter((s) => inside(valueOf(s)));
  if (within.length === 0) throw new TestCardError(`no sweep point lies inside the claim (${claim.path} ${claim.direction} ${claim.limit}); values swept: ${summaries.map(valueOf).join(', ')}`);
  const nearest = (list: typeof summaries, target: number) => list.reduce((a, b) => (Math.abs(valueOf(b) - target) < Math.abs(valueOf(a) - target) ? b : a));
  const nominalValue = Number(getPath(header.scenario, claim.path));
  const picks: [ConditionRole, (typeof summaries)[number]][] = [
    ['nominal', nearest(within, Number.isFinite(nominalValue) ? nominalValue : valueOf(within[0]!))],
    ['claim edge', nearest(within, claim.limit)],
  ];
  const outside = summaries.filter((s) => !inside(valueOf(s)));
  if (outside.length > 0) picks.push(['beyond the claim', nearest(outside, claim.limit)]);
  const conditions: CardCondition[] = [];
  for (const [role, s] of picks) {
    const same = conditions.find((c) => c.value === valueOf(s));
    if (same) {
      same.roles.push(role);
      continue;
    }
    conditions.push({
      roles: [role], value: valueOf(s), trials: s.trials, landed: s.landed, simulatedRate: s.successRate, wilsonLow: s.wilsonLow, wilsonHigh: s.wilsonHigh,
      counts: flightCounts(claim.rate, claim.confidence, s.successRate, { power: full.power }),
      countsAtLow: flightCounts(claim.rate, claim.confidence, s.wilsonLow, { power: full.power }),
      causes: s.causes,
    });
  }
  conditions.sort((a, b) => a.value - b.value);
  const statement = `success >= ${pct(claim.rate)} at ${pct(claim.confidence)} confidence for ${claim.path} ${claim.direction === 'up-to' ? 'up to' : 'down to'} ${fmt(claim.limit)}`;
  return {
    caution: `${SAFETY_CAUTION} This card plans a test; it clears nothing.`,
    scenario: header.scenario.name,
    claim: full,
    statement,
    planningNote: `Flight counts take each condition's simulated success rate (${records.length} simulated trials in all) as the planning value: they are what the test needs IF the real rate equals the simulated one. A real rate nearer the claim needs more flights; the verdict itself depends only on the flights flown, judged by the exact one-sided binomial bound (Clopper-Pearson).`,
    conditions,
    decisionRules: [
      `Confirmed at a condition: no more failures than the card's "confirmed with at most" count in its planned flights (the exact lower ${pct(claim.confidence)} bound on success then reaches ${pct(claim.rate)}).`,
      `Refuted at a condition: failures reach the card's "refuted at" count, whenever that happens; stop that condition's series there.`,
      'Anything between is undecided: the flights flown neither show nor exclude the claim; fly more or narrow the claim.',
      'A failure is any flight that does not land on the pad within the envelope below, including every abort and takeover.',
    ],
    abortCriteria: abortCriteria(header.scenario),
  };
}

/** Abort criteria for every flight, from the scenario's guidance and landing envelope. */
export function abortCriteria(s: Scenario): string[] {
  const g = s.guidance, e = s.envelope;
  const funnelAt = (h: number) => fmt(g.funnelBase + g.funnelSlope * h);
  const k = intrinsicsFromSpec(s.camera);
  const blind = blindHeight({ fx: k.fx, fy: k.fy, width: s.camera.width, height: s.camera.height }, s.carrier.deckLength, s.carrier.deckWidth, s.detector.edgeMargin);
  const lines = [
    `Take over if the horizontal error leaves the descent funnel: more than ${funnelAt(g.trailHeight)} m at the trailing height ${fmt(g.trailHeight)} m, ${funnelAt(1)} m at 1 m, ${funnelAt(g.flareHeight)} m at the flare height ${fmt(g.flareHeight)} m.`,
    `Take over if the target is lost for more than ${fmt(g.lostTimeout)} s above the blind height (${fmt(blind)} m, where the deck overflows the image), or the estimator reports divergence.`,
    `Take over before contact if the vertical closing speed exceeds ${fmt(e.maxClosingSpeed)} m/s, the horizontal speed relative to the deck exceeds ${fmt(e.maxLateralSpeed)} m/s, or the tilt exceeds ${fmt(e.maxTiltDeg)} deg (the landing envelope); a contact outside the ${fmt(e.padRadius)} m pad radius counts as a failure.`,
    `Fly only inside the simulated conditions: carrier speed ${fmt(s.carrier.speed)} m/s, mean wind ${fmt(s.lander.wind.speed)} m/s, turbulence ${s.lander.wind.turbulence}; outside them the study says nothing.`,
    'Safety pilot with immediate takeover, geofence and kill switch on every flight; stop the series after any takeover until its cause is understood.',
  ];
  return lines;
}
