import { describe, expect, it } from 'vitest';
import { judgeTouchdown, type ContactGeometry } from '../../estimator/sim/touchdown.js';
import { expectClose } from '../helpers/expectClose.js';

const envelope = { padRadius: 0.5, maxClosingSpeed: 1, maxLateralSpeed: 0.5, maxTiltDeg: 15 };
const contact = (over: Partial<ContactGeometry>): ContactGeometry => ({ along: 0, across: 0, onDeck: true, closingSpeed: 0.5, lateralSpeed: 0.1, tilt: 0, ...over });

describe('judgeTouchdown', () => {
  it('lands a slow, centred, level contact and reports its numbers', () => {
    const j = judgeTouchdown(envelope, contact({ along: 0.3, across: -0.2, closingSpeed: 0.6, lateralSpeed: 0.1, tilt: 0.1 }));
    expect(j.outcome).toBe('landed');
    expect([j.missX, j.missY, j.closingSpeed, j.lateralSpeed]).toEqual([0.3, -0.2, 0.6, 0.1]);
    expectClose(j.missDistance, Math.sqrt(0.13), { rel: 1e-15 }, 'hypot (round-off)');
    expectClose(j.tiltDeg, 5.729577951308232, { rel: 1e-15 }, '0.1 rad in deg (round-off)');
  });

  it('calls fast or tilted contacts on the deck hard', () => {
    expect(judgeTouchdown(envelope, contact({ closingSpeed: 1.01 })).outcome).toBe('hard-contact');
    expect(judgeTouchdown(envelope, contact({ lateralSpeed: 0.6 })).outcome).toBe('hard-contact');
    expect(judgeTouchdown(envelope, contact({ tilt: (16 * Math.PI) / 180 })).outcome).toBe('hard-contact');
  });

  it('calls any contact off the carrier off-carrier, however gentle or hard (the ground, past the deck edge)', () => {
    expect(judgeTouchdown(envelope, contact({ along: 3, onDeck: false, closingSpeed: 2 })).outcome).toBe('off-carrier');
    expect(judgeTouchdown(envelope, contact({ along: 0.1, onDeck: false })).outcome).toBe('off-carrier');
    const far = judgeTouchdown(envelope, contact({ along: 12.7, across: 0.4, onDeck: false }));
    expect([far.outcome, far.missX, far.missY]).toEqual(['off-carrier', 12.7, 0.4]); // the miss is still reported
  });

  it('calls gentle contacts on the deck outside the pad off-pad', () => {
    expect(judgeTouchdown(envelope, contact({ along: 0.4, across: 0.31 })).outcome).toBe('off-pad');
    expect(judgeTouchdown(envelope, contact({ along: 0.4, across: 0.29 })).outcome).toBe('landed');
  });
});
