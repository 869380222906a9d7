// `alight merge`: join shard result files into exactly the file an unsharded sweep writes.
import { existsSync, readFileSync } from 'node:fs';
import { mergeResults, type MergeInput } from '../study/mergeResults.js';
import { describeProblems, parseResults } from '../study/resultsFile.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, parseArgs, type OptionSpec } from './parseArgs.js';
import { asCliError, checkResultsSize, resolvePath } from './studyCli.js';
import { checkOutputs, writeOutput, type OutputTarget } from './outputFiles.js';

const USAGE = 'alight merge <shard.jsonl>... --out results.jsonl [--allow-partial]';
const PURPOSE = 'Join the result files of a sharded sweep; the output equals an unsharded run byte for byte.';
const OPTIONS: OptionSpec[] = [
  { name: 'out', kind: 'value', valueName: 'FILE', help: 'merged results file (required; refuses to overwrite an input)' },
  { name: 'allow-partial', kind: 'flag', help: 'write the merge even when trials are missing (says how many)' },
  HELP_OPTION,
];

export const mergeCommand: Command = {
  name: 'merge',
  purpose: 'join the result files of a sharded sweep into one',
  async run(argv, io) {
    const parsed = parseArgs('merge', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS));
      return 0;
    }
    const out = parsed.values.get('out');
    if (!out) throw new CliError('alight merge: --out FILE is required');
    if (parsed.positional.length === 0) throw new CliError(`alight merge: give the shard files (usage: ${USAGE})`);
    const outTarget: OutputTarget = { option: '--out', name: out, path: resolvePath(io.cwd, out) };
    checkOutputs('merge', [outTarget], parsed.positional.map((name) => resolvePath(io.cwd, name)));
    try {
      const inputs: MergeInput[] = parsed.positional.map((name) => {
        const path = resolvePath(io.cwd, name);
        if (!existsSync(path)) throw new CliError(`alight merge: ${name}: no such file`);
        checkResultsSize('merge', name, path);
        const result = parseResults(readFileSync(path, 'utf8'), name);
        if (result.problems.length > 0) {
          throw new CliError(`alight merge: ${name} has lines that are not trial records (finish it with alight sweep --resume):\n${describeProblems(name, result.problems)}`);
        }
        return { name, parsed: result };
      });
      const merged = mergeResults(inputs);
      if (merged.missing > 0 && !parsed.flags.has('allow-partial')) {
        throw new CliError(`alight merge: ${merged.missing} of ${merged.records + merged.missing} trials are missing (resume the unfinished shards, or pass --allow-partial)`);
      }
      writeOutput('merge', outTarget, merged.text);
      io.stdout(`merged ${inputs.length} files, ${merged.records} trials${merged.missing ? ` (${merged.missing} missing)` : ''} -> ${out}\n`);
      return 0;
    } catch (error) {
      return asCliError('merge', error);
    }
  },
};
