// `alight report <analysis.json> --out report.html`: renders a study headlessly into one
// self-contained HTML file with the numbers the notebook page shows for the same analysis.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { AnalysisError } from '../../notebooks/analysis/Analysis.js';
import { parseAnalysis } from '../../notebooks/analysis/parseAnalysis.js';
import { InlineJobRunner } from '../../notebooks/jobs/InlineJobRunner.js';
import { renderReport } from '../../notebooks/report/renderReport.js';
import { settleFigures } from '../../notebooks/runtime/mountStudy.js';
import { studyById } from '../../notebooks/studies/studies.js';
import { logSourceFromFolder } from '../io/log/logSourceFromFolder.node.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, parseArgs, type OptionSpec } from './parseArgs.js';
import { checkOutputs, writeOutput, type OutputTarget } from './outputFiles.js';

const OPTIONS: OptionSpec[] = [
  { name: 'out', kind: 'value', valueName: 'FILE', help: 'HTML file to write (default: the analysis file name with .html)' },
  HELP_OPTION,
];
const USAGE = 'alight report <analysis.json> [--out report.html]';
const PURPOSE = 'Render a study analysis (saved from the notebook page) into one self-contained HTML report.';

/** The demo data folder of this installation: the nearest data-demo/ above this file (source or bundle). */
function demoDataFolder(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 5; i++, dir = dirname(dir)) if (existsSync(join(dir, 'data-demo'))) return join(dir, 'data-demo');
  throw new CliError('alight report: cannot find the data-demo folder of this installation');
}

/** A demo log by the name the replay study uses (e.g. "logs/truck-with-truth"). */
function demoLog(name: string) {
  if (name.split('/').some((part) => part === '..' || part === '')) throw new CliError(`alight report: bad demo log name "${name}"`);
  return logSourceFromFolder(join(demoDataFolder(), name));
}

export const reportCommand: Command = {
  name: 'report',
  purpose: 'render a study analysis file into a self-contained HTML report',
  async run(argv, io) {
    const parsed = parseArgs('report', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, PURPOSE, OPTIONS));
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight report: expected one analysis file\nusage: ${USAGE}`);
    const file = resolve(io.cwd, parsed.positional[0]!);
    const out = resolve(io.cwd, parsed.values.get('out') ?? file.replace(/\.json$/i, '') + '.html');
    const outTarget: OutputTarget = { option: '--out', name: parsed.values.get('out') ?? out, path: out };
    checkOutputs('report', [outTarget], [file]);
    let text: string;
    try {
      text = readFileSync(file, 'utf8');
    } catch (error) {
      throw new CliError(`alight report: cannot read ${parsed.positional[0]}: ${(error as Error).message}`);
    }
    let analysis;
    try {
      analysis = parseAnalysis(text, parsed.positional[0]!, (id) => studyById(id).parameters);
    } catch (error) {
      if (error instanceof AnalysisError) throw new CliError(error.problems.join('\n'));
      throw error;
    }
    const study = studyById(analysis.study);
    const runner = new InlineJobRunner({ openLogFolder: demoLog });
    let figures;
    try {
      figures = await settleFigures(study, analysis, runner);
    } catch (error) {
      throw new CliError(`alight report: ${parsed.positional[0]}: ${(error as Error).message}`, 1);
    }
    // One line per distinct failure, naming the figures it stopped (a missing log stops several).
    const failures = new Map<string, string[]>();
    for (const f of study.figures) {
      const failure = figures.get(f.name)?.failure;
      if (failure !== undefined) failures.set(failure, [...(failures.get(failure) ?? []), f.name]);
    }
    if (failures.size > 0) {
      throw new CliError([...failures].map(([failure, names]) => `alight report: ${parsed.positional[0]}: ${failure} (figures: ${names.join(', ')})`).join('\n'), 1);
    }
    writeOutput('report', outTarget, renderReport(study, analysis, figures));
    io.stdout(`alight report: wrote ${out}\n`);
    return 0;
  },
};
