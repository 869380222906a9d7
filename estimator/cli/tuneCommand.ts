// `alight tune`: search the filter's Q, R and gate multipliers (log scale, grid then Nelder–Mead)
// on simulated trials; a directory argument tunes on flight logs instead (REPLAY's tuneLog).
import { statSync } from 'node:fs';
import type { Scenario } from '../sim/Scenario.js';
import { runBatch } from '../study/runBatch.js';
import { searchMultipliers, type Multipliers, type SurfaceSample } from '../study/search.js';
import { summarizeGroup, type PointSummary } from '../study/summarize.js';
import { tuningCost } from '../study/tuningCost.js';
import { MAX_TRIALS_PER_POINT } from '../study/studyLimits.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { createExecutor, loadScenarioOrFail, workerCount } from './studyRunner.js';
import { tuneOnLog } from './tuneOnLog.js';
import { heatMapFigure } from '../study/figures/heatMapFigure.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';
import { asCliError, JSON_OPTION, resolvePath, SEED_OPTION, WORKERS_OPTION } from './studyCli.js';
import { checkOutputs, filesIn, outputTarget, scenarioFiles, writeOutput, type OutputTarget } from './outputFiles.js';

const USAGE = 'alight tune <scenario.json | log-folder> [--trials N] [--grid G] [--refine E] [--q LO:HI] [--r LO:HI] [--gate LO:HI] [--nees-weight W] [--criterion nis|nees] [--filter FILE] [--free A,B,..] [--seed S] [--workers K] [--surface FILE] [--svg FILE] [--json]';
const LOG_NOTE = '\nWith a flight-log folder every setting replays the whole log and the cost is consistency alone:\nNIS near its dimension, white innovations and few gated updates (or NEES when the log has truth.csv).\n';
const PURPOSE = 'Search the filter multipliers filter.qScale, filter.rScale and filter.gateScale on a log-spaced grid, then\nrefine with Nelder–Mead. Cost = (1 - landing success) + w·|ln(ANEES / n)|, lower is better; every setting\nruns the same trials (same random streams), so differences come from the settings, not from luck.';
const OPTIONS: OptionSpec[] = [
  { name: 'trials', kind: 'value', valueName: 'N', help: 'trials per setting (default 16)' },
  { name: 'grid', kind: 'value', valueName: 'G', help: 'grid points per multiplier (default 4)' },
  { name: 'refine', kind: 'value', valueName: 'E', help: 'Nelder–Mead evaluations after the grid (default 20; 0 = grid only)' },
  { name: 'q', kind: 'value', valueName: 'LO:HI', help: 'qScale range (default 0.1:10)' },
  { name: 'r', kind: 'value', valueName: 'LO:HI', help: 'rScale range (default 0.1:10)' },
  { name: 'gate', kind: 'value', valueName: 'LO:HI', help: 'gateScale range (default 0.5:4; LO = HI fixes it)' },
  { name: 'nees-weight', kind: 'value', valueName: 'W', help: 'weight of NEES consistency against landing success (default 0.25)' },
  { name: 'criterion', kind: 'value', valueName: 'nis|nees', help: 'log folder only: NIS + whiteness, or NEES against truth.csv (default: nees with truth)' },
  { name: 'filter', kind: 'value', valueName: 'FILE', help: 'log folder only: filter settings over the log\'s filter.json, as for alight replay' },
  { name: 'free', kind: 'value', valueName: 'A,B,..', help: 'log folder only: noise terms to identify (default pixelNoise,sizeNoiseFraction,odometryNoise,carrierAccelNoise)' },
  SEED_OPTION,
  WORKERS_OPTION,
  { name: 'surface', kind: 'value', valueName: 'FILE', help: 'write every evaluated setting (.csv for CSV, else JSON)' },
  { name: 'svg', kind: 'value', valueName: 'FILE', help: 'heat map of the cost over qScale and rScale at the best grid gate' },
  JSON_OPTION,
  HELP_OPTION,
];

function range(parsed: ReturnType<typeof parseArgs>, name: string): [number, number] | undefined {
  const text = parsed.values.get(name);
  if (text === undefined) return undefined;
  const [lo, hi] = text.split(':').map(Number);
  if (!(lo! > 0 && hi! >= lo! && Number.isFinite(hi))) throw new CliError(`alight tune: --${name} expects LO:HI with 0 < LO <= HI, got "${text}"`);
  return [lo!, hi!];
}

/** Heat map of the grid samples over qScale and rScale at the grid gate nearest the best. */
function surfaceHeatMap(samples: readonly SurfaceSample[], best: SurfaceSample, title: string): string {
  const grid = samples.filter((s) => s.stage === 'grid');
  const gates = [...new Set(grid.map((s) => s.gate))];
  const gate = gates.reduce((a, b) => (Math.abs(Math.log(b / best.gate)) < Math.abs(Math.log(a / best.gate)) ? b : a));
  const cells = grid.filter((s) => s.gate === gate).map((s) => ({ x: s.q, y: s.r, value: s.score }));
  return heatMapFigure(cells, { xLabel: 'filter.qScale', yLabel: 'filter.rScale', valueLabel: 'cost (lower = better)', lowerIsBetter: true, best: { x: best.q, y: best.r }, title: `${title} at gateScale ${gate}` });
}

function isDirectory(path: string): boolean {
  try {
    return statSync(path).isDirectory();
  } catch {
    return false;
  }
}

interface Row extends SurfaceSample {
  successRate: number;
  neesMean: number | null;
}

export const tuneCommand: Command = {
  name: 'tune',
  purpose: 'search Q, R and gate multipliers for consistency (NEES) and landing success',
  async run(argv, io) {
    const parsed = parseArgs('tune', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS) + LOG_NOTE);
      return 0;
    }
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
    const grid = numberOption('tune', parsed, 'grid', 4, (v) => Number.isInteger(v) && v >= 1 && v <= 20, 'an integer 1..20');
    const refine = numberOption('tune', parsed, 'refine', 20, (v) => Number.isInteger(v) && v >= 0, 'a non-negative integer');
    const surfaceOut = outputTarget('--surface', parsed.values.get('surface'), io.cwd);
    const svgOut = outputTarget('--svg', parsed.values.get('svg'), io.cwd);
    const outputs = [surfaceOut, svgOut].filter((o): o is OutputTarget => o !== undefined);
    for (const logOnly of ['criterion', 'filter', 'free']) {
      if (parsed.values.has(logOnly)) throw new CliError(`alight tune: --${logOnly} applies to a flight-log folder, not to a scenario`);
    }
    const scenario: Scenario = loadScenarioOrFail(target, 'tune', io.cwd);
    checkOutputs('tune', outputs, scenarioFiles(target, scenario, io.cwd));
    const trials = numberOption('tune', parsed, 'trials', 16, (v) => Number.isInteger(v) && v >= 1 && v <= MAX_TRIALS_PER_POINT, `an integer from 1 to ${MAX_TRIALS_PER_POINT}`);
    const weight = numberOption('tune', parsed, 'nees-weight', 0.25, (v) => v >= 0, 'a non-negative number');
    const seed = numberOption('tune', parsed, 'seed', scenario.seed, Number.isSafeInteger, 'an integer');
    const json = parsed.flags.has('json');
    const executor = createExecutor(workerCount('tune', parsed, io), io.env);
    const details = new Map<string, PointSummary>();
    try {
      const result = await searchMultipliers(async (m: Multipliers) => {
        const params = { 'filter.qScale': m.q, 'filter.rScale': m.r, 'filter.gateScale': m.gate };
        // Key point 0 for every setting: common random numbers across the surface.
        const [records] = await runBatch(executor, { scenario, seed, points: [params], trialStart: 0, trialEnd: trials });
        const summary = summarizeGroup(params, records!);
        details.set(`${m.q},${m.r},${m.gate}`, summary);
        return tuningCost(summary, weight);
      }, {
        q: range(parsed, 'q'), r: range(parsed, 'r'), gate: range(parsed, 'gate'), grid, refine,
        onSample: (s, n) => {
          if (!json && io.interactive) io.stderr(`  ${n}: q ${s.q} r ${s.r} gate ${s.gate} -> cost ${s.score.toFixed(4)}\n`);
        },
      });
      const rows: Row[] = result.surface.map((s) => {
        const d = details.get(`${s.q},${s.r},${s.gate}`)!;
        return { ...s, successRate: d.successRate, neesMean: d.neesMean };
      });
      const best = details.get(`${result.best.q},${result.best.r},${result.best.gate}`)!;
      if (surfaceOut) {
        const text = surfaceOut.name.endsWith('.csv')
          ? ['qScale,rScale,gateScale,cost,stage,successRate,neesMean', ...rows.map((r) => [r.q, r.r, r.gate, r.score, r.stage, r.successRate, r.neesMean ?? ''].join(','))].join('\n') + '\n'
          : JSON.stringify(rows, null, 1) + '\n';
        writeOutput('tune', surfaceOut, text);
      }
      if (svgOut) writeOutput('tune', svgOut, surfaceHeatMap(rows, result.best, 'Tuning cost'));
      const recommended = { 'filter.qScale': result.best.q, 'filter.rScale': result.best.r, 'filter.gateScale': result.best.gate };
      if (json) io.stdout(JSON.stringify({ recommended, cost: result.best.score, successRate: best.successRate, wilsonLow: best.wilsonLow, wilsonHigh: best.wilsonHigh, neesMean: best.neesMean, neesDim: best.neesDim, neesVerdict: best.neesVerdict, evaluations: rows.length, trialsPerSetting: trials }, null, 1) + '\n');
      else {
        io.stdout(
          `recommended: qScale ${result.best.q}  rScale ${result.best.r}  gateScale ${result.best.gate}\n` +
          `  landing success ${(100 * best.successRate).toFixed(1)} % (Wilson 95 % ${(100 * best.wilsonLow).toFixed(1)}-${(100 * best.wilsonHigh).toFixed(1)} %), ` +
          `ANEES ${best.neesMean?.toFixed(2) ?? '-'} for n = ${best.neesDim ?? '-'} (${best.neesVerdict ?? 'no NEES'}), cost ${result.best.score.toFixed(4)}\n` +
          `  ${rows.length} settings x ${trials} trials; put these in the scenario's filter section.\n${SAFETY_CAUTION}\n`,
        );
      }
      return 0;
    } catch (error) {
      return asCliError('tune', error);
    } finally {
      await executor.close();
    }
  },
};
