// The flight-test card as terminal text: caution first, then the claim, one block per
// condition, the decision rules and the abort criteria.
import type { CardCondition, TestCard } from './testCard.js';

const fmt = (v: number) => String(Number(v.toPrecision(4)));
const pct = (v: number) => `${fmt(100 * v)} %`;

/** The plan line of a condition: flights, and the failure counts that confirm or refute. */
export function planLine(c: CardCondition): string {
  const k = c.counts;
  if (c.roles.length === 1 && c.roles[0] === 'beyond the claim') {
    return `optional, outside the claimed range: flights here show the margin and neither confirm nor refute the claim (at the simulated rate ${k.flights ?? 'over 2000'} flights would ${k.expect === 'refute' ? 'show it falls short here' : 'show it holds here too'})`;
  }
  if (k.expect === 'undecided' || k.flights === null) {
    return `no practical plan: the simulated rate is too close to the claim to separate them within 2000 flights (if every flight lands, ${k.allLand} confirm it)`;
  }
  const confirm = k.confirmMaxFailures! < 0 ? 'no failure count confirms it' : `confirmed with at most ${k.confirmMaxFailures} failure(s)`;
  const refute = k.refuteMinFailures! > k.flights ? 'no failure count refutes it' : `refuted at ${k.refuteMinFailures} failure(s)`;
  return `${k.flights} flights (expected to ${k.expect}, chance ${pct(k.chance!)} at the simulated rate): ${confirm}; ${refute}`;
}

/** The plan at the low end of the simulated interval, in a few words. */
export function lowLine(c: CardCondition): string {
  const k = c.countsAtLow;
  if (k.flights === null) return 'no practical plan (too close to the claim)';
  return `${k.flights} flights, expected to ${k.expect}`;
}

export function testCardText(card: TestCard): string {
  const lines = [`CAUTION: ${card.caution}`, '', `Flight-test card, scenario "${card.scenario}"`, `Claim: ${card.statement}`, '', card.planningNote, ''];
  for (const c of card.conditions) {
    lines.push(`${card.claim.path} = ${fmt(c.value)} (${c.roles.join(', ')})`);
    lines.push(`  simulated: ${c.landed} of ${c.trials} landed, ${pct(c.simulatedRate)} (Wilson 95 % ${pct(c.wilsonLow)} to ${pct(c.wilsonHigh)})`);
    lines.push(`  fly: ${planLine(c)}`);
    lines.push(`  if every flight lands: ${c.counts.allLand} flights confirm the claim`);
    if (c.roles.some((r) => r !== 'beyond the claim')) lines.push(`  if the real rate is the simulation's low end (${pct(c.wilsonLow)}): ${lowLine(c)}`);
    if (c.causes.length > 0) lines.push(`  watch for: ${c.causes.slice(0, 3).map((x) => `${x.cause} (${x.count} of ${c.trials} simulated)`).join(', ')}`);
  }
  lines.push('', 'Deciding:', ...card.decisionRules.map((r) => `  - ${r}`), '', 'Abort criteria (every flight):', ...card.abortCriteria.map((r) => `  - ${r}`));
  return lines.join('\n') + '\n';
}
