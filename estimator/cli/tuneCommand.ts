// `alight tune`: on flight-log folders, identify the filter's noise terms by innovation
// likelihood (tuneOnLog.ts); on a scenario, identify them from recorded trials of it, then fly
// Q and R multipliers around the identified setting and report the landing/consistency
// trade-off as its non-dominated settings. The library does the work; this parses and prints.
import { statSync } from 'node:fs';
import type { Scenario } from '../sim/Scenario.js';
import { tradeOffFigure } from '../study/figures/tradeOffFigure.js';
import { identifyScenarioNoise } from '../study/identifyScenarioNoise.js';
import { landingTradeOff, type LandingTradeOff } from '../study/landingTradeOff.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';
import { MAX_TRIALS_PER_POINT } from '../study/studyLimits.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { comparisonText, identificationText } from './identificationText.js';
import { checkOutputs, filesIn, outputTarget, scenarioFiles, writeOutput, type OutputTarget } from './outputFiles.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { createExecutor, loadScenarioOrFail, workerCount } from './studyRunner.js';
import { asCliError, JSON_OPTION, resolvePath, SEED_OPTION, WORKERS_OPTION } from './studyCli.js';
import { freeTerms, tuneOnLog } from './tuneOnLog.js';

const USAGE = 'alight tune <scenario.json | log-folder...> [--free A,B,..] [--filter FILE] [--logs K] [--trials N] [--grid G] [--q LO:HI] [--r LO:HI] [--seed S] [--workers K] [--surface FILE] [--svg FILE] [--json]';
const PURPOSE = `Identify the filter's noise terms from data, each with a 95 % interval, and compare the result with the
current setting.

What is identified, from what:
  - The terms named with --free (default pixelNoise, sizeNoiseFraction, odometryNoise, carrierAccelNoise,
    accelNoise; also pixelNoiseFraction, sizeNoise, accelBiasWalk); every other setting is held.
  - They maximise the innovation likelihood of the box and odometry updates, -2 ln L = sum (ln|2 pi S| +
    y' S^-1 y) (Mehra 1970), replaying the log(s) once per trial setting. No truth is needed; truth.csv,
    when present, only checks the result (NEES, RMSE), it never steers it.
  - A term the data do not bound (a flat likelihood, e.g. a bias walk on a short log, or a term
    another one already covers) is reported as such, or bounded on one side only, and keeps its value.
What is not identified: the multipliers qScale, rScale, gateScale (held), the gate probability, the
Singer time constant, and any error the filter does not model (a bias, a wrong target size, the oblique
view of the deck): such errors leave the likelihood's optimum over-confident; the comparison and its
warnings show it (NEES and RMSE against truth when the log has it).

On a scenario: --logs K trials are recorded as flight logs (as alight record writes them) and the terms
identified from them; then --trials N trials per setting fly Q and R multipliers on a G x G log grid
around the identified setting (the same random streams for every setting) and the trade-off between
landing success and consistency (|ln(ANEES/n)|) is reported as its non-dominated settings.`;
const OPTIONS: OptionSpec[] = [
  { name: 'free', kind: 'value', valueName: 'A,B,..', help: 'noise terms to identify (default pixelNoise,sizeNoiseFraction,odometryNoise,carrierAccelNoise,accelNoise)' },
  { name: 'filter', kind: 'value', valueName: 'FILE', help: 'log folders: the current setting over the log\'s filter.json, as for alight replay' },
  { name: 'logs', kind: 'value', valueName: 'K', help: 'scenario: trials recorded as logs to identify from (default 3)' },
  { name: 'trials', kind: 'value', valueName: 'N', help: 'scenario: landing trials per trade-off setting (default 16)' },
  { name: 'grid', kind: 'value', valueName: 'G', help: 'scenario: trade-off grid points per multiplier (default 3)' },
  { name: 'q', kind: 'value', valueName: 'LO:HI', help: 'scenario: qScale range of the trade-off (default 0.25:4)' },
  { name: 'r', kind: 'value', valueName: 'LO:HI', help: 'scenario: rScale range of the trade-off (default 0.25:4)' },
  SEED_OPTION,
  WORKERS_OPTION,
  { name: 'surface', kind: 'value', valueName: 'FILE', help: 'write the likelihood profiles (logs) or every trade-off setting (scenario); .csv for CSV, else JSON' },
  { name: 'svg', kind: 'value', valueName: 'FILE', help: 'scenario: the trade-off figure (success against |ln(ANEES/n)|)' },
  JSON_OPTION,
  HELP_OPTION,
];
/** Options of version 0.1's multiplier search, refused with a pointer to what replaced them. */
const RETIRED = ['refine', 'gate', 'nees-weight', 'criterion'];

function range(parsed: ReturnType<typeof parseArgs>, name: string, fallback: [number, number]): [number, number] {
  const text = parsed.values.get(name);
  if (text === undefined) return fallback;
  const [lo, hi] = text.split(':').map(Number);
  if (!(lo! > 0 && hi! >= lo! && Number.isFinite(hi))) throw new CliError(`alight tune: --${name} expects LO:HI with 0 < LO <= HI, got "${text}"`);
  return [lo!, hi!];
}

function isDirectory(path: string): boolean {
  try {
    return statSync(path).isDirectory();
  } catch {
    return false;
  }
}

function tradeOffText(t: LandingTradeOff, trials: number): string {
  const lines = [`landing trade-off (${t.settings.length} settings x ${trials} trials, same random streams for each):`];
  lines.push('  qScale  rScale  landed (Wilson 95 %)          ANEES [95 % interval] verdict                non-dominated');
  for (const [i, s] of t.settings.entries()) {
    const m = s.summary;
    const landed = `${m.landed}/${m.trials} (${(100 * m.wilsonLow).toFixed(0)}-${(100 * m.wilsonHigh).toFixed(0)} %)`;
    const nees = m.neesMean !== null ? `${m.neesMean.toPrecision(3)} [${m.neesLow!.toPrecision(3)}, ${m.neesHigh!.toPrecision(3)}] ${m.neesVerdict}` : 'no NEES';
    lines.push(`  ${String(s.qScale).padEnd(8)}${String(s.rScale).padEnd(8)}${landed.padEnd(30)}${nees.padEnd(45)}${s.nonDominated ? (i === t.chosen ? 'yes (named)' : 'yes') : ''}`);
  }
  lines.push(`  ${t.rule}`);
  return lines.join('\n') + '\n';
}

export const tuneCommand: Command = {
  name: 'tune',
  purpose: 'identify the filter noise terms from logs or a scenario (likelihood, intervals), and the landing trade-off',
  async run(argv, io) {
    const parsed = parseArgs('tune', argv, OPTIONS.concat(RETIRED.map((name) => ({ name, kind: 'value', valueName: 'X', help: '' }))));
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS) + `${SAFETY_CAUTION}\n`);
      return 0;
    }
    const retired = RETIRED.find((name) => parsed.values.has(name));
    if (retired) throw new CliError(`alight tune: --${retired} belonged to the multiplier search, which is gone: noise terms are identified by likelihood (--free), and on a scenario the trade-off grid takes --q, --r and --grid`);
    if (parsed.positional.length === 0) throw new CliError(`alight tune: give one scenario file or one or more flight-log folders (usage: ${USAGE})`);
    const target = parsed.positional[0]!;
    if (isDirectory(resolvePath(io.cwd, target))) {
      const notFolder = parsed.positional.find((p) => !isDirectory(resolvePath(io.cwd, p)));
      if (notFolder !== undefined) throw new CliError(`alight tune: ${notFolder} is not a log folder; give one scenario file, or log folders only`);
      const filterFile = parsed.values.get('filter');
      const inputs = [...parsed.positional.flatMap((f) => filesIn(resolvePath(io.cwd, f))), ...(filterFile ? [resolvePath(io.cwd, filterFile)] : [])];
      return tuneOnLog(parsed.positional, parsed, io, inputs);
    }
    if (parsed.positional.length > 1) throw new CliError(`alight tune: one scenario file please, got ${parsed.positional.length} arguments (usage: ${USAGE})`);
    if (parsed.values.has('filter')) throw new CliError('alight tune: --filter applies to flight-log folders; on a scenario edit its filter section');
    const surfaceOut = outputTarget('--surface', parsed.values.get('surface'), io.cwd);
    const svgOut = outputTarget('--svg', parsed.values.get('svg'), io.cwd);
    const outputs = [surfaceOut, svgOut].filter((o): o is OutputTarget => o !== undefined);
    const scenario: Scenario = loadScenarioOrFail(target, 'tune', io.cwd);
    checkOutputs('tune', outputs, scenarioFiles(target, scenario, io.cwd));
    const grid = numberOption('tune', parsed, 'grid', 3, (v) => Number.isInteger(v) && v >= 1 && v <= 9, 'an integer 1..9');
    const logs = numberOption('tune', parsed, 'logs', 3, (v) => Number.isInteger(v) && v >= 1 && v <= 50, 'an integer 1..50');
    const trials = numberOption('tune', parsed, 'trials', 16, (v) => Number.isInteger(v) && v >= 1 && v <= MAX_TRIALS_PER_POINT, `an integer from 1 to ${MAX_TRIALS_PER_POINT}`);
    const seed = numberOption('tune', parsed, 'seed', scenario.seed, Number.isSafeInteger, 'an integer');
    const q = range(parsed, 'q', [0.25, 4]), r = range(parsed, 'r', [0.25, 4]);
    const free = freeTerms(parsed);
    const json = parsed.flags.has('json');
    const executor = createExecutor(workerCount('tune', parsed, io), io.env);
    try {
      const identified = await identifyScenarioNoise(scenario, { seed, logs, free });
      if (!json && io.interactive) io.stderr(`  identified from ${logs} recorded trials; flying the trade-off grid\n`);
      const tradeOff = await landingTradeOff(executor, scenario, identified.recommended, {
        seed, trials, q, r, grid,
        onSetting: (done, total) => {
          if (!json && io.interactive) io.stderr(`  ${done}/${total} settings\n`);
        },
      });
      if (surfaceOut) {
        const rows = tradeOff.settings.map((s) => ({ qScale: s.qScale, rScale: s.rScale, trials: s.summary.trials, landed: s.summary.landed, successRate: s.summary.successRate, wilsonLow: s.summary.wilsonLow, wilsonHigh: s.summary.wilsonHigh, neesMean: s.summary.neesMean, neesLow: s.summary.neesLow, neesHigh: s.summary.neesHigh, neesVerdict: s.summary.neesVerdict, neesDistance: s.neesDistance, nonDominated: s.nonDominated }));
        const text = surfaceOut.name.endsWith('.csv')
          ? [Object.keys(rows[0]!).join(','), ...rows.map((row) => Object.values(row).map((v) => v ?? '').join(','))].join('\n') + '\n'
          : JSON.stringify(rows, null, 1) + '\n';
        writeOutput('tune', surfaceOut, text);
      }
      if (svgOut) writeOutput('tune', svgOut, tradeOffFigure(tradeOff));
      const named = tradeOff.chosen !== null ? tradeOff.settings[tradeOff.chosen]! : null;
      const noise = Object.fromEntries(identified.identification.terms.map((t) => [`filter.${t.name}`, t.recommended]));
      const spec = identified.recommended;
      if (json) {
        const m = named?.summary;
        io.stdout(JSON.stringify({
          recommended: { 'filter.qScale': named?.qScale ?? spec.qScale, 'filter.rScale': named?.rScale ?? spec.rScale, 'filter.gateScale': spec.gateScale, ...noise },
          // Version 0.1's scalar cost, (1 - success) + 0.25 |ln(ANEES/n)|, of the named setting: kept for scripts; the trade-off below replaces it.
          cost: m && named!.neesDistance !== null ? 1 - m.successRate + 0.25 * named!.neesDistance : null,
          successRate: m?.successRate ?? null, wilsonLow: m?.wilsonLow ?? null, wilsonHigh: m?.wilsonHigh ?? null,
          neesMean: m?.neesMean ?? null, neesDim: m?.neesDim ?? null, neesVerdict: m?.neesVerdict ?? null,
          evaluations: tradeOff.settings.length, trialsPerSetting: trials,
          identified: identified.identification.terms.map((t) => ({ term: t.name, unit: t.unit, start: t.start, estimate: t.estimate, low: t.low, high: t.high, status: t.status, atBound: t.atBound, digits: t.digits, recommended: t.recommended, warning: t.warning })),
          identifiedFrom: { logs, evaluations: identified.identification.evaluations, method: identified.identification.method },
          current: identified.checks.current,
          recommendedCheck: identified.checks.recommended,
          tradeOff: { rule: tradeOff.rule, front: tradeOff.front, chosen: tradeOff.chosen, settings: tradeOff.settings.map((s) => ({ qScale: s.qScale, rScale: s.rScale, summary: s.summary, neesDistance: s.neesDistance, nonDominated: s.nonDominated })) },
          warnings: identified.warnings,
          caution: SAFETY_CAUTION,
        }, null, 1) + '\n');
        return 0;
      }
      io.stdout(
        identificationText(identified.identification, `${logs} recorded trial${logs > 1 ? 's' : ''} of ${target}`) +
          'identified against the scenario\'s setting (replays of the recorded trials, truth as a check):\n' +
          comparisonText(identified.checks.current, identified.checks.recommended) +
          identified.warnings.map((w) => `warning: ${w}\n`).join('') +
          tradeOffText(tradeOff, trials) +
          (named ? `named setting: the identified noise with qScale ${named.qScale}, rScale ${named.rScale}\n` : 'no setting had a NEES to judge\n') +
          `put in the scenario's filter section: ${JSON.stringify({ ...Object.fromEntries(identified.identification.terms.map((t) => [t.name, t.recommended])), ...(named ? { qScale: named.qScale, rScale: named.rScale } : {}) })}\n${SAFETY_CAUTION}\n`,
      );
      return 0;
    } catch (error) {
      return asCliError('tune', error);
    } finally {
      await executor.close();
    }
  },
};
