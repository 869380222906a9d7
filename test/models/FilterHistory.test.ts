import { describe, expect, it } from 'vitest';
import { EVENT_DATA, EVENTS_PER_STEP, FilterHistory } from '../../estimator/models/FilterHistory.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { rotationMatrixFromQuat } from '../../estimator/frames/rotationMatrixFromQuat.js';

describe('FilterHistory', () => {
  it('keeps the newest steps of a ring and finds the step at or before a time', () => {
    const h = new FilterHistory(2, 4);
    // state [x, P] of n = 2: x = [k, -k], P = [[k, 0], [0, k]]
    for (let k = 0; k < 6; k++) h.push(k * 0.1, [k, 0, 0], [1, 0, 0, 0], Float64Array.of(k, -k, k, 0, 0, k));
    expect(h.length).toBe(4);
    expect(h.time[h.slot(0)]).toBeCloseTo(0.5, 15);
    expect(h.time[h.slot(3)]).toBeCloseTo(0.2, 15);
    expect(h.ageAtOrBefore(0.35)).toBe(2);
    expect(h.ageAtOrBefore(0.1)).toBe(-1);
    const state = new Float64Array(6);
    h.restore(h.slot(1), state);
    expect(Array.from(state.subarray(0, 2))).toEqual([4, -4]);
  });

  it('keeps events of a step in time order and refuses more than EVENTS_PER_STEP', () => {
    const h = new FilterHistory(1, 2);
    const slot = h.push(1, [0, 0, 0], [1, 0, 0, 0], Float64Array.of(0, 1));
    expect(h.addEvent(slot, 1, 0.98, 1, 2, 3)).toBe(true);
    expect(h.addEvent(slot, 3, 0.95, 4, 5, 6)).toBe(true);
    expect(Array.from(h.eventTime.slice(slot * EVENTS_PER_STEP, slot * EVENTS_PER_STEP + 2))).toEqual([0.95, 0.98]);
    expect(h.eventData[EVENT_DATA * slot * EVENTS_PER_STEP]).toBe(4);
    for (let k = 2; k < EVENTS_PER_STEP; k++) expect(h.addEvent(slot, 1, 0.99, 0, 0, 0)).toBe(true);
    expect(h.isFull(slot)).toBe(true);
    expect(h.addEvent(slot, 1, 0.99, 0, 0, 0)).toBe(false);
  });

  it('stores the R_wb of each step with its attitude, so a re-propagation needs no quaternion work', () => {
    const h = new FilterHistory(1, 3);
    const q = quatFromEulerDeg(5, -10, 120);
    const slot = h.push(0.01, [0, 0, 9.8], q, Float64Array.of(0, 1));
    expect(Array.from(h.rotationOf(slot))).toEqual(Array.from(rotationMatrixFromQuat(q)));
    const unknown = h.push(0.02, [0, 0, 9.8], [Number.NaN, Number.NaN, Number.NaN, Number.NaN], Float64Array.of(0, 1));
    expect(h.rotationOf(unknown).every(Number.isNaN)).toBe(true);
  });

  it('saves over a slot and restores the state [x, P] as it was saved', () => {
    const h = new FilterHistory(2, 3);
    const state = Float64Array.of(1, 2, 10, 11, 12, 13); // x = [1, 2], P = [[10, 11], [12, 13]]
    const slot = h.push(0.01, [0, 0, 9.8], [1, 0, 0, 0], state);
    const back = new Float64Array(6);
    h.restore(slot, back);
    expect(Array.from(back)).toEqual([1, 2, 10, 11, 12, 13]);
    h.save(slot, Float64Array.of(3, 4, 20, 21, 22, 23));
    h.restore(slot, back);
    expect(Array.from(back)).toEqual([3, 4, 20, 21, 22, 23]);
  });
});
