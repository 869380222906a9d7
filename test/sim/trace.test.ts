import { describe, expect, it } from 'vitest';
import { TRACE_COLUMNS, traceCsvLine, type TraceRow } from '../../estimator/sim/trace.js';

const row: TraceRow = {
  t: 1.25,
  phase: 'trail',
  truth: { r: [1, 2, -6], vC: [3, 0, 0], vL: [2.5, 0, 0.1] },
  estimate: null,
  sigma: null,
  box: { xMin: 300.5, yMin: 200, xMax: 340, yMax: 250.25 },
  command: [3.2, 0, 0],
  updates: [
    { box: { xMin: 10, yMin: 10, xMax: 30, yMax: 40 }, status: 'accepted', nis: 2.5, dim: 3 },
    { box: { xMin: 300.5, yMin: 200, xMax: 340, yMax: 250.25 }, status: 'gated', nis: 14.75, dim: 3 },
  ],
  update: 'gated',
  nis: 14.75,
  nisDim: 3,
  outline: { xMin: 298, yMin: 199, xMax: 342.5, yMax: 251 },
};

describe('traceCsvLine', () => {
  it('writes one cell per header column, empty where there is no estimate', () => {
    const cells = traceCsvLine(row).split(',');
    expect(cells).toHaveLength(TRACE_COLUMNS.length);
    expect(TRACE_COLUMNS.slice(0, 5)).toEqual(['t', 'phase', 'r_x', 'r_y', 'r_z']);
    expect(cells.slice(0, 5)).toEqual(['1.25', 'trail', '1', '2', '-6']);
    expect(cells[TRACE_COLUMNS.indexOf('est_r_x')]).toBe('');
    expect(cells[TRACE_COLUMNS.indexOf('box_yMax')]).toBe('250.25');
    expect(cells[TRACE_COLUMNS.indexOf('cmd_x')]).toBe('3.2');
  });

  it('appends the camera update and the true outline after the original columns', () => {
    // the original 36 columns keep their places; the new ones follow
    expect(TRACE_COLUMNS.indexOf('cmd_z')).toBe(35);
    expect(TRACE_COLUMNS.slice(36)).toEqual(['update', 'nis', 'nis_dim', 'outline_xMin', 'outline_yMin', 'outline_xMax', 'outline_yMax', 'updates']);
    const cells = traceCsvLine(row).split(',');
    expect(cells.slice(36)).toEqual(['gated', '14.75', '3', '298', '199', '342.5', '251', '2']); // the last of two updates
    const none = traceCsvLine({ ...row, updates: [], update: null, nis: null, nisDim: null, outline: null }).split(',');
    expect(none).toHaveLength(TRACE_COLUMNS.length);
    expect(none.slice(36)).toEqual(['', '', '', '', '', '', '', '0']);
  });

  it('leaves the box cells empty without a box and rounds to 9 significant digits', () => {
    const line = traceCsvLine({ ...row, box: null, t: 1 / 3, estimate: row.truth, sigma: row.truth });
    const cells = line.split(',');
    expect(cells[0]).toBe('0.333333333');
    expect(cells[TRACE_COLUMNS.indexOf('box_xMin')]).toBe('');
    expect(cells[TRACE_COLUMNS.indexOf('est_vL_z')]).toBe('0.1');
  });
});
