import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { GilbertElliott, gilbertElliottLossRate, gilbertElliottMeanBurst } from '../../../estimator/sim/world/gilbertElliott.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('gilbertElliott closed forms', () => {
  it('p = 0.05, r = 0.5 gives loss 0.0909 and mean burst 2 (Gilbert 1960, BSTJ 39; Elliott 1963, BSTJ 42 [volume numbers from memory])', () => {
    expectClose(gilbertElliottLossRate(0.05, 0.5), 0.0909, { abs: 5e-5 }, 'loss rate'); // reference printed to 4 decimals
    expectClose(gilbertElliottMeanBurst(0.5), 2, { rel: 1e-15 }, 'mean burst');
  });
});

describe('GilbertElliott', () => {
  for (const [p, r] of [[0.05, 0.5], [0.02, 0.2]] as const) {
    it(`lost() over 400 000 seeded frames matches p/(p+r) and 1/r for p = ${p}, r = ${r} (Gilbert 1960; Elliott 1963)`, () => {
      const channel = new GilbertElliott(p, r, RandomStream.fromKey([2026, 3, 1]));
      const N = 400_000;
      let lost = 0, bursts = 0, previous = false;
      for (let i = 0; i < N; i++) {
        const l = channel.lost();
        if (l) lost++;
        if (l && !previous) bursts++;
        previous = l;
      }
      // Loss-rate sd for a two-state chain: sqrt(pi(1-pi)/N * (1+lambda)/(1-lambda)), lambda = 1-p-r:
      // p=0.05,r=0.5: 0.00074; p=0.02,r=0.2: 0.0013. Tolerance about 4 sd.
      const lossTolerance = p === 0.05 ? 0.003 : 0.0055;
      expectClose(lost / N, gilbertElliottLossRate(p, r), { abs: lossTolerance }, 'loss rate');
      // Mean burst from ~N pi r bursts of geometric length (sd of the mean = sqrt(1-r)/r / sqrt(bursts)):
      // 1/r = 2: 0.0105 (18 000 bursts); 1/r = 5: 0.052 (7 300 bursts). Tolerance about 4 sd.
      expectClose(lost / bursts, gilbertElliottMeanBurst(r), { abs: p === 0.05 ? 0.045 : 0.22 }, 'mean burst');
    });
  }

  it('rejects probabilities outside [0, 1] by name', () => {
    expect(() => new GilbertElliott(1.5, 0.5, RandomStream.fromKey([1]))).toThrow(/enter must lie in \[0, 1\], got 1.5/);
    expect(() => new GilbertElliott(0.1, 0, RandomStream.fromKey([1]))).toThrow(/exit must lie in \(0, 1\]/);
  });
});
