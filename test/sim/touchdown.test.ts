import { describe, expect, it } from 'vitest';
import { judgeTouchdown } from '../../estimator/sim/touchdown.js';
import { expectClose } from '../helpers/expectClose.js';

const envelope = { padRadius: 0.5, maxClosingSpeed: 1, maxLateralSpeed: 0.5, maxTiltDeg: 15 };
const level = [1, 0, 0, 0];
/** Yaw by angle (rad) about world z. */
const yaw = (a: number) => [Math.cos(a / 2), 0, 0, Math.sin(a / 2)];
/** Roll by angle (rad) about x. */
const roll = (a: number) => [Math.cos(a / 2), Math.sin(a / 2), 0, 0];

describe('judgeTouchdown', () => {
  it('lands a slow, centred, level contact and reports its numbers', () => {
    const j = judgeTouchdown({ ...envelope, padRadius: 0.6 }, [10.3, 5.4, 1.5], [3.1, 0, -0.6], level, [10, 5, 1.5], [3, 0, 0], level, true);
    expect(j.outcome).toBe('landed');
    expectClose(j.missX, 0.3, { abs: 1e-12 }, 'missX (exact)');
    expectClose(j.missY, 0.4, { abs: 1e-12 }, 'missY (exact)');
    expectClose(j.missDistance, 0.5, { abs: 1e-12 }, '3-4-5 (exact)');
    expectClose(j.closingSpeed, 0.6, { abs: 1e-12 }, 'closing (exact)');
    expectClose(j.lateralSpeed, 0.1, { abs: 1e-12 }, 'lateral (exact)');
    expectClose(j.tiltDeg, 0, { abs: 1e-6 }, 'level');
  });

  it('measures the miss in the deck frame: x along travel, y left', () => {
    // deck heading north (yaw 90 deg): a lander 0.3 m east of the deck centre is 0.3 m to its right
    const j = judgeTouchdown(envelope, [0.3, 0.1, 0], [0, 0, 0], level, [0, 0, 0], [0, 0, 0], yaw(Math.PI / 2), true);
    expectClose(j.missX, 0.1, { abs: 1e-12 }, 'along travel (rotation round-off)');
    expectClose(j.missY, -0.3, { abs: 1e-12 }, 'right is -y (rotation round-off)');
  });

  it('calls fast or tilted contacts hard, wherever they are', () => {
    expect(judgeTouchdown(envelope, [0, 0, 0], [0, 0, -1.2], level, [0, 0, 0], [0, 0, 0], level, true).outcome).toBe('hard-contact');
    expect(judgeTouchdown(envelope, [0, 0, 0], [0.6, 0, -0.2], level, [0, 0, 0], [0, 0, 0], level, true).outcome).toBe('hard-contact');
    const tilted = judgeTouchdown(envelope, [0, 0, 0], [0, 0, -0.2], roll((20 * Math.PI) / 180), [0, 0, 0], [0, 0, 0], level, true);
    expect(tilted.outcome).toBe('hard-contact');
    expectClose(tilted.tiltDeg, 20, { abs: 1e-9 }, 'tilt (round-off)');
    // a deck pitched like the lander: no relative tilt
    expectClose(judgeTouchdown(envelope, [0, 0, 0], [0, 0, 0], roll(0.2), [0, 0, 0], [0, 0, 0], roll(0.2), true).tiltDeg, 0, { abs: 1e-6 }, 'relative tilt (acos round-off)');
  });

  it('calls gentle contacts outside the pad or beside the deck off-pad', () => {
    expect(judgeTouchdown(envelope, [0.6, 0, 0], [0, 0, -0.2], level, [0, 0, 0], [0, 0, 0], level, true).outcome).toBe('off-pad');
    expect(judgeTouchdown(envelope, [0.1, 0, 0], [0, 0, -0.2], level, [0, 0, 0], [0, 0, 0], level, false).outcome).toBe('off-pad');
  });
});
