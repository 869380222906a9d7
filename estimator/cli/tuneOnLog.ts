// `alight tune <log-folder>...`: the flight-log branch of the tune command. Identification and
// checks live in the library (estimator/io/log/tuneLog.ts); this parses, prints and writes files.
import { IdentifyLogError } from '../io/log/identifyLogNoise.js';
import { tuneLog, type TuneLogResult } from '../io/log/tuneLog.js';
import type { NoiseIdentification } from '../study/identifyNoise.js';
import { NOISE_TERM_NAMES, type NoiseTermName } from '../study/noiseTerms.js';
import { CliError } from './CliError.js';
import type { CommandIo } from './Command.js';
import { comparisonText, identificationText } from './identificationText.js';
import type { ParsedArgs } from './parseArgs.js';
import { inputError, readFilterSettings } from './replayCommand.js';
import { resolvePath } from './studyCli.js';
import { checkOutputs, outputTarget, writeOutput } from './outputFiles.js';

/** --free a,b,c -> term names, refused with the list of known terms when one is unknown. */
export function freeTerms(parsed: ParsedArgs): NoiseTermName[] | undefined {
  const text = parsed.values.get('free');
  if (text === undefined) return undefined;
  const names = text.split(',').map((s) => s.trim()).filter((s) => s.length > 0);
  const unknown = names.filter((n) => !NOISE_TERM_NAMES.includes(n as NoiseTermName));
  if (names.length === 0 || unknown.length > 0) throw new CliError(`alight tune: --free expects noise terms from ${NOISE_TERM_NAMES.join(', ')}; got "${text}"`);
  if (new Set(names).size !== names.length) throw new CliError(`alight tune: --free names a term twice: "${text}"`);
  return names as NoiseTermName[];
}

/** Every profile point as CSV rows: term, value, rise of -2 ln L over its optimum. */
export function profilesCsv(id: NoiseIdentification): string {
  const rows = id.terms.flatMap((t) => t.profile.map((p) => [t.name, p.value, p.rise].join(',')));
  return ['term,value,rise', ...rows].join('\n') + '\n';
}

/** The JSON printed by --json; `criterion`, `recommended` (filter.qScale ... gateScale), `cost`, `baselineCost`, `evaluations` and `caution` keep their meaning from version 0.1. */
export function tuneLogJson(result: TuneLogResult) {
  const m = result.recommendedMultipliers;
  const noise = Object.fromEntries(result.identification.terms.map((t) => [`filter.${t.name}`, t.recommended]));
  return {
    criterion: result.criterion,
    recommended: { 'filter.qScale': m.qScale, 'filter.rScale': m.rScale, 'filter.gateScale': m.gateScale, ...noise },
    cost: result.cost,
    baselineCost: result.baseline.cost,
    evaluations: result.identification.evaluations,
    method: result.identification.method,
    logs: result.logs,
    identified: result.identification.terms.map((t) => ({ term: t.name, unit: t.unit, start: t.start, estimate: t.estimate, low: t.low, high: t.high, status: t.status, atBound: t.atBound, digits: t.digits, recommended: t.recommended, warning: t.warning })),
    current: result.checks.current,
    recommendedCheck: result.checks.recommended,
    warnings: result.warnings,
    caution: result.caution,
  };
}

/** @param inputs every file the tuning reads (no output may overwrite one) */
export async function tuneOnLog(folders: readonly string[], parsed: ParsedArgs, io: CommandIo, inputs: readonly string[]): Promise<number> {
  for (const scenarioOnly of ['q', 'r', 'grid', 'trials', 'logs', 'seed', 'workers']) {
    if (parsed.values.has(scenarioOnly)) throw new CliError(`alight tune: --${scenarioOnly} applies to a scenario, not to flight logs (on logs the noise terms themselves are identified; name them with --free)`);
  }
  const surfaceOut = outputTarget('--surface', parsed.values.get('surface'), io.cwd);
  if (parsed.values.has('svg')) throw new CliError('alight tune: --svg draws the landing trade-off of a scenario; on flight logs write the likelihood profiles with --surface FILE.csv');
  checkOutputs('tune', surfaceOut ? [surfaceOut] : [], inputs);
  const filterFile = parsed.values.get('filter');
  const settings = filterFile ? readFilterSettings('tune', filterFile, io.cwd) : {};
  const json = parsed.flags.has('json');
  let result: TuneLogResult;
  try {
    result = await tuneLog(folders.map((f) => resolvePath(io.cwd, f)), {
      ...settings,
      free: freeTerms(parsed),
      onEvaluation: (_, d, n) => {
        if (!json && io.interactive && n % 20 === 0) io.stderr(`  ${n} replays, -2 ln L ${d.toFixed(1)}\n`);
      },
    });
  } catch (error) {
    if (error instanceof IdentifyLogError) throw new CliError(`alight tune: ${error.message}`);
    return inputError('tune', error);
  }
  if (surfaceOut) {
    const text = surfaceOut.name.endsWith('.csv') ? profilesCsv(result.identification) : JSON.stringify(result.identification.terms.map((t) => ({ term: t.name, profile: t.profile })), null, 1) + '\n';
    writeOutput('tune', surfaceOut, text);
  }
  if (json) {
    io.stdout(JSON.stringify(tuneLogJson(result), null, 1) + '\n');
    return 0;
  }
  const what = folders.length === 1 ? `log ${folders[0]}` : `${folders.length} logs`;
  const settingsText = JSON.stringify(Object.fromEntries(result.identification.terms.map((t) => [t.name, t.recommended])));
  io.stdout(
    identificationText(result.identification, what) +
      `recommended against current (replays of the same log${folders.length > 1 ? 's' : ''}):\n` +
      comparisonText(result.checks.current, result.checks.recommended) +
      result.warnings.map((w) => `warning: ${w}\n`).join('') +
      `put in the filter settings: ${settingsText}\n${result.caution}\n`,
  );
  return 0;
}
