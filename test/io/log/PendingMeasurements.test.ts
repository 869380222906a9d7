import { describe, expect, it } from 'vitest';
import { PendingMeasurements, PENDING_BOX, PENDING_ODOMETRY } from '../../../estimator/io/log/PendingMeasurements.js';

describe('PendingMeasurements', () => {
  it('hands measurements out in time order, equal times in arrival order', () => {
    const p = new PendingMeasurements(8);
    p.push(PENDING_BOX, 0.3, [1, 2, 3, 4], 'boxes');
    p.push(PENDING_ODOMETRY, 0.1, [5, 6, 7], 'odometry');
    p.push(PENDING_BOX, 0.3, [9, 9, 9, 9], 'boxes');
    p.push(PENDING_ODOMETRY, 0.2, [8, 8, 8], 'odometry');
    const out: [number, number, number][] = [];
    while (p.size > 0) {
      out.push([p.peekTime(), p.peekKind(), p.peekData()[0]!]);
      p.pop();
    }
    expect(out).toEqual([[0.1, PENDING_ODOMETRY, 5], [0.2, PENDING_ODOMETRY, 8], [0.3, PENDING_BOX, 1], [0.3, PENDING_BOX, 9]]);
  });

  it('refuses when full, tallies refusals by stream and reason, and drains by stream', () => {
    const p = new PendingMeasurements(2);
    expect(p.push(PENDING_BOX, 1, [0, 0, 1, 1], 'boxes')).toBe(true);
    expect(p.push(PENDING_BOX, 2, [0, 0, 1, 1], 'boxes')).toBe(true);
    expect(p.push(PENDING_ODOMETRY, 3, [0, 0, 0], 'odometry')).toBe(false);
    p.markOutcome(false, 'outside-image');
    p.pop();
    expect(p.refusedCounts()).toEqual(new Map([['boxes', { 'outside-image': 1 }]]));
    expect(p.drain()).toEqual(new Map([['boxes', 1]]));
    expect(p.size).toBe(0);
  });
});
