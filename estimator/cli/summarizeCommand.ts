// `alight summarize`: statistics per sweep point of a results file, as a table, JSON or CSV,
// with optional SVG figures (success vs parameter, touchdown scatter).
import { existsSync, readFileSync } from 'node:fs';
import { missScatterFigure } from '../study/figures/missScatterFigure.js';
import { successFigure } from '../study/figures/successFigure.js';
import { describeProblems, parseResults } from '../study/resultsFile.js';
import { summarize, summarizeGroup } from '../study/summarize.js';
import { summaryCsv, summaryTable } from '../study/summaryTable.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';
import { asCliError, checkResultsSize, resolvePath } from './studyCli.js';
import { checkOutputs, outputTarget, writeOutput, type OutputTarget } from './outputFiles.js';

const USAGE = 'alight summarize <results.jsonl> [--by PATH] [--json | --format text|json|csv] [--csv FILE] [--svg FILE] [--miss-svg FILE] [--target RATE] [--skip-bad]';
const PURPOSE = 'Per sweep point: success rate with Wilson 95 % interval, rule-of-three bound, CEP50/CEP95 of the miss,\ntime-to-land percentiles, outcome counts, NEES/NIS means with chi-square bounds and a consistency verdict.';
const OPTIONS: OptionSpec[] = [
  { name: 'by', kind: 'value', valueName: 'PATH', help: 'one row per value of this varied path, pooling the others' },
  { name: 'json', kind: 'flag', help: 'print one JSON array, one object per point (same as --format json)' },
  { name: 'format', kind: 'value', valueName: 'text|json|csv', help: 'output format on stdout (default text)' },
  { name: 'csv', kind: 'value', valueName: 'FILE', help: 'also write the summary as CSV' },
  { name: 'svg', kind: 'value', valueName: 'FILE', help: 'figure: success rate vs the --by path (or the only varied path) with Wilson band' },
  { name: 'miss-svg', kind: 'value', valueName: 'FILE', help: 'figure: touchdown points on the deck outline and pad' },
  { name: 'target', kind: 'value', valueName: 'RATE', help: 'required success rate drawn on the --svg figure' },
  { name: 'skip-bad', kind: 'flag', help: 'skip truncated or foreign lines (reported with their line numbers) instead of refusing' },
  HELP_OPTION,
];

export const summarizeCommand: Command = {
  name: 'summarize',
  purpose: 'statistics per sweep point: success with Wilson interval, CEP, NEES verdict',
  async run(argv, io) {
    const parsed = parseArgs('summarize', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS));
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight summarize: give one results file (usage: ${USAGE})`);
    const name = parsed.positional[0]!;
    const path = resolvePath(io.cwd, name);
    if (!existsSync(path)) throw new CliError(`alight summarize: ${name}: no such file`);
    checkResultsSize('summarize', name, path);
    const format = parsed.flags.has('json') ? 'json' : (parsed.values.get('format') ?? 'text');
    if (!['text', 'json', 'csv'].includes(format)) throw new CliError(`alight summarize: --format expects text, json or csv, got "${format}"`);
    const csvOut = outputTarget('--csv', parsed.values.get('csv'), io.cwd);
    const svgOut = outputTarget('--svg', parsed.values.get('svg'), io.cwd);
    const missOut = outputTarget('--miss-svg', parsed.values.get('miss-svg'), io.cwd);
    checkOutputs('summarize', [csvOut, svgOut, missOut].filter((o): o is OutputTarget => o !== undefined), [path]);
    const target = parsed.values.has('target') ? numberOption('summarize', parsed, 'target', 0, (v) => v > 0 && v < 1, 'a rate between 0 and 1') : undefined;
    try {
      const results = parseResults(readFileSync(path, 'utf8'), name);
      if (results.problems.length > 0) {
        const listing = describeProblems(name, results.problems);
        if (!parsed.flags.has('skip-bad')) {
          throw new CliError(`alight summarize: ${results.problems.length} line(s) are not valid trial records; refusing to summarize (pass --skip-bad to skip them):\n${listing}`);
        }
        io.stderr(`alight summarize: skipped ${results.problems.length} bad line(s), counted ${results.records.length} trials:\n${listing}\n`);
      }
      const expected = results.header.points.length * results.header.trials;
      const shard = results.header.shard;
      if (shard) io.stderr(`alight summarize: ${name} is shard ${shard.index}/${shard.count} only; alight merge joins the shards\n`);
      else if (results.records.length < expected) io.stderr(`alight summarize: ${name} holds ${results.records.length} of ${expected} trials (an unfinished sweep? alight sweep --resume completes it)\n`);
      const by = parsed.values.get('by');
      const records = results.records.map((r) => r.record);
      const summaries = summarize(results.header, records, by);
      const paths = by !== undefined ? [by] : results.header.vary.map((v) => v.path);
      if (csvOut) writeOutput('summarize', csvOut, summaryCsv(summaries, paths));
      if (svgOut) {
        const axis = by ?? (paths.length === 1 ? paths[0] : undefined);
        if (axis === undefined) throw new CliError(`alight summarize: --svg needs --by PATH when ${paths.length} paths were varied`);
        const points = summaries.filter((s) => typeof s.point[axis] === 'number');
        if (points.length === 0) throw new CliError(`alight summarize: --svg needs numeric values of ${axis}`);
        writeOutput('summarize', svgOut, successFigure(points.map((s) => ({ x: s.point[axis] as number, rate: s.successRate, low: s.wilsonLow, high: s.wilsonHigh, trials: s.trials })), { xLabel: axis, target }));
      }
      if (missOut) {
        const { envelope, carrier } = results.header.scenario;
        const contacts = records.filter((r) => r.missX !== null && r.missY !== null).map((r) => ({ x: r.missX!, y: r.missY!, outcome: r.outcome }));
        const all = summarizeGroup({}, records);
        writeOutput('summarize', missOut, missScatterFigure(contacts, { padRadius: envelope.padRadius, deckLength: carrier.deckLength, deckWidth: carrier.deckWidth, cep50: all.cep50 }));
      }
      if (format === 'json') io.stdout(JSON.stringify(summaries, null, 1) + '\n');
      else if (format === 'csv') io.stdout(summaryCsv(summaries, paths));
      else io.stdout(summaryTable(summaries) + `\n${SAFETY_CAUTION}\n`);
      return 0;
    } catch (error) {
      return asCliError('summarize', error);
    }
  },
};
