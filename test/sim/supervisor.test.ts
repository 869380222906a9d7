import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import type { HorizontalGuidance } from '../../estimator/sim/guidance.js';
import { LandingSupervisor, type SupervisorInput } from '../../estimator/sim/supervisor.js';
import { expectClose } from '../helpers/expectClose.js';

const s = defaultScenario();
const guidanceSpec = { ...s.guidance, trailHeight: 6, alignRadius: 0.4, alignTime: 1, descentRate: 0.5, funnelBase: 0.2, funnelSlope: 0.1, lostTimeout: 1, flareHeight: 0.3 };

/** A guidance stub that records resets and commands zero. */
class Still implements HorizontalGuidance {
  resets = 0;
  reset(): void { this.resets++; }
  command(_e: unknown, _dt: number, out: Float64Array): void { out[0] = 0; out[1] = 0; }
}

function input(over: Partial<SupervisorInput>): SupervisorInput {
  return { rx: 0, ry: 0, vcx: 0, vcy: 0, vlx: 0, vly: 0, acx: 0, acy: 0, valid: true, height: 6, vcz: 0, unseenFor: 0, lastSeen: 0, diverged: false, blind: false, confirmed: true, ...over };
}

describe('LandingSupervisor', () => {
  it('walks acquire -> trail -> align -> descend -> touchdown on a steady estimate', () => {
    const sup = new LandingSupervisor(guidanceSpec, s.lander, new Still());
    const out = Float64Array.of(3, 1, 0.5);
    expect(sup.step(0, 0.01, input({ valid: false }), out)).toBe('acquire');
    expect(Array.from(out)).toEqual([3, 1, 0]); // no estimate: last horizontal command kept, height held
    expect(sup.step(0.01, 0.01, input({ rx: 1 }), out)).toBe('trail');
    expect(sup.step(0.02, 0.01, input({ rx: 0.1 }), out)).toBe('align');
    expect(sup.step(0.5, 0.01, input({ rx: 0.1 }), out)).toBe('align');
    expect(sup.step(1.03, 0.01, input({ rx: 0.1 }), out)).toBe('descend');
    expectClose(out[2]!, 0, { abs: 1e-12 }, 'the switching step still holds height (exact)');
    expect(sup.step(1.04, 0.01, input({ rx: 0.1 }), out)).toBe('descend');
    expectClose(out[2]!, -0.5, { abs: 1e-12 }, 'descent rate inside the funnel (exact)');
    expect(sup.step(1.04, 0.01, input({ rx: 0.1, height: 0.2, vcz: 0.3 }), out)).toBe('touchdown');
    expectClose(out[2]!, 0.3 - 0.5, { abs: 1e-12 }, 'heave fed forward (exact)');
  });

  it('holds trail height with a proportional climb at most 1 m/s, plus heave, within maxVerticalSpeed', () => {
    const sup = new LandingSupervisor(guidanceSpec, { ...s.lander, maxVerticalSpeed: 1.2 }, new Still());
    const out = new Float64Array(3);
    sup.step(0, 0.01, input({ rx: 2, height: 5.5 }), out);
    expectClose(out[2]!, 0.5 * 0.5, { abs: 1e-12 }, 'gain 0.5/s (exact)');
    sup.step(0.01, 0.01, input({ rx: 2, height: 1 }), out);
    expectClose(out[2]!, 1, { abs: 1e-12 }, 'height rate limit (exact)');
    sup.step(0.02, 0.01, input({ rx: 2, height: 1, vcz: 0.5 }), out);
    expectClose(out[2]!, 1.2, { abs: 1e-12 }, 'maxVerticalSpeed (exact)');
    sup.step(0.03, 0.01, input({ rx: 2, height: 9, vcz: 0.3 }), out);
    expectClose(out[2]!, 0.3 - 1, { abs: 1e-12 }, 'down at the rate limit, heave fed forward (exact)');
  });

  it('descends inside the funnel, slows to a hold at twice its width and climbs from three times', () => {
    const sup = new LandingSupervisor(guidanceSpec, s.lander, new Still());
    const out = new Float64Array(3);
    sup.step(0, 0.01, input({}), out);
    sup.step(0.01, 0.01, input({}), out);
    sup.step(1.2, 0.01, input({}), out);
    expect(sup.phase).toBe('descend');
    // at h = 3 the funnel is 0.2 + 0.1 * 3 = 0.5 m
    sup.step(1.21, 0.01, input({ rx: 0.45, height: 3 }), out);
    expectClose(out[2]!, -0.5, { abs: 1e-12 }, 'inside: descend (exact)');
    sup.step(1.22, 0.01, input({ rx: 0.75, height: 3 }), out);
    expectClose(out[2]!, -0.25, { abs: 1e-12 }, 'half way to 2 funnel: half rate (exact)');
    sup.step(1.23, 0.01, input({ rx: 1, height: 3 }), out);
    expectClose(out[2]!, 0, { abs: 1e-12 }, '2 funnel: hold (exact)');
    sup.step(1.24, 0.01, input({ rx: 2, height: 3 }), out);
    expectClose(out[2]!, 0.5, { abs: 1e-12 }, 'beyond 3 funnel: climb (exact)');
    sup.step(1.25, 0.01, input({ rx: 2, height: 6.5 }), out);
    expectClose(out[2]!, 0, { abs: 1e-12 }, 'no climb above the trailing height (exact)');
    expect(sup.phase).toBe('descend');
  });

  it('aborts when the target is lost or the filter diverges, and re-acquires on a fresh box', () => {
    const guidance = new Still();
    const sup = new LandingSupervisor(guidanceSpec, s.lander, guidance);
    const out = new Float64Array(3);
    sup.step(0, 0.01, input({}), out);
    sup.step(0.01, 0.01, input({ rx: 2 }), out);
    expect(sup.phase).toBe('trail');
    expect(sup.step(2, 0.01, input({ rx: 2, unseenFor: 1.5, lastSeen: 0.5 }), out)).toBe('acquire');
    expect(sup.aborts).toBe(1);
    expect(sup.lastAbort).toBe('target-lost');
    expect(guidance.resets).toBe(1);
    // a box from before the abort does not re-acquire; a new one does
    expect(sup.step(2.1, 0.01, input({ rx: 2, unseenFor: 0.5, lastSeen: 1.6, height: 4 }), out)).toBe('acquire');
    expect(out[2]!).toBeGreaterThan(0); // climbing back to the trailing height
    expect(sup.step(2.2, 0.01, input({ rx: 2, unseenFor: 0, lastSeen: 2.2 }), out)).toBe('trail');
    expect(sup.step(2.3, 0.01, input({ rx: 2, diverged: true }), out)).toBe('acquire');
    expect(sup.lastAbort).toBe('diverged');
    expect(sup.aborts).toBe(2);
  });

  it('keeps descending on the estimate below the blind height when the target overflows the image', () => {
    const sup = new LandingSupervisor(guidanceSpec, s.lander, new Still(), 2);
    const out = new Float64Array(3);
    sup.step(0, 0.01, input({}), out);
    sup.step(0.01, 0.01, input({}), out);
    sup.step(1.2, 0.01, input({}), out);
    expect(sup.step(3, 0.01, input({ height: 1.5, unseenFor: 1.8 }), out)).toBe('descend');
    expectClose(out[2]!, -0.75, { abs: 1e-12 }, 'still descending, 1.5x faster, blind (exact)');
    expect(sup.step(3.1, 0.01, input({ height: 2.5, unseenFor: 1.9 }), out)).toBe('acquire');
    expect(sup.aborts).toBe(1);
  });

  it('keeps descending when the predicted outline leaves the image (input.blind), at any height', () => {
    const sup = new LandingSupervisor(guidanceSpec, s.lander, new Still());
    const out = new Float64Array(3);
    sup.step(0, 0.01, input({}), out);
    sup.step(0.01, 0.01, input({}), out);
    sup.step(1.2, 0.01, input({}), out);
    expect(sup.step(3, 0.01, input({ height: 3.5, unseenFor: 1.8, blind: true }), out)).toBe('descend');
    expectClose(out[2]!, -0.75, { abs: 1e-12 }, '1.5x faster while blind (exact)');
    expect(sup.step(3.1, 0.01, input({ height: 3.5, unseenFor: 1.9, blind: false }), out)).toBe('acquire'); // outline back in view, no box: lost
    expect(sup.lastAbort).toBe('target-lost');
  });

  it('stays in acquire on a start its successors have not confirmed (a lone box may be false)', () => {
    const sup = new LandingSupervisor(guidanceSpec, s.lander, new Still());
    const out = new Float64Array(3);
    expect(sup.step(0, 0.01, input({ confirmed: false }), out)).toBe('acquire');
    expect(sup.step(0.5, 0.01, input({ confirmed: false }), out)).toBe('acquire');
    expect(sup.step(0.51, 0.01, input({ confirmed: true }), out)).not.toBe('acquire'); // trail, and inside alignRadius at once: align
  });

  it('never aborts once committed to touchdown', () => {
    const sup = new LandingSupervisor(guidanceSpec, s.lander, new Still());
    const out = new Float64Array(3);
    sup.step(0, 0.01, input({}), out);
    sup.step(0.01, 0.01, input({}), out);
    sup.step(1.2, 0.01, input({}), out);
    sup.step(1.21, 0.01, input({ height: 0.1 }), out);
    expect(sup.phase).toBe('touchdown');
    expect(sup.step(5, 0.01, input({ height: 0.1, unseenFor: 3 }), out)).toBe('touchdown');
    expect(sup.aborts).toBe(0);
  });
});
