// One row per simulation step, for plotting elsewhere (`alight simulate --trace`) and for
// notebooks (runTrial's onStep). Rows are fresh objects: keep them if you like.
import type { Box } from '../camera/Box.js';
import type { Phase } from './TrialResult.js';

/** Three 3-vectors of one side (truth, estimate or its 1-sigma): r = p_carrier - p_lander (m), vC, vL (m/s), world ENU. */
export interface RelativeTriple {
  r: [number, number, number];
  vC: [number, number, number];
  vL: [number, number, number];
}

export interface TraceRow {
  /** Simulation time (s). */
  t: number;
  phase: Phase;
  truth: RelativeTriple;
  /** Filter estimate and sqrt of its covariance diagonal; null before the first box. */
  estimate: RelativeTriple | null;
  sigma: RelativeTriple | null;
  /** Box handed to the filter during this step (the last one if several); null if none. */
  box: Box | null;
  /** Lander velocity command (m/s, world ENU). */
  command: [number, number, number];
}

const AXES = ['x', 'y', 'z'];
const triple = (prefix: string) => ['r', 'vC', 'vL'].flatMap((v) => AXES.map((a) => `${prefix}${v}_${a}`));

/** CSV header: t, phase, truth r/vC/vL, estimate, sigma, box corners, command. */
export const TRACE_COLUMNS: readonly string[] = [
  't', 'phase', ...triple(''), ...triple('est_'), ...triple('sigma_'),
  'box_xMin', 'box_yMin', 'box_xMax', 'box_yMax', 'cmd_x', 'cmd_y', 'cmd_z',
];

const num = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(9))) : '');
const cells = (t: RelativeTriple | null): string[] => (t ? [...t.r, ...t.vC, ...t.vL].map(num) : new Array<string>(9).fill(''));

/** One CSV line (no newline); empty cells where there is no estimate or box. */
export function traceCsvLine(row: TraceRow): string {
  const box = row.box ? [row.box.xMin, row.box.yMin, row.box.xMax, row.box.yMax].map(num) : ['', '', '', ''];
  return [num(row.t), row.phase, ...cells(row.truth), ...cells(row.estimate), ...cells(row.sigma), ...box, ...row.command.map(num)].join(',');
}
