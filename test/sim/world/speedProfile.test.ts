import { describe, expect, it } from 'vitest';
import { SpeedProfileModel, type ProfileSample } from '../../../estimator/sim/world/speedProfile.js';
import { expectClose } from '../../helpers/expectClose.js';

const sample = (): ProfileSample => ({ s: 0, v: 0, a: 0 });

describe('SpeedProfileModel', () => {
  it('sample() of a linear ramp gives s = V t^2 / (2T) and v = V t / T (closed form, hand-derived)', () => {
    const model = new SpeedProfileModel(5, { rampTime: 10, variation: 0, variationPeriod: 0 });
    const out = model.sample(4, sample());
    expectClose(out.s, 4, { abs: 1e-12 }, 's'); // exact arithmetic up to rounding
    expectClose(out.v, 2, { abs: 1e-12 }, 'v');
    expectClose(out.a, 0.5, { abs: 1e-12 }, 'a');
    model.sample(30, out);
    expectClose(out.s, 25 + 5 * 20, { abs: 1e-12 }, 's after ramp = V T / 2 + V (t - T)');
  });

  it('sample() distance differentiates to the speed and speed to the acceleration (central differences)', () => {
    const model = new SpeedProfileModel(4, { rampTime: 6, variation: 1.5, variationPeriod: 7 });
    const a = sample(), b = sample(), mid = sample();
    const h = 1e-4;
    for (let t = 0.05; t < 40; t += 0.37) {
      if (Math.abs(t - 6) < 2 * h) continue; // acceleration steps at the ramp's end
      model.sample(t - h, a);
      model.sample(t + h, b);
      model.sample(t, mid);
      // central difference error ~ h^2 |s'''| / 6 ~ 1e-8; rounding ~ 1e-16 * s / h ~ 1e-10
      expectClose((b.s - a.s) / (2 * h), mid.v, { abs: 1e-7 }, `v at ${t}`);
      expectClose((b.v - a.v) / (2 * h), mid.a, { abs: 1e-7 }, `a at ${t}`);
    }
  });

  it('sample() is continuous in distance and speed across the end of the ramp', () => {
    const model = new SpeedProfileModel(3, { rampTime: 5, variation: 1, variationPeriod: 4 });
    const before = model.sample(5 - 1e-9, sample());
    const after = model.sample(5 + 1e-9, sample());
    expectClose(after.s, before.s, { abs: 1e-8 }, 's'); // step of 2e-9 s at ~4 m/s
    expectClose(after.v, before.v, { abs: 1e-8 }, 'v');
  });

  it('constructor rejects a variation larger than the cruise speed (the carrier would reverse)', () => {
    expect(() => new SpeedProfileModel(2, { rampTime: 0, variation: 3, variationPeriod: 5 })).toThrow(/carrier.profile.variation/);
  });
});
