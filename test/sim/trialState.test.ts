import { describe, expect, it } from 'vitest';
import { TrialState } from '../../estimator/sim/trialState.js';
import { expectClose } from '../helpers/expectClose.js';

const noContact = { touchdown: null, touchdownTime: null, aborts: 0, lastAbort: null, falseBoxes: 0, peakAttitudeRate: 0 };

describe('TrialState', () => {
  it('calls a trial without contact diverged, aborted or timed-out, in that order of precedence', () => {
    const s = new TrialState(12);
    expect(s.result(noContact).outcome).toBe('timed-out');
    expect(s.result({ ...noContact, aborts: 1, lastAbort: 'target-lost' }).outcome).toBe('aborted');
    s.noteDivergence('covariance-not-positive-definite');
    s.noteDivergence('state-not-finite'); // the first event is kept
    const r = s.result({ ...noContact, aborts: 2, lastAbort: 'diverged' });
    expect(r.outcome).toBe('diverged');
    expect(r.divergence).toBe('covariance-not-positive-definite');
    // re-acquired after the divergence and then lost the target: an abort, not a divergence
    expect(s.result({ ...noContact, aborts: 3, lastAbort: 'target-lost' }).outcome).toBe('aborted');
  });

  it('takes the contact verdict and its numbers when there is one', () => {
    const touchdown = { outcome: 'off-pad' as const, missDistance: 0.9, missX: 0.9, missY: 0, closingSpeed: 0.5, lateralSpeed: 0.2, tiltDeg: 4 };
    const r = new TrialState(12).result({ ...noContact, touchdown, touchdownTime: 14.2 });
    expect([r.outcome, r.missDistance, r.missX, r.missY, r.closingSpeed, r.lateralSpeed, r.tiltDeg, r.touchdownTime]).toEqual(['off-pad', 0.9, 0.9, 0, 0.5, 0.2, 4, 14.2]);
  });

  it('averages errors, NEES and NIS, and gives NaN for means over nothing', () => {
    const s = new TrialState(12);
    let r = s.result(noContact);
    expect([r.positionRmse, r.velocityRmse, r.neesMean, r.nisMean]).toEqual([NaN, NaN, NaN, NaN]);
    const x = new Float64Array(12);
    x.set([3, 0, 0, 1, 0, 0, 0, 0, 0]); // position error 3 m, relative velocity error 1 m/s
    const P = new Float64Array(144);
    for (let i = 0; i < 12; i++) P[i * 12 + i] = 1; // NEES = 9 / 1 + 1 / (P_cc + P_ll = 2) = 9.5
    s.errors.add(x, P, 12, [0, 0, 0], [0, 0, 0], [0, 0, 0]);
    x.set([0, 4, 0, 0, 0, 0, 0, 0, 2]); // 4 m, and vL error 2 m/s -> relative velocity error -2
    s.errors.add(x, new Float64Array(144), 12, [0, 0, 0], [0, 0, 0], [0, 0, 0]); // P = 0: NaN NEES is not averaged
    s.addNis(2);
    s.addNis(Number.NaN);
    s.addNis(4);
    r = s.result(noContact);
    expectClose(r.positionRmse, Math.sqrt((9 + 16) / 2), { rel: 1e-15 }, 'position RMSE (round-off)');
    expectClose(r.velocityRmse, Math.sqrt((1 + 4) / 2), { rel: 1e-15 }, 'velocity RMSE (round-off)');
    expect([r.neesMean, r.nisMean, r.nisCount, r.neesDim, r.nisDim]).toEqual([9.5, 3, 2, 6, 3]);
  });

  it('builds a fresh trace row with sigma from the covariance diagonal', () => {
    const s = new TrialState(12);
    s.rTrue.set([1, 2, -5]);
    s.command.set([3, 0, -0.5]);
    s.lastBox = { xMin: 1, yMin: 2, xMax: 3, yMax: 4 };
    const P = new Float64Array(144);
    for (let i = 0; i < 12; i++) P[i * 12 + i] = (i + 1) ** 2;
    const row = s.row(1.5, 'trail', new Float64Array(12).fill(0.5), P);
    expect(row.truth.r).toEqual([1, 2, -5]);
    expect(row.sigma!.vL).toEqual([7, 8, 9]);
    expect(row.estimate!.vC).toEqual([0.5, 0.5, 0.5]);
    expect(row.command).toEqual([3, 0, -0.5]);
    s.lastBox.xMin = 99;
    expect(row.box!.xMin).toBe(1); // copied, not shared
    expect(s.row(1.6, 'trail', null, null).estimate).toBeNull();
  });

  it('carries this step\'s camera update and true outline into the row, and clears them per step', () => {
    const s = new TrialState(12);
    const box = { xMin: 1, yMin: 2, xMax: 3, yMax: 4 };
    s.noteUpdate(box, { status: 'accepted', nis: 1.5, dim: 3, reason: null });
    box.xMin = 5;
    s.noteUpdate(box, { status: 'gated', nis: 21.5, dim: 3, reason: null });
    s.noteOutline({ xMin: 10, yMin: 20, xMax: 30, yMax: 45 });
    const row = s.row(2, 'align', null, null);
    expect(row.updates.map((u) => [u.status, u.nis, u.dim, u.box.xMin])).toEqual([['accepted', 1.5, 3, 1], ['gated', 21.5, 3, 5]]);
    expect([row.update, row.nis, row.nisDim]).toEqual(['gated', 21.5, 3]); // the last update
    s.clearStep();
    s.noteUpdate(box, { status: 'rejected', nis: Number.NaN, dim: 3, reason: 'r' }); // reuses the first slot
    expect(row.updates[0]!.status).toBe('accepted'); // rows hold copies
    expect(s.row(2.005, 'align', null, null).updates.map((u) => u.status)).toEqual(['rejected']);
    expect(row.outline).toEqual({ xMin: 10, yMin: 20, xMax: 30, yMax: 45 });
    s.noteOutline({ xMin: 11, yMin: 20, xMax: 30, yMax: 45 });
    expect(row.outline!.xMin).toBe(10); // copied, not shared
    s.noteOutline({ xMin: NaN, yMin: NaN, xMax: NaN, yMax: NaN }); // behind the camera
    expect(s.row(2.01, 'align', null, null).outline).toBeNull();
    s.noteOutline({ xMin: 640, yMin: 20, xMax: 640, yMax: 45 }); // clipped away: off the image
    expect(s.row(2.02, 'align', null, null).outline).toBeNull();
    s.noteOutline({ xMin: 10, yMin: 20, xMax: 30, yMax: 45 });
    s.clearStep();
    const next = s.row(2.03, 'align', null, null);
    expect([next.update, next.nis, next.nisDim, next.outline, next.box]).toEqual([null, null, null, null, null]);
    expect(next.updates).toEqual([]);
  });
});
