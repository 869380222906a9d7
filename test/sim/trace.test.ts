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

  it('leaves the box cells empty without a box and rounds to 9 significant digits', () => {
    const line = traceCsvLine({ ...row, box: null, t: 1 / 3, estimate: row.truth, sigma: row.truth });
    const cells = line.split(',');
    expect(cells[0]).toBe('0.333333333');
    expect(cells[TRACE_COLUMNS.indexOf('box_xMin')]).toBe('');
    expect(cells[TRACE_COLUMNS.indexOf('est_vL_z')]).toBe('0.1');
  });
});
