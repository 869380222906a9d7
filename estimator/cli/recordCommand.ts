// `alight record <scenario.json> --out <log-folder> [--seed N] [--no-truth] [--force]`: fly one
// simulated trial and write it in the flight-log layout, so `alight replay` can run on it.
import { existsSync, readdirSync } from 'node:fs';
import { isAbsolute, join } from 'node:path';
import { folderSink } from '../io/log/folderSink.node.js';
import { recordTrial } from '../io/log/recordTrial.js';
import { STREAM_SPECS } from '../io/log/logStreams.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { loadScenarioForCli } from './loadScenarioForCli.js';
import { checkOutputs, scenarioFiles } from './outputFiles.js';
import { commitStaging, discardStaging, startStaging } from './stagedLogFolder.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';

const OPTIONS: OptionSpec[] = [
  { name: 'out', kind: 'value', valueName: 'FOLDER', help: 'log folder to write (created; refused if it already holds a log, unless --force)' },
  { name: 'seed', kind: 'value', valueName: 'N', help: "master seed of the trial's random streams (default: the scenario's seed)" },
  { name: 'no-truth', kind: 'flag', help: 'leave out truth.csv, like a flight without a motion-capture or RTK reference' },
  { name: 'force', kind: 'flag', help: 'replace the log files (camera.json, filter.json, the CSV files) of an existing log folder' },
  HELP_OPTION,
];

/** The files of the layout (README.md, "Flight-log layout"); --force removes exactly these. */
const LOG_FILES = ['camera.json', 'filter.json', ...Object.values(STREAM_SPECS).map((s) => s.file)];

const USAGE = 'alight record <scenario.json> --out <log-folder> [--seed N] [--no-truth] [--force]';
const PURPOSE = "fly one simulated trial and write what the lander's sensors saw as a replayable flight log";

export const recordCommand: Command = {
  name: 'record',
  purpose: PURPOSE,
  async run(argv, io) {
    const parsed = parseArgs('record', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(
        formatHelp(
          USAGE,
          `${PURPOSE}.\nFiles: camera.json (the camera as the filter believes it), filter.json, boxes.csv, imu.csv,\nattitude.csv, odometry.csv, truth.csv (unless --no-truth) and onboard.csv (the filter's own estimates).\nThe layout is described in the README, section "Flight-log layout".\n${SAFETY_CAUTION}`,
          OPTIONS,
        ),
      );
      return 0;
    }
    if (parsed.positional.length > 1) throw new CliError(`alight record: one scenario file please, got ${parsed.positional.length} (${USAGE})`);
    const out = parsed.values.get('out');
    if (out === undefined) throw new CliError(`alight record: say where to write the log with --out <log-folder> (${USAGE})`);
    const scenario = loadScenarioForCli('record', parsed.positional[0], io.cwd);
    const seed = numberOption('record', parsed, 'seed', scenario.seed, (v) => Number.isSafeInteger(v) && v >= 0, 'a non-negative integer');
    const folder = isAbsolute(out) ? out : join(io.cwd, out);
    checkOutputs('record', LOG_FILES.map((f) => ({ option: '--out', name: join(out, f), path: join(folder, f) })), scenarioFiles(parsed.positional[0]!, scenario, io.cwd));
    if (existsSync(folder)) {
      const present = readdirSync(folder).filter((f) => LOG_FILES.includes(f));
      if (present.length > 0 && !parsed.flags.has('force')) throw new CliError(`alight record: ${out} already holds a log (${present.slice(0, 3).join(', ')}${present.length > 3 ? ', ...' : ''}); use --force to overwrite`);
      // --force: the old log's files go once the new log is complete (commitStaging), so no stale truth.csv or onboard.csv survives.
    }
    let recorded;
    let staging: string | undefined;
    try {
      staging = startStaging(folder);
      recorded = recordTrial(scenario, folderSink(staging), { key: { seed, point: 0, trial: 0 }, truth: !parsed.flags.has('no-truth') });
      commitStaging(staging, folder, LOG_FILES);
    } catch (error) {
      if (staging !== undefined) discardStaging(staging);
      const code = (error as { code?: string }).code;
      if (code !== undefined && ['EACCES', 'EPERM', 'EROFS', 'ENOENT', 'ENOTDIR', 'EEXIST', 'EISDIR', 'ENOSPC'].includes(code)) throw new CliError(`alight record: cannot write ${out} (${code})`);
      throw error;
    }
    const { result, rows } = recorded;
    const files = Object.entries(rows).map(([file, n]) => `${file} ${n}`).join(', ');
    io.stdout(
      `alight record: ${scenario.name} (seed ${seed}) -> ${out}\n` +
        `  outcome  ${result.outcome}${result.touchdownTime !== null ? ` at ${result.touchdownTime.toFixed(2)} s` : ''}\n` +
        `  rows     ${files}\n` +
        `  replay   alight replay ${out}\n` +
        `${SAFETY_CAUTION}\n`,
    );
    return 0;
  },
};
