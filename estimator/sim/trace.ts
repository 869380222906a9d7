// One row per simulation step, for plotting elsewhere (`alight simulate --trace`) and for
// notebooks (runTrial's onStep). Rows are fresh objects: keep them if you like.
import type { Box } from '../camera/Box.js';
import type { UpdateStatus } from '../models/LandingFilter.js';
import type { Phase } from './TrialResult.js';

/** Three 3-vectors of one side (truth, estimate or its 1-sigma): r = p_carrier - p_lander (m), vC, vL (m/s), world ENU. */
export interface RelativeTriple {
  r: [number, number, number];
  vC: [number, number, number];
  vL: [number, number, number];
}

/** One box update of the filter: status ('gated' = refused by the chi-square gate), NIS = y' S^-1 y (NaN when undefined: 'rejected', 'diverged') and its dimension. */
export interface CameraUpdate {
  box: Box;
  status: UpdateStatus;
  nis: number;
  dim: number;
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
  /**
   * Every camera update of this step, in order: usually none or one, several when a false box
   * or a delayed frame arrives in the same step. A box that starts the filter is no update.
   */
  updates: CameraUpdate[];
  /** The last of `updates` (status, NIS, dimension), all null when there is none. */
  update: UpdateStatus | null;
  nis: number | null;
  nisDim: number | null;
  /**
   * Noise-free box of the carrier's true 3-D outline in the true camera, clipped to the image
   * (px), for the frame captured this step; null without a capture this step, or when none of
   * the outline is in the image (or it is behind the camera).
   */
  outline: Box | null;
  /**
   * Deck-scale estimate s (true deck = assumed x (1 + s)) and its 1 sigma; present only when the
   * filter carries the state (filter.deckScaleSigma > 0), null before the first box.
   */
  deckScale?: { value: number; sigma: number } | null;
}

const AXES = ['x', 'y', 'z'];
const triple = (prefix: string) => ['r', 'vC', 'vL'].flatMap((v) => AXES.map((a) => `${prefix}${v}_${a}`));

/** CSV header: t, phase, truth r/vC/vL, estimate, sigma, box corners, command, last camera update (status, NIS, dim), true outline corners, number of camera updates. */
export const TRACE_COLUMNS: readonly string[] = [
  't', 'phase', ...triple(''), ...triple('est_'), ...triple('sigma_'),
  'box_xMin', 'box_yMin', 'box_xMax', 'box_yMax', 'cmd_x', 'cmd_y', 'cmd_z',
  'update', 'nis', 'nis_dim', 'outline_xMin', 'outline_yMin', 'outline_xMax', 'outline_yMax', 'updates',
];

/** Columns appended when the filter carries the deck-scale state. */
export const DECK_SCALE_COLUMNS: readonly string[] = ['est_deck_scale', 'sigma_deck_scale'];

/** The CSV header of a trial: TRACE_COLUMNS, then DECK_SCALE_COLUMNS when the filter carries the deck-scale state. */
export function traceColumns(deckScale: boolean): readonly string[] {
  return deckScale ? [...TRACE_COLUMNS, ...DECK_SCALE_COLUMNS] : TRACE_COLUMNS;
}

const num = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(9))) : '');
const cells = (t: RelativeTriple | null): string[] => (t ? [...t.r, ...t.vC, ...t.vL].map(num) : new Array<string>(9).fill(''));
const corners = (b: Box | null): string[] => (b ? [b.xMin, b.yMin, b.xMax, b.yMax].map(num) : ['', '', '', '']);

/** One CSV line (no newline); empty cells where there is no estimate, box, update or outline; the last update of a step when there are several; the deck-scale cells when the row has them. */
export function traceCsvLine(row: TraceRow): string {
  const scale = row.deckScale === undefined ? [] : row.deckScale === null ? ['', ''] : [num(row.deckScale.value), num(row.deckScale.sigma)];
  return [
    num(row.t), row.phase, ...cells(row.truth), ...cells(row.estimate), ...cells(row.sigma), ...corners(row.box), ...row.command.map(num),
    row.update ?? '', row.nis === null ? '' : num(row.nis), row.nisDim === null ? '' : String(row.nisDim), ...corners(row.outline),
    String(row.updates.length), ...scale,
  ].join(',');
}
