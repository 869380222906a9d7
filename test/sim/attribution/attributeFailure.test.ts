import { describe, expect, it } from 'vitest';
import { attributeFailure, CAUSE_WINDOW } from '../../../estimator/sim/attribution/attributeFailure.js';
import type { FailureEvent, FailureEventName } from '../../../estimator/sim/attribution/FailureEvent.js';

const ev = (t: number, event: FailureEventName, value = 1): FailureEvent => ({ t, event, phase: 'descend', height: 3, value });

describe('attributeFailure', () => {
  it('gives a landed trial no cause, whatever happened', () => {
    expect(attributeFailure([ev(0, 'acquired'), ev(5, 'gust', 4), ev(6, 'funnel-exit')], 'landed', 12)).toEqual({ cause: null, causeChain: [] });
  });

  it('names the earliest trigger that a symptom follows, and chains everything after it', () => {
    const events = [ev(0.1, 'acquired', 0), ev(6, 'dropout-burst', 2), ev(6.8, 'funnel-exit', 0.9), ev(7.6, 'abort', 0), ev(9, 'acquired', 1)];
    const a = attributeFailure(events, 'aborted', 20);
    expect(a.cause).toBe('dropout-burst');
    expect(a.causeChain.map((e) => e.event)).toEqual(['dropout-burst', 'funnel-exit', 'abort', 'acquired']);
  });

  it('passes over a trigger with no consequence inside the window', () => {
    const events = [ev(0, 'acquired', 0), ev(2, 'gust', 3), ev(2 + CAUSE_WINDOW + 3, 'latency-spike', 0.6), ev(2 + CAUSE_WINDOW + 4, 'abort')];
    expect(attributeFailure(events, 'aborted', 60).cause).toBe('latency-spike');
  });

  it('says no single cause for two triggers of different kinds at one moment', () => {
    const events = [ev(0, 'acquired', 0), ev(6, 'gust', 3), ev(6.1, 'dropout-burst', 1), ev(7, 'funnel-exit')];
    const a = attributeFailure(events, 'off-pad', 9);
    expect(a.cause).toBe('no-single-cause');
    expect(a.causeChain[0]!.event).toBe('acquired'); // the whole deciding episode
  });

  it('says no single cause when the failure has no trigger (inside the noise)', () => {
    expect(attributeFailure([ev(0, 'acquired', 0), ev(11, 'funnel-exit', 0.7), ev(12, 'blind', 1.2)], 'off-pad', 13).cause).toBe('no-single-cause');
    expect(attributeFailure([], 'timed-out', 60)).toEqual({ cause: 'no-single-cause', causeChain: [] });
  });

  it('names a divergence that no trigger preceded', () => {
    expect(attributeFailure([ev(0, 'acquired', 0), ev(8, 'divergence'), ev(8.01, 'abort', 1)], 'diverged', 60).cause).toBe('divergence');
  });

  it('names a silent divergence that no trigger preceded, and a false box before one', () => {
    expect(attributeFailure([ev(0, 'acquired', 0), ev(8, 'silent-divergence', 1)], 'timed-out', 60).cause).toBe('silent-divergence');
    const events = [ev(0, 'acquired', 0), ev(0, 'false-box', 1), ev(0.2, 'gated-boxes', 3), ev(2, 'silent-divergence', 1)];
    expect(attributeFailure(events, 'timed-out', 60).causeChain.map((e) => e.event)).toEqual(['false-box', 'gated-boxes', 'silent-divergence']);
  });

  it('decides by the last episode that went wrong: a clean re-acquisition that ran out of time looks back', () => {
    const burstThenClean = [ev(0, 'acquired', 0), ev(7, 'dropout-burst', 3), ev(8.5, 'abort'), ev(10.1, 'acquired', 1)];
    expect(attributeFailure(burstThenClean, 'aborted', 20).cause).toBe('dropout-burst');
    const falseBoxAtReacquisition = [...burstThenClean.slice(0, 3), ev(10.1, 'acquired', 1), ev(10.1, 'false-box', 1), ev(10.2, 'gated-boxes', 30), ev(11.6, 'abort')];
    expect(attributeFailure(falseBoxAtReacquisition, 'aborted', 20).cause).toBe('false-box');
  });

  it('names a trigger just before the end of the last episode even with no symptom (a gust at touchdown)', () => {
    expect(attributeFailure([ev(0, 'acquired', 0), ev(11, 'gust', 9)], 'off-pad', 12.5).cause).toBe('gust');
  });
});
