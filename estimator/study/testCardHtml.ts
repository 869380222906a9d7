// The flight-test card as one self-contained HTML page, laid out to print on A4 or Letter:
// the flight-safety caution at its top, then the claim, the conditions table, the decision
// rules and the abort criteria, with a line to sign per condition.
import type { TestCard } from './testCard.js';
import { lowLine, planLine } from './testCardText.js';

const escape = (s: string) => s.replaceAll('&', '&amp;').replaceAll('<', '&lt;').replaceAll('>', '&gt;').replaceAll('"', '&quot;');
const fmt = (v: number) => String(Number(v.toPrecision(4)));
const pct = (v: number) => `${fmt(100 * v)} %`;

const STYLE = `
body { font: 11pt/1.4 system-ui, sans-serif; color: #1d232a; margin: 2em auto; max-width: 52em; padding: 0 1em; }
.caution { border: 3px solid #8a1c00; background: #fff3ec; padding: 0.6em 0.9em; font-weight: 600; }
h1 { font-size: 1.4em; margin: 0.8em 0 0.2em; } h2 { font-size: 1.1em; margin: 1.2em 0 0.3em; }
table { border-collapse: collapse; width: 100%; } th, td { border: 1px solid #9aa4ad; padding: 0.3em 0.45em; text-align: left; vertical-align: top; }
th { background: #e9edf0; } td.flown { width: 7em; }
.visually-hidden { position: absolute; left: -9999px; }
@media print { body { margin: 0; max-width: none; } .caution { break-inside: avoid; } tr { break-inside: avoid; } }
`;

/** Only the card's body (caution first): the page view embeds it; testCardHtml wraps it in a page. */
export function testCardFragment(card: TestCard): string {
  const rows = card.conditions.map((c) => `<tr><td>${fmt(c.value)}</td><td>${escape(c.roles.join(', '))}</td><td>${c.landed} of ${c.trials}: ${pct(c.simulatedRate)}<br>(Wilson 95 % ${pct(c.wilsonLow)} to ${pct(c.wilsonHigh)})</td><td>${escape(planLine(c))}${c.roles.some((r) => r !== 'beyond the claim') ? `<br>If the real rate is the simulation's low end (${pct(c.wilsonLow)}): ${escape(lowLine(c))}.` : ''}</td><td>${c.counts.allLand}</td><td>${escape(c.causes.slice(0, 3).map((x) => `${x.cause} ${x.count}`).join(', ') || 'none simulated')}</td><td class="flown"></td></tr>`);
  return [
    `<p class="caution" role="alert">${escape(card.caution)}</p>`,
    `<h1>Flight-test card: ${escape(card.scenario)}</h1>`,
    `<p><strong>Claim:</strong> ${escape(card.statement)}</p>`,
    `<p>${escape(card.planningNote)}</p>`,
    '<h2>Conditions to fly</h2>',
    `<table><caption class="visually-hidden">Conditions, simulated outcome and the flights each needs</caption><thead><tr><th scope="col">${escape(card.claim.path)}</th><th scope="col">why</th><th scope="col">simulated</th><th scope="col">plan</th><th scope="col">flights if all land</th><th scope="col">simulated failure causes</th><th scope="col">flown / failed / signed</th></tr></thead><tbody>${rows.join('')}</tbody></table>`,
    '<h2>Deciding</h2>',
    `<ul>${card.decisionRules.map((r) => `<li>${escape(r)}</li>`).join('')}</ul>`,
    '<h2>Abort criteria (every flight)</h2>',
    `<ul>${card.abortCriteria.map((r) => `<li>${escape(r)}</li>`).join('')}</ul>`,
  ].join('\n');
}

export function testCardHtml(card: TestCard): string {
  return `<!doctype html>\n<html lang="en"><head><meta charset="utf-8"><title>Flight-test card: ${escape(card.scenario)}</title><style>${STYLE}</style></head><body>\n${testCardFragment(card)}\n</body></html>\n`;
}
