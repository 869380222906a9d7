import { describe, expect, it } from 'vitest';
import { DivergenceWatch, FAR_ERROR, FAR_TIME } from '../../estimator/sim/DivergenceWatch.js';

const truth = [0, 0, -5];
/** A confident 3 x 3 covariance (0.1 m sd) and an honest one (10 m sd). */
const confident = [0.01, 0, 0, 0, 0.01, 0, 0, 0, 0.01];
const honest = [100, 0, 0, 0, 100, 0, 0, 0, 100];
const off = (d: number) => [d, 0, -5];

describe('DivergenceWatch', () => {
  it('names an error past FAR_ERROR held for FAR_TIME with calm NIS a silent divergence, once per start', () => {
    const w = new DivergenceWatch();
    const dt = 0.01;
    let event = null;
    let at = NaN;
    for (let k = 0; k <= 100 && event === null; k++) {
      w.noteNis(1.2); // accepted boxes that look fine
      event = w.step(k * dt, off(FAR_ERROR + 1), confident, 3, truth);
      at = k * dt;
    }
    expect(event).toBe('silent-divergence');
    expect(at).toBeCloseTo(FAR_TIME, 9);
    expect(w.step(1.5, off(10), confident, 3, truth)).toBeNull(); // named once until the filter restarts
    w.reset();
    expect(w.step(2, off(10), confident, 3, truth)).toBeNull(); // a new episode starts its clock
  });

  it('calls it estimate-far-from-truth when the NIS during the episode is not calm, and forgets a short excursion', () => {
    const w = new DivergenceWatch();
    for (let k = 0; k < 30; k++) expect(w.step(k * 0.01, off(3), confident, 3, truth)).toBeNull();
    expect(w.step(0.3, off(0.1), confident, 3, truth)).toBeNull(); // back within FAR_ERROR: the episode ends
    let event = null;
    for (let k = 31; k < 120 && event === null; k++) {
      w.noteNis(40); // far above the chi-square 0.99 quantile of 3 dof
      event = w.step(k * 0.01, off(3), confident, 3, truth);
    }
    expect(event).toBe('estimate-far-from-truth');
  });

  it('calls a far estimate whose covariance grew honestly (a long outage) estimate-far-from-truth, not silent', () => {
    const w = new DivergenceWatch();
    let event = null;
    for (let k = 0; k < 100 && event === null; k++) event = w.step(k * 0.01, off(5), honest, 3, truth);
    expect(event).toBe('estimate-far-from-truth'); // NEES 0.25: far, but the filter says so itself
  });

  it('pause() ends a running episode unnamed (a blind descent only dead-reckons)', () => {
    const w = new DivergenceWatch();
    for (let k = 0; k < 40; k++) w.step(k * 0.01, off(3), confident, 3, truth);
    w.pause();
    expect(w.step(0.45, off(3), confident, 3, truth)).toBeNull();
  });
});
