// `alight require`: the largest impairment at which landing success, by its lower Wilson bound,
// still meets a target (bisection with adaptive trial counts).
import { getPath } from '../io/scenarioPath.js';
import { applyParams } from '../study/applyParams.js';
import { successFigure } from '../study/figures/successFigure.js';
import { findRequirement } from '../study/findRequirement.js';
import { plausibleRange } from '../study/plausibleRanges.js';
import { runBatch } from '../study/runBatch.js';
import { MAX_TRIALS_PER_POINT } from '../study/studyLimits.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { createExecutor, loadScenarioOrFail, workerCount } from './studyRunner.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';
import { scenarioUnit } from '../io/scenarioUnit.js';
import { decimalsFor, decimalsIn, percent, quantity } from '../study/formatNumbers.js';
import { asCliError, JSON_OPTION, SEED_OPTION, WORKERS_OPTION } from './studyCli.js';
import { checkOutputs, outputTarget, scenarioFiles, writeOutput } from './outputFiles.js';

const USAGE = 'alight require <scenario.json> --param PATH --target RATE [--from V] [--to V] [--trials MAX] [--first-batch N] [--steps N] [--seed S] [--workers K] [--svg FILE] [--json]';
const PURPOSE = 'Find the largest impairment at which the lower Wilson 95 % bound of landing success stays at or above\nthe target: bisection between --from (good) and --to (bad), each probe adding trials in doubling batches\nuntil the verdict is clear. Assumes success falls steadily from --from to --to.';
const OPTIONS: OptionSpec[] = [
  { name: 'param', kind: 'value', valueName: 'PATH', help: 'dotted scenario path of the impairment, e.g. detector.latency (required)' },
  { name: 'target', kind: 'value', valueName: 'RATE', help: 'required success rate, e.g. 0.95 (required)' },
  { name: 'from', kind: 'value', valueName: 'V', help: 'good end of the range (default: the plausible good end, else the scenario value)' },
  { name: 'to', kind: 'value', valueName: 'V', help: 'bad end of the range (default: the plausible bad end of known impairments)' },
  { name: 'trials', kind: 'value', valueName: 'MAX', help: 'most trials at one probe (default 400)' },
  { name: 'first-batch', kind: 'value', valueName: 'N', help: 'trials in the first batch of each probe (default 25)' },
  { name: 'steps', kind: 'value', valueName: 'N', help: 'bisection steps (default 6: resolution = range / 64)' },
  SEED_OPTION,
  WORKERS_OPTION,
  { name: 'svg', kind: 'value', valueName: 'FILE', help: 'figure: success at every probe with Wilson band and the target' },
  JSON_OPTION,
  HELP_OPTION,
];

export const requireCommand: Command = {
  name: 'require',
  purpose: 'largest impairment that still meets a landing-success target (lower Wilson bound)',
  async run(argv, io) {
    const parsed = parseArgs('require', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS));
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight require: give one scenario file (usage: ${USAGE})`);
    const scenario = loadScenarioOrFail(parsed.positional[0], 'require', io.cwd);
    const svgOut = outputTarget('--svg', parsed.values.get('svg'), io.cwd);
    if (svgOut) checkOutputs('require', [svgOut], scenarioFiles(parsed.positional[0]!, scenario, io.cwd));
    const path = parsed.values.get('param');
    if (!path) throw new CliError('alight require: --param PATH is required');
    if (!parsed.values.has('target')) throw new CliError('alight require: --target RATE is required');
    const target = numberOption('require', parsed, 'target', 0.95, (v) => v > 0 && v < 1, 'a rate between 0 and 1');
    let current: unknown;
    try {
      current = getPath(scenario, path);
    } catch (error) {
      return asCliError('require', error);
    }
    if (typeof current !== 'number') throw new CliError(`alight require: --param ${path} is not a number in the scenario`);
    const known = plausibleRange(path);
    const from = numberOption('require', parsed, 'from', known?.from ?? current);
    if (!parsed.values.has('to') && !known) throw new CliError(`alight require: give --to V for ${path} (no plausible range is built in)`);
    const to = numberOption('require', parsed, 'to', known?.to ?? 0);
    const maxTrials = numberOption('require', parsed, 'trials', 400, (v) => Number.isInteger(v) && v >= 1 && v <= MAX_TRIALS_PER_POINT, `an integer from 1 to ${MAX_TRIALS_PER_POINT}`);
    const firstBatch = numberOption('require', parsed, 'first-batch', 25, (v) => Number.isInteger(v) && v >= 1, 'a positive integer');
    const steps = numberOption('require', parsed, 'steps', 6, (v) => Number.isInteger(v) && v >= 0 && v <= 30, 'an integer 0..30');
    const seed = numberOption('require', parsed, 'seed', scenario.seed, Number.isSafeInteger, 'an integer');
    try {
      for (const value of [from, to]) applyParams(scenario, { [path]: value }); // both ends valid before any trial
    } catch (error) {
      return asCliError('require', error);
    }
    const executor = createExecutor(workerCount('require', parsed, io), io.env);
    const json = parsed.flags.has('json');
    try {
      const result = await findRequirement({
        from, to, target, maxTrials, firstBatch, steps,
        landedCount: async (value, probe, trialStart, trialEnd) => {
          // Probe k uses key point k: every probe draws fresh, reproducible streams.
          const [records] = await runBatch(executor, { scenario, seed, points: [{ [path]: value }], pointOffset: probe, trialStart, trialEnd });
          return records!.filter((r) => r.outcome === 'landed').length;
        },
        onProbe: (p) => {
          // progress on a terminal only; the full list of probes is in the result below
          if (!json && io.interactive) io.stderr(`  probe ${p.value}: ${p.landed}/${p.trials} landed -> ${p.verdict}\n`);
        },
      });
      if (svgOut) {
        writeOutput('require', svgOut, successFigure(result.probes.map((p) => ({ x: p.value, rate: p.landed / p.trials, low: p.wilsonLow, high: p.wilsonHigh, trials: p.trials })), { xLabel: path, target, title: `Requirement on ${path}: success >= ${target}` }));
      }
      if (json) io.stdout(JSON.stringify({ param: path, target, from, to, ...result }, null, 1) + '\n');
      else {
        // Values to the bisection's resolution, with the field's unit from the schema.
        const unit = scenarioUnit(path);
        const digits = Math.max(decimalsFor(Math.abs(to - from) / 2 ** steps), decimalsIn(from), decimalsIn(to));
        const v = (x: number) => quantity(x, digits, unit);
        const worse = to > from ? '<=' : '>=';
        const answer = result.value === null
          ? `${path}: even ${v(from)} does not meet the target (success >= ${percent(target)} by the lower Wilson 95 % bound).`
          : result.failsAt === null
            ? `${path}: the whole range ${v(from)} to ${v(to)} meets the target (success >= ${percent(target)} by the lower Wilson 95 % bound).`
            : `${path} ${worse} ${v(result.value)} keeps the lower Wilson 95 % bound of success >= ${percent(target)} (not met at ${v(result.failsAt)}; resolution ${v(Math.abs(to - from) / 2 ** steps)}).`;
        const probes = result.probes.map((p, i) => `  ${String(i + 1).padStart(2)}. ${v(p.value).padStart(12)}  ${`${p.landed}/${p.trials}`.padStart(9)} landed (${percent(p.landed / p.trials)}), Wilson 95 % ${percent(p.wilsonLow)} to ${percent(p.wilsonHigh)}: ${p.verdict}`);
        const trialsRun = result.probes.reduce((n, p) => n + p.trials, 0);
        io.stdout(`${answer}\n${result.probes.length} probes, ${trialsRun} trials (inconclusive = the interval straddles the target; counted as not met):\n${probes.join('\n')}\n${SAFETY_CAUTION}\n`);
      }
      return 0;
    } catch (error) {
      return asCliError('require', error);
    } finally {
      await executor.close();
    }
  },
};
