// `alight trials`: how many trials before "k of n landed" supports a success claim.
import { ruleOfThree } from '../study/statistics/ruleOfThree.js';
import { trialsNeeded } from '../study/statistics/trialsNeeded.js';
import { wilson } from '../study/statistics/wilson.js';
import { decimalsIn, ratePercent } from '../study/formatNumbers.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { JSON_OPTION } from './studyCli.js';

const USAGE = 'alight trials --target RATE [--rate RATE] [--power P] [--observed K/N] [--json]';
const PURPOSE = 'Trials needed before a success claim means something, judged by the lower Wilson 95 % bound;\nwith --observed, what a record like "5 of 5 landed" does and does not show.';
const OPTIONS: OptionSpec[] = [
  { name: 'target', kind: 'value', valueName: 'RATE', help: 'success rate to demonstrate, e.g. 0.9 (required unless --observed)' },
  { name: 'rate', kind: 'value', valueName: 'RATE', help: 'success rate you believe the system has (default 0.98)' },
  { name: 'power', kind: 'value', valueName: 'P', help: 'wanted chance of demonstrating the target at that rate (default 0.8)' },
  { name: 'observed', kind: 'value', valueName: 'K/N', help: 'interpret K successes in N trials' },
  JSON_OPTION,
  HELP_OPTION,
];

const unit = (v: number) => v > 0 && v < 1;
// A rate the user typed, as a percentage with the digits they gave (0.95 -> "95 %", 0.985 -> "98.5 %").
const givenPercent = (v: number) => `${(100 * v).toFixed(Math.max(0, decimalsIn(v) - 2))} %`;

export const trialsCommand: Command = {
  name: 'trials',
  purpose: 'how many trials before "k of n landed" means anything',
  async run(argv, io) {
    const parsed = parseArgs('trials', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS));
      return 0;
    }
    const observedText = parsed.values.get('observed');
    if (!parsed.values.has('target') && observedText === undefined) throw new CliError(`alight trials: give --target RATE or --observed K/N (usage: ${USAGE})`);
    const out: Record<string, unknown> = {};
    const lines: string[] = [];
    if (observedText !== undefined) {
      const m = /^(\d+)\/(\d+)$/.exec(observedText.trim());
      if (!m || Number(m[1]) > Number(m[2]) || Number(m[2]) === 0) throw new CliError(`alight trials: --observed expects K/N with 0 <= K <= N, N > 0, got "${observedText}"`);
      const k = Number(m[1]), n = Number(m[2]);
      const w = wilson(k, n);
      const observed: Record<string, unknown> = { successes: k, trials: n, rate: k / n, wilsonLow: w.low, wilsonHigh: w.high, ruleOfThreeFailureBound: k === n ? ruleOfThree(n) : null };
      out.observed = observed;
      // percentages to the digits n trials resolve (one trial moves the rate by 100/n %)
      lines.push(`${k} of ${n}: observed success ${ratePercent(k / n, n)}, Wilson 95 % interval ${ratePercent(w.low, n)} to ${ratePercent(w.high, n)}.`);
      if (k === n) lines.push(`No failure in ${n}: by the rule of three the failure rate may still be up to about ${ratePercent(ruleOfThree(n), n)}.`);
    }
    if (parsed.values.has('target')) {
      const target = numberOption('trials', parsed, 'target', 0.9, unit, 'a rate between 0 and 1');
      const rate = numberOption('trials', parsed, 'rate', 0.98, (v) => v > 0 && v <= 1, 'a rate in (0, 1]');
      const power = numberOption('trials', parsed, 'power', 0.8, unit, 'a probability between 0 and 1');
      const r = trialsNeeded(rate, target, { power });
      out.needed = { target, rate, power, ...r };
      // labels padded to one width so the counts line up in a terminal
      const rows: [string, string][] = [
        ['every trial lands:', `${r.allSucceed} trials (rule-of-three estimate: ${r.ruleOfThree})`],
        [`at a true rate of ${givenPercent(rate)}:`, r.atExpectedCount === null ? 'never (the rate must exceed the target)' : `${r.atExpectedCount} trials if successes come in at the expected count`],
        [`with ${Math.round(power * 100)} % chance of showing it:`, r.withPower === null ? 'more than 20000 trials, or never' : `${r.withPower} trials`],
      ];
      const width = Math.max(...rows.map(([label]) => label.length));
      lines.push(`To show success >= ${givenPercent(target)} (lower Wilson 95 % bound):`, ...rows.map(([label, value]) => `  ${label.padEnd(width)} ${value}`));
    }
    io.stdout(parsed.flags.has('json') ? JSON.stringify(out, null, 1) + '\n' : lines.join('\n') + '\n');
    return 0;
  },
};
