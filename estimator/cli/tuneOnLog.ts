// `alight tune <log-folder>`: the flight-log branch of the tune command. The search and the
// cost live in the library (estimator/io/log/tuneLog.ts); this prints and writes files.
import { tuneLog, type TuneCriterion } from '../io/log/tuneLog.js';
import { heatMapFigure } from '../study/figures/heatMapFigure.js';
import type { SurfaceSample } from '../study/search.js';
import { CliError } from './CliError.js';
import type { CommandIo } from './Command.js';
import type { ParsedArgs } from './parseArgs.js';
import { inputError, readFilterSettings } from './replayCommand.js';
import { resolvePath } from './studyCli.js';
import { outputTarget, writeOutput } from './outputFiles.js';

export interface LogTuneOptions {
  q?: [number, number];
  r?: [number, number];
  gate?: [number, number];
  grid: number;
  refine: number;
}

/** Heat map of the grid samples over qScale and rScale at the grid gate nearest the best. */
export function surfaceHeatMap(samples: readonly SurfaceSample[], best: SurfaceSample, title: string): string {
  const grid = samples.filter((s) => s.stage === 'grid');
  const gates = [...new Set(grid.map((s) => s.gate))];
  const gate = gates.reduce((a, b) => (Math.abs(Math.log(b / best.gate)) < Math.abs(Math.log(a / best.gate)) ? b : a));
  const cells = grid.filter((s) => s.gate === gate).map((s) => ({ x: s.q, y: s.r, value: s.score }));
  return heatMapFigure(cells, { xLabel: 'filter.qScale', yLabel: 'filter.rScale', valueLabel: 'cost (lower = better)', lowerIsBetter: true, best: { x: best.q, y: best.r }, title: `${title} at gateScale ${gate}` });
}

export async function tuneOnLog(folder: string, parsed: ParsedArgs, io: CommandIo, options: LogTuneOptions): Promise<number> {
  const criterionText = parsed.values.get('criterion');
  if (criterionText !== undefined && criterionText !== 'nis' && criterionText !== 'nees') throw new CliError(`alight tune: --criterion expects nis or nees, got "${criterionText}"`);
  const filterFile = parsed.values.get('filter');
  const settings = filterFile ? readFilterSettings('tune', filterFile, io.cwd) : {};
  const json = parsed.flags.has('json');
  try {
    const result = await tuneLog(resolvePath(io.cwd, folder), {
      ...settings, ...options, criterion: criterionText as TuneCriterion | undefined,
      onSample: (s, n) => {
        if (!json && io.interactive) io.stderr(`  ${n}: q ${s.q} r ${s.r} gate ${s.gate} -> cost ${s.score.toFixed(4)}\n`);
      },
    });
    const surfaceOut = outputTarget('--surface', parsed.values.get('surface'), io.cwd);
    if (surfaceOut) {
      const rows = result.surface;
      const text = surfaceOut.name.endsWith('.csv')
        ? ['qScale,rScale,gateScale,cost,stage,nisMean,neesMean,white,gateRejections', ...rows.map((r) => [r.q, r.r, r.gate, r.score, r.stage, r.nisMean ?? '', r.neesMean ?? '', r.white ?? '', r.gateRejections].join(','))].join('\n') + '\n'
        : JSON.stringify(rows, null, 1) + '\n';
      writeOutput('tune', surfaceOut, text);
    }
    const svgOut = outputTarget('--svg', parsed.values.get('svg'), io.cwd);
    const best = result.surface.find((s) => s.q === result.recommended.qScale && s.r === result.recommended.rScale && s.gate === result.recommended.gateScale)!;
    if (svgOut) writeOutput('tune', svgOut, surfaceHeatMap(result.surface, best, `Log tuning cost (${result.criterion.toUpperCase()})`));
    if (json) {
      io.stdout(JSON.stringify({ criterion: result.criterion, recommended: { 'filter.qScale': result.recommended.qScale, 'filter.rScale': result.recommended.rScale, 'filter.gateScale': result.recommended.gateScale }, cost: result.cost, baselineCost: result.baseline.cost, evaluations: result.surface.length, caution: result.caution }, null, 1) + '\n');
    } else {
      io.stdout(
        `recommended: qScale ${result.recommended.qScale}  rScale ${result.recommended.rScale}  gateScale ${result.recommended.gateScale}\n` +
        `  ${result.criterion.toUpperCase()} cost ${result.cost.toFixed(4)} (the log's own settings: ${result.baseline.cost.toFixed(4)}), ${result.surface.length} replays\n` +
        `${result.caution}\n`,
      );
    }
    return 0;
  } catch (error) {
    if (error instanceof RangeError && /truth\.csv/.test(error.message)) throw new CliError(`alight tune: ${error.message}`);
    return inputError('tune', error);
  }
}
