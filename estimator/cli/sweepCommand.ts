// `alight sweep`: run a Monte Carlo sweep over scenario paths into a JSON Lines results file.
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { applyParams } from '../study/applyParams.js';
import { runSweep } from '../study/runSweep.node.js';
import { resolveShard } from '../study/shard.js';
import { DESIGN_KINDS, parseVary, type DesignKind } from '../study/sweepDesign.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { createExecutor, loadScenarioOrFail, progressBar, workerCount } from './studyRunner.js';
import { asCliError, resolvePath, WORKERS_OPTION } from './studyCli.js';
import { checkOutputs, scenarioFiles } from './outputFiles.js';

const USAGE = 'alight sweep <scenario.json> --vary PATH=FROM:TO:COUNT [--vary ...] --trials N --out results.jsonl [--design grid|random|lhs] [--points M] [--workers K] [--seed S] [--resume] [--shard I/N | --shard-count N]';
const PURPOSE = 'Monte Carlo sweep: run N trials at each point of a grid, random or Latin-hypercube design over scenario paths.';
const OPTIONS: OptionSpec[] = [
  { name: 'vary', kind: 'list', valueName: 'PATH=FROM:TO:COUNT', help: 'vary a dotted scenario path over COUNT even steps, or PATH=A,B,C' },
  { name: 'design', kind: 'value', valueName: 'grid|random|lhs', help: 'grid (all combinations, default), random or lhs (Latin hypercube)' },
  { name: 'points', kind: 'value', valueName: 'M', help: 'points of a random/lhs design (default: the largest COUNT)' },
  { name: 'trials', kind: 'value', valueName: 'N', help: 'trials per sweep point (required)' },
  WORKERS_OPTION,
  { name: 'seed', kind: 'value', valueName: 'S', help: 'master seed (default: the scenario\'s seed); trial streams derive from (seed, point, trial)' },
  { name: 'out', kind: 'value', valueName: 'FILE', help: 'results file, JSON Lines (required); {shard} is replaced by the shard number' },
  { name: 'resume', kind: 'flag', help: 'continue an interrupted results file: trials already written are kept' },
  { name: 'shard', kind: 'value', valueName: 'I/N', help: 'run only shard I of N (also from SLURM_ARRAY_TASK_ID or JOB_COMPLETION_INDEX)' },
  { name: 'shard-count', kind: 'value', valueName: 'N', help: 'shard count when the index comes from the batch scheduler' },
  HELP_OPTION,
];

const HELP_NOTES = `
Shards: with --shard I/N (1 <= I <= N) this process runs the trials whose index point*trials+trial
is I-1 modulo N. Without --shard: SLURM_ARRAY_TASK_ID gives I = ID - SLURM_ARRAY_TASK_MIN + 1 and
N = --shard-count or SLURM_ARRAY_TASK_COUNT; JOB_COMPLETION_INDEX (Kubernetes indexed job) gives
I = index + 1 with N = --shard-count. Join the shard files with alight merge.
`;

export const sweepCommand: Command = {
  name: 'sweep',
  purpose: 'run a Monte Carlo sweep over scenario values into a JSON Lines results file',
  async run(argv, io) {
    const parsed = parseArgs('sweep', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS) + HELP_NOTES);
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight sweep: give exactly one scenario file (usage: ${USAGE})`);
    const scenario = loadScenarioOrFail(parsed.positional[0], 'sweep', io.cwd);
    const trialsText = parsed.values.get('trials');
    if (trialsText === undefined) throw new CliError('alight sweep: --trials N is required');
    const trials = numberOption('sweep', parsed, 'trials', 0, (v) => Number.isInteger(v) && v >= 1, 'a positive integer');
    const outText = parsed.values.get('out');
    if (!outText) throw new CliError('alight sweep: --out FILE is required');
    const design = (parsed.values.get('design') ?? 'grid') as DesignKind;
    if (!DESIGN_KINDS.includes(design)) throw new CliError(`alight sweep: --design expects grid, random or lhs, got "${design}"`);
    const seed = numberOption('sweep', parsed, 'seed', scenario.seed, Number.isSafeInteger, 'an integer');
    const points = parsed.values.has('points') ? numberOption('sweep', parsed, 'points', 1, (v) => Number.isInteger(v) && v >= 1, 'a positive integer') : undefined;
    if (points !== undefined && design === 'grid') throw new CliError('alight sweep: --points applies to --design random or lhs (a grid has one point per combination)');
    const shardCount = parsed.values.has('shard-count') ? numberOption('sweep', parsed, 'shard-count', 1, (v) => Number.isInteger(v) && v >= 1, 'a positive integer') : undefined;
    const workers = workerCount('sweep', parsed, io);
    let executor;
    const progress = progressBar(io, 'sweep');
    try {
      const vary = (parsed.lists.get('vary') ?? []).map(parseVary);
      const shard = resolveShard(parsed.values.get('shard'), shardCount, io.env);
      const out = resolvePath(io.cwd, shard ? outText.replaceAll('{shard}', String(shard.index)) : outText);
      checkOutputs('sweep', [{ option: '--out', name: outText, path: out }], scenarioFiles(parsed.positional[0]!, scenario, io.cwd));
      // A job array writes results/run-{shard}.jsonl from many tasks: the folder is made here.
      try {
        mkdirSync(dirname(out), { recursive: true });
      } catch (error) {
        throw new CliError(`alight sweep: cannot create the folder of --out ${outText} (${(error as { code?: string }).code ?? String(error)})`);
      }
      executor = createExecutor(workers, io.env);
      const result = await runSweep({
        scenario, vary, design, points, trials, seed, out, shard, executor,
        resume: parsed.flags.has('resume'),
        check: applyParams,
        onProgress: (done, total) => progress.update(done, total),
        onNote: (note) => io.stderr(`alight sweep: ${note}\n`),
      });
      progress.stop();
      const shardText = shard ? ` (shard ${shard.index}/${shard.count})` : '';
      io.stdout(`${result.header.points.length} points x ${trials} trials${shardText}: ran ${result.ran}, kept ${result.resumed} already written -> ${out}\n` +
        `next: alight summarize ${outText.includes('{shard}') ? '<merged file>' : outText}\n`);
      return 0;
    } catch (error) {
      progress.stop();
      return asCliError('sweep', error);
    } finally {
      await executor?.close();
    }
  },
};
