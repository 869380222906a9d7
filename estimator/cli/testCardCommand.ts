// `alight test-card`: a flight-test card from a sweep's results for a stated claim: which
// conditions to fly, how many flights confirm or refute it, abort criteria. Plans; clears nothing.
import { existsSync, readFileSync } from 'node:fs';
import { describeProblems, parseResults } from '../study/resultsFile.js';
import { testCard } from '../study/testCard.js';
import { testCardHtml } from '../study/testCardHtml.js';
import { testCardText } from '../study/testCardText.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { checkOutputs, outputTarget, writeOutput } from './outputFiles.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { asCliError, JSON_OPTION, resolvePath } from './studyCli.js';

const USAGE = 'alight test-card <results.jsonl> --path PATH (--up-to V | --down-to V) --rate RATE [--confidence C] [--power P] [--html FILE] [--json]';
const PURPOSE = 'A flight-test card for a claim "success >= RATE at confidence C for PATH up to (or down to) V":\nthe conditions to fly (nominal, claim edge, just beyond it), the flights each needs to confirm or refute\nthe claim by the exact binomial bound (planned on the simulated rate), and abort criteria from the\nscenario\'s envelope. It plans a test; it clears nothing for flight.';
const OPTIONS: OptionSpec[] = [
  { name: 'path', kind: 'value', valueName: 'PATH', help: 'the varied scenario path the claim ranges over (required)' },
  { name: 'up-to', kind: 'value', valueName: 'V', help: 'the claim covers values of PATH up to V (e.g. latency)' },
  { name: 'down-to', kind: 'value', valueName: 'V', help: 'the claim covers values of PATH down to V (e.g. frame rate)' },
  { name: 'rate', kind: 'value', valueName: 'RATE', help: 'claimed success rate, between 0 and 1 (required)' },
  { name: 'confidence', kind: 'value', valueName: 'C', help: 'confidence of the claim, one-sided (default 0.95)' },
  { name: 'power', kind: 'value', valueName: 'P', help: 'wanted chance that the planned flights give the expected verdict (default 0.8)' },
  { name: 'html', kind: 'value', valueName: 'FILE', help: 'also write the card as one printable HTML page' },
  JSON_OPTION,
  HELP_OPTION,
];

const unit = (v: number) => v > 0 && v < 1;

export const testCardCommand: Command = {
  name: 'test-card',
  purpose: 'flight-test card for a success claim: conditions, flights needed, abort criteria',
  async run(argv, io) {
    const parsed = parseArgs('test-card', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS));
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight test-card: give one results file (usage: ${USAGE})`);
    const name = parsed.positional[0]!;
    const file = resolvePath(io.cwd, name);
    if (!existsSync(file)) throw new CliError(`alight test-card: ${name}: no such file`);
    const path = parsed.values.get('path');
    if (path === undefined) throw new CliError(`alight test-card: give --path PATH, the varied path the claim ranges over (usage: ${USAGE})`);
    const upTo = parsed.values.has('up-to'), downTo = parsed.values.has('down-to');
    if (upTo === downTo) throw new CliError(`alight test-card: give exactly one of --up-to V or --down-to V (usage: ${USAGE})`);
    const limit = numberOption('test-card', parsed, upTo ? 'up-to' : 'down-to', 0, Number.isFinite, 'a number');
    if (!parsed.values.has('rate')) throw new CliError(`alight test-card: give --rate RATE, the claimed success rate (usage: ${USAGE})`);
    const rate = numberOption('test-card', parsed, 'rate', 0.9, unit, 'a rate between 0 and 1');
    const confidence = numberOption('test-card', parsed, 'confidence', 0.95, unit, 'a confidence between 0 and 1');
    const power = numberOption('test-card', parsed, 'power', 0.8, unit, 'a probability between 0 and 1');
    const htmlOut = outputTarget('--html', parsed.values.get('html'), io.cwd);
    if (htmlOut) checkOutputs('test-card', [htmlOut], [file]);
    try {
      const results = parseResults(readFileSync(file, 'utf8'), name);
      if (results.problems.length > 0) {
        throw new CliError(`alight test-card: ${results.problems.length} line(s) are not valid trial records; refusing to plan on them:\n${describeProblems(name, results.problems)}`);
      }
      const card = testCard(results.header, results.records.map((r) => r.record), { path, limit, direction: upTo ? 'up-to' : 'down-to', rate, confidence, power });
      if (htmlOut) writeOutput('test-card', htmlOut, testCardHtml(card));
      io.stdout(parsed.flags.has('json') ? JSON.stringify(card, null, 1) + '\n' : testCardText(card));
      return 0;
    } catch (error) {
      return asCliError('test-card', error);
    }
  },
};
