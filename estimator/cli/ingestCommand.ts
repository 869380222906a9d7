// `alight ingest <recording.mcap> --map map.json --out <log-folder> [--force] [--json]`: turn a
// ROS 2 recording into the flight-log layout, so `alight replay` and `alight tune` can read it.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { isAbsolute, join } from 'node:path';
import { STREAM_SPECS } from '../io/log/logStreams.js';
import { ingestRosRecordingToFolder, RecordingError, type IngestReport } from '../io/ros/ingestRosRecording.node.js';
import { parseRosMap, RosMapError } from '../io/ros/parseRosMap.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, parseArgs, type OptionSpec } from './parseArgs.js';
import { checkOutputs } from './outputFiles.js';
import { commitStaging, discardStaging, startStaging } from './stagedLogFolder.js';

const OPTIONS: OptionSpec[] = [
  { name: 'map', kind: 'value', valueName: 'map.json', help: 'which topics and fields give boxes, IMU, attitude, odometry, truth and the camera (schema: estimator/io/ros/rosMap.schema.json)' },
  { name: 'out', kind: 'value', valueName: 'FOLDER', help: 'log folder to write (created; refused if it already holds a log, unless --force)' },
  { name: 'force', kind: 'flag', help: 'replace the log files of an existing log folder' },
  { name: 'json', kind: 'flag', help: 'print the conversion report as one JSON object' },
  HELP_OPTION,
];

const LOG_FILES = ['camera.json', 'filter.json', ...Object.values(STREAM_SPECS).map((s) => s.file)];
const USAGE = 'alight ingest <recording.mcap> --map map.json --out <log-folder> [--force] [--json]';
const PURPOSE = 'convert a ROS 2 recording (.mcap) into a flight log for replay and tune';

function summary(report: IngestReport, out: string): string {
  const lines = [`alight ingest: ${report.recording} (${(report.bytes / 1e6).toFixed(1)} MB${report.indexed ? '' : ', no index'}) -> ${out} in ${report.seconds.toFixed(1)} s (${report.threads} thread${report.threads > 1 ? 's' : ''})`];
  const c = report.camera;
  lines.push(`  ${'camera'.padEnd(14)}${c.topic} "${c.frameId}": ${c.width}x${c.height} px, fx ${c.fx} fy ${c.fy}, cx ${c.cx} cy ${c.cy} (alight pixel coordinates)`);
  for (const [role, s] of Object.entries(report.streams)) {
    if (role === 'camera') continue;
    const left = Object.entries(s.left).map(([why, n]) => `${n} ${why}`).join(', ');
    const label = role === 'truthLander' ? 'truth.lander' : role === 'truthCarrier' ? 'truth.carrier' : role;
    lines.push(`  ${label.padEnd(14)}${s.topic} (${s.type}): ${s.messages} messages -> ${s.rows} rows${left ? `; left out: ${left}` : ''}`);
  }
  lines.push(`  ${'time'.padEnd(14)}seconds after ${report.timeOrigin} s of the recording's clock`);
  if (report.otherTopics.length > 0) lines.push(`  ${'unused topics'.padEnd(14)}${report.otherTopics.join(', ')}`);
  for (const w of report.warnings) lines.push(`  ${'warning'.padEnd(14)}${w}`);
  lines.push(`  ${'next'.padEnd(14)}alight replay ${out}`);
  return lines.join('\n') + '\n';
}

export const ingestCommand: Command = {
  name: 'ingest',
  purpose: PURPOSE,
  async run(argv, io) {
    const parsed = parseArgs('ingest', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, `${PURPOSE}.\nThe map file names the topics; the README's section "Replaying a ROS 2 recording" shows one.\nMessages: sensor_msgs/CameraInfo, vision_msgs/Detection2DArray (or your own with four corner fields),\nsensor_msgs/Imu, attitude and odometry from the standard geometry_msgs / nav_msgs types.`, OPTIONS));
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight ingest: give one recording (.mcap), got ${parsed.positional.length} (${USAGE})`);
    const mapPath = parsed.values.get('map');
    const out = parsed.values.get('out');
    if (mapPath === undefined) throw new CliError(`alight ingest: say which topics to read with --map map.json (${USAGE})`);
    if (out === undefined) throw new CliError(`alight ingest: say where to write the log with --out <log-folder> (${USAGE})`);
    const resolve = (p: string) => (isAbsolute(p) ? p : join(io.cwd, p));
    checkOutputs('ingest', LOG_FILES.map((f) => ({ option: '--out', name: join(out, f), path: join(resolve(out), f) })), [resolve(parsed.positional[0]!), resolve(mapPath)]);
    let mapText: string;
    try {
      mapText = readFileSync(resolve(mapPath), 'utf8');
    } catch (error) {
      throw new CliError(`alight ingest: cannot read --map ${mapPath} (${(error as { code?: string }).code ?? String(error)})`);
    }
    let map;
    try {
      map = parseRosMap(mapText, mapPath);
    } catch (error) {
      if (error instanceof RosMapError) throw new CliError(error.problems.join('\n'));
      throw error;
    }
    const recording = parsed.positional[0]!;
    if (!existsSync(resolve(recording))) throw new CliError(`alight ingest: ${recording}: no such file`);
    const folder = resolve(out);
    if (existsSync(folder)) {
      const present = readdirSync(folder).filter((f) => LOG_FILES.includes(f));
      if (present.length > 0 && !parsed.flags.has('force')) throw new CliError(`alight ingest: ${out} already holds a log (${present.slice(0, 3).join(', ')}${present.length > 3 ? ', ...' : ''}); use --force to overwrite`);
    }
    let report: IngestReport;
    let staging: string | undefined;
    try {
      // Written beside the target and moved in when complete: a stopped conversion leaves no
      // half-written log behind to be replayed by mistake, and --force keeps the old log until then.
      staging = startStaging(folder);
      report = await ingestRosRecordingToFolder(resolve(recording), map, staging, { name: recording });
      commitStaging(staging, folder, LOG_FILES);
    } catch (error) {
      if (staging !== undefined) discardStaging(staging);
      if (error instanceof RecordingError) throw new CliError(`alight ingest: ${error.message}`);
      const code = (error as { code?: string }).code;
      if (code !== undefined && ['EACCES', 'EPERM', 'EROFS', 'ENOENT', 'ENOTDIR', 'EEXIST', 'EISDIR', 'ENOSPC'].includes(code)) throw new CliError(`alight ingest: cannot write ${out} (${code})`);
      throw error;
    }
    io.stdout(parsed.flags.has('json') ? JSON.stringify(report) + '\n' : summary(report, out));
    return 0;
  },
};
