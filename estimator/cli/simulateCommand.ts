// `alight simulate <scenario.json> [--seed N] [--trace FILE.csv] [--json]`: one closed-loop
// landing trial. Prints a short summary (or one JSON object); --trace writes a CSV row per step.
import { basename, isAbsolute, join } from 'node:path';
import { runTrial } from '../sim/runTrial.js';
import { traceColumns, traceCsvLine } from '../sim/trace.js';
import type { Scenario } from '../sim/Scenario.js';
import type { TrialResult } from '../sim/TrialResult.js';
import { OUTCOMES, PHASES } from '../sim/TrialResult.js';
import { CliError } from './CliError.js';
import { descentConsistency } from '../study/statistics/descentConsistency.js';
import { consistencyWords } from '../study/statistics/ensembleConsistency.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { cameraSummary } from './cameraCommand.js';
import { loadScenarioForCli } from './loadScenarioForCli.js';
import { checkOutputs, outputTarget, scenarioFiles, writeOutput } from './outputFiles.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';

export { loadScenarioForCli };

const OPTIONS: OptionSpec[] = [
  { name: 'seed', kind: 'value', valueName: 'N', help: "master seed of the trial's random streams (default: the scenario's seed)" },
  { name: 'trace', kind: 'value', valueName: 'FILE.csv', help: 'write one CSV row per step: t, phase, truth, estimate, sigma, box, command, camera update (status, NIS, dim), true outline box' },
  { name: 'json', kind: 'flag', help: 'print one JSON object with every result field instead of the summary' },
  HELP_OPTION,
];

/** Library errors that mean "this scenario value cannot be simulated": exit 2, no stack. */
const SCENARIO_ERRORS = new Set(['CarrierPathError', 'CameraSpecError', 'CameraError', 'FilterSpecError', 'ScenarioError']);

const USAGE = 'alight simulate <scenario.json> [--seed N] [--trace FILE.csv] [--json]';
const PURPOSE = 'fly one closed-loop landing trial of a scenario and judge the touchdown';


const f = (v: number | null, digits = 2): string => (v === null || !Number.isFinite(v) ? '-' : v.toFixed(digits));

/** The human summary: outcome, miss, speeds, estimate quality, phase times, caution. */
export function formatSummary(scenario: Scenario, seed: number, r: TrialResult): string {
  const env = scenario.envelope;
  const lines = [`alight simulate: ${scenario.name} (seed ${seed})`];
  const when = r.touchdownTime !== null ? ` at ${f(r.touchdownTime)} s` : ` after ${f(scenario.duration, 0)} s`;
  lines.push(`  outcome    ${r.outcome}${when}${r.divergence ? ` (filter: ${r.divergence})` : ''}`);
  if (r.missDistance !== null) {
    lines.push(`  miss       ${f(r.missDistance)} m from the pad centre (along ${f(r.missX)} m, left ${f(r.missY)} m); pad radius ${env.padRadius} m`);
    lines.push(`  contact    closing ${f(r.closingSpeed)} m/s, lateral ${f(r.lateralSpeed)} m/s, tilt ${f(r.tiltDeg, 1)} deg (limits ${env.maxClosingSpeed} m/s, ${env.maxLateralSpeed} m/s, ${env.maxTiltDeg} deg)`);
  }
  lines.push(`  estimate   position RMSE ${f(r.positionRmse, 3)} m, velocity RMSE ${f(r.velocityRmse, 3)} m/s, NEES ${f(r.neesMean)} (dim ${r.neesDim}), NIS ${f(r.nisMean)} (dim ${r.nisDim}, ${r.nisCount} updates)`);
  const scale = r.deckScaleEstimate;
  if (scale) lines.push(`  deck scale ${scale.value >= 0 ? '+' : ''}${f(100 * scale.value, 1)} % ± ${f(100 * scale.sigma, 1)} % (1 sigma): the deck the filter estimates against the one it assumes`);
  const descent = descentConsistency([r.neesByHeight], r.neesDim);
  if (descent) lines.push(`  descent    NEES by true height: ${consistencyWords(descent.verdict)} (inside its 95 % interval in ${descent.bins.filter((b) => b.verdict === 'consistent').length} of ${descent.bins.length} height bins; one trial, so a wide interval: judge an ensemble with alight sweep and summarize)`);
  lines.push(`  phases     ${PHASES.map((p) => `${p} ${f(r.phaseTimes[p], 1)} s`).join(', ')}`);
  lines.push(`  sensing    ${r.boxes} boxes, ${r.dropped} dropped, ${r.falseBoxes} false, ${r.gateRejections} gated; ${r.aborts} abort${r.aborts === 1 ? '' : 's'}`);
  lines.push(`  camera     ${cameraSummary(scenario, scenario.guidance.trailHeight)}`);
  lines.push(SAFETY_CAUTION);
  return lines.join('\n') + '\n';
}

export const simulateCommand: Command = {
  name: 'simulate',
  purpose: PURPOSE,
  async run(argv, io) {
    const parsed = parseArgs('simulate', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, `${PURPOSE}.\nThe summary names the outcome (${OUTCOMES.join(', ')}), the\nmiss from the pad centre, contact speeds and tilt, estimate quality and time per phase.\n${SAFETY_CAUTION}`, OPTIONS));
      return 0;
    }
    if (parsed.positional.length > 1) throw new CliError(`alight simulate: one scenario file please, got ${parsed.positional.length} (${USAGE})`);
    const scenario = loadScenarioForCli('simulate', parsed.positional[0], io.cwd, USAGE);
    const seed = numberOption('simulate', parsed, 'seed', scenario.seed, (v) => Number.isSafeInteger(v) && v >= 0, 'a non-negative integer');
    const tracePath = parsed.values.get('trace');
    const trace = outputTarget('--trace', tracePath, io.cwd);
    if (trace) checkOutputs('simulate', [trace], scenarioFiles(parsed.positional[0]!, scenario, io.cwd));
    const traceLines: string[] = [];
    if (tracePath !== undefined) traceLines.push(traceColumns((scenario.filter.deckScaleSigma ?? 0) > 0).join(','));
    let result: TrialResult;
    try {
      result = runTrial(scenario, {
        key: { seed, point: 0, trial: 0 },
        onStep: tracePath !== undefined ? (row) => void traceLines.push(traceCsvLine(row)) : undefined,
      });
    } catch (error) {
      // a value the world models or the filter refuse (each names its scenario field)
      if (error instanceof Error && SCENARIO_ERRORS.has(error.name)) throw new CliError(`${basename(parsed.positional[0]!)}: ${error.message}`);
      throw error;
    }
    if (trace) writeOutput('simulate', trace, traceLines.join('\n') + '\n');
    if (parsed.flags.has('json')) io.stdout(JSON.stringify({ scenario: scenario.name, seed, ...result }) + '\n');
    else io.stdout(formatSummary(scenario, seed, result));
    return 0;
  },
};
