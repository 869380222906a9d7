// `alight sensitivity`: rank impairments by the landing success they cost over their plausible
// range, one at a time around the scenario, with 95 % intervals.
import { rateDecimals } from '../study/formatNumbers.js';
import { applyParams } from '../study/applyParams.js';
import { sensitivityFigure } from '../study/figures/sensitivityFigure.js';
import { PLAUSIBLE_RANGES, type PlausibleRange } from '../study/plausibleRanges.js';
import { rankSensitivity } from '../study/rankSensitivity.js';
import { runBatch } from '../study/runBatch.js';
import { parseVary } from '../study/sweepDesign.js';
import { MAX_TRIALS_PER_POINT } from '../study/studyLimits.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { createExecutor, loadScenarioOrFail, progressBar, workerCount } from './studyRunner.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';
import { asCliError, JSON_OPTION, SEED_OPTION, WORKERS_OPTION } from './studyCli.js';
import { checkOutputs, outputTarget, scenarioFiles, writeOutput } from './outputFiles.js';

const USAGE = 'alight sensitivity <scenario.json> [--vary PATH=GOOD:BAD ...] [--trials N] [--seed S] [--workers K] [--svg FILE] [--json]';
const PURPOSE = 'One impairment at a time, everything else as in the scenario: run N trials at the good and at the bad end\nof each plausible range and rank the impairments by the landing success lost, with Newcombe 95 % intervals.';
const OPTIONS: OptionSpec[] = [
  { name: 'vary', kind: 'list', valueName: 'PATH=GOOD:BAD', help: 'impairment and its plausible range (default: the built-in list)' },
  { name: 'trials', kind: 'value', valueName: 'N', help: 'trials at each end of each range (default 100)' },
  SEED_OPTION,
  WORKERS_OPTION,
  { name: 'svg', kind: 'value', valueName: 'FILE', help: 'figure: the ranking as bars with 95 % interval whiskers' },
  JSON_OPTION,
  HELP_OPTION,
];

function factorFrom(text: string): PlausibleRange {
  const m = /^([^=]+)=([^:]+):([^:]+)$/.exec(text);
  if (!m) {
    parseVary(text); // throws the shared, precise message for other malformed forms
    throw new CliError(`alight sensitivity: --vary "${text}": expected PATH=GOOD:BAD`);
  }
  const from = Number(m[2]), to = Number(m[3]);
  if (!Number.isFinite(from) || !Number.isFinite(to) || from === to) throw new CliError(`alight sensitivity: --vary "${text}": GOOD and BAD must be two different numbers`);
  return { path: m[1]!.trim(), from, to };
}

export const sensitivityCommand: Command = {
  name: 'sensitivity',
  purpose: 'rank impairments by the landing success they cost over their plausible range',
  async run(argv, io) {
    const parsed = parseArgs('sensitivity', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS) + `\nbuilt-in ranges (good:bad):\n${PLAUSIBLE_RANGES.map((r) => `  ${r.path}=${r.from}:${r.to}`).join('\n')}\n`);
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight sensitivity: give one scenario file (usage: ${USAGE})`);
    const scenario = loadScenarioOrFail(parsed.positional[0], 'sensitivity', io.cwd);
    const svgOut = outputTarget('--svg', parsed.values.get('svg'), io.cwd);
    if (svgOut) checkOutputs('sensitivity', [svgOut], scenarioFiles(parsed.positional[0]!, scenario, io.cwd));
    const trials = numberOption('sensitivity', parsed, 'trials', 100, (v) => Number.isInteger(v) && v >= 1 && v <= MAX_TRIALS_PER_POINT, `an integer from 1 to ${MAX_TRIALS_PER_POINT}`);
    const seed = numberOption('sensitivity', parsed, 'seed', scenario.seed, Number.isSafeInteger, 'an integer');
    const given = parsed.lists.get('vary');
    const factors = given ? given.map(factorFrom) : PLAUSIBLE_RANGES.slice();
    const executor = createExecutor(workerCount('sensitivity', parsed, io), io.env);
    const progress = progressBar(io, 'sensitivity');
    try {
      const points = factors.flatMap((f) => [{ [f.path]: f.from }, { [f.path]: f.to }]);
      for (const p of points) applyParams(scenario, p); // unknown paths and bad values fail before any trial runs
      let done = 0;
      const total = points.length * trials;
      const records = await runBatch(executor, { scenario, seed, points, trialStart: 0, trialEnd: trials }, () => progress.update(++done, total));
      progress.stop();
      const landed = (i: number): [number, number] => [records[i]!.filter((r) => r.outcome === 'landed').length, records[i]!.length];
      const rows = rankSensitivity(factors, factors.map((_, i) => ({ good: landed(2 * i), bad: landed(2 * i + 1) })));
      if (svgOut) writeOutput('sensitivity', svgOut, sensitivityFigure(rows.map((r) => ({ label: `${r.path} ${r.good.value} → ${r.bad.value}`, loss: r.loss, low: r.lossLow, high: r.lossHigh }))));
      if (parsed.flags.has('json')) io.stdout(JSON.stringify(rows, null, 1) + '\n');
      else {
        const pct = (v: number) => (100 * v).toFixed(rateDecimals(trials)); // the digits `trials` outcomes resolve
        const head = 'impairment (good -> bad)'.padEnd(48) + 'success good -> bad'.padEnd(22) + 'lost (95 % interval)';
        const body = rows.map((r) => `${`${r.path} ${r.good.value} -> ${r.bad.value}`.padEnd(48)}${`${pct(r.good.rate)} % -> ${pct(r.bad.rate)} %`.padEnd(22)}${pct(r.loss)} pts (${pct(r.lossLow)} .. ${pct(r.lossHigh)})`);
        io.stdout([head, ...body].join('\n') + `\n${trials} trials at each end; one impairment at a time around ${scenario.name}.\n${SAFETY_CAUTION}\n`);
      }
      return 0;
    } catch (error) {
      progress.stop();
      return asCliError('sensitivity', error);
    } finally {
      await executor.close();
    }
  },
};
