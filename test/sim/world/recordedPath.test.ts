import { describe, expect, it } from 'vitest';
import { RecordedPath, type RecordedSample } from '../../../estimator/sim/world/recordedPath.js';
import { expectClose } from '../../helpers/expectClose.js';

const sample = (): RecordedSample => ({ position: new Float64Array(3), velocity: new Float64Array(3), acceleration: new Float64Array(3), heading: 0 });

describe('RecordedPath', () => {
  it('sample() reproduces a quadratic in the interior exactly (central-difference tangents are exact for quadratics)', () => {
    // x = t^2 on t = 0..6 (uniform rows): Hermite with exact slopes 2 t reproduces t^2 between interior knots
    const rows = Array.from({ length: 7 }, (_, i) => [i, i * i, 0, 0]);
    const path = new RecordedPath(rows);
    const out = path.sample(2.5, sample());
    expectClose(out.position[0]!, 6.25, { abs: 1e-12 }, 'x');
    expectClose(out.velocity[0]!, 5, { abs: 1e-12 }, 'v');
    expectClose(out.acceleration[0]!, 2, { abs: 1e-12 }, 'a');
  });

  it('sample() velocity is the derivative of its position (central differences)', () => {
    const rows = [[0, 0, 0, 0], [1, 1, 0.5, 0], [2.5, 3, 2, 0.2], [3, 3.5, 3, 0.1], [5, 4, 5, 0]];
    const path = new RecordedPath(rows);
    const a = sample(), b = sample(), mid = sample();
    const h = 1e-6;
    for (const t of [0.3, 1.7, 2.8, 4.1]) {
      path.sample(t - h, a); path.sample(t + h, b); path.sample(t, mid);
      // cubic within an interval: central-difference truncation ~ h^2 |p'''| ~ 1e-12; rounding ~ 1e-10
      for (let k = 0; k < 3; k++) expectClose((b.position[k]! - a.position[k]!) / (2 * h), mid.velocity[k]!, { abs: 1e-8 }, `v[${k}] at ${t}`);
    }
  });

  it('sample() holds still, facing the last direction of travel, outside the recording', () => {
    const path = new RecordedPath([[100, 0, 0, 0], [101, 0, 0, 0], [102, 0, 2, 0]]);
    const out = path.sample(-5, sample());
    expect(Array.from(out.velocity)).toEqual([0, 0, 0]);
    expectClose(out.heading, Math.PI / 2, { abs: 1e-15 }, 'faces its first move while still');
    path.sample(10, out);
    expect(Array.from(out.position)).toEqual([0, 2, 0]);
    expect(path.duration).toBe(2);
  });

  it('rejects short, non-numeric and unordered recordings by row', () => {
    expect(() => new RecordedPath([[0, 0, 0, 0]], 'track.csv')).toThrow(/track.csv: a recorded path needs at least 2 rows/);
    expect(() => new RecordedPath([[0, 0, 0, 0], [1, Number.NaN, 0, 0]], 'track.csv')).toThrow(/track.csv row 2: expected four finite numbers/);
    expect(() => new RecordedPath([[0, 0, 0, 0], [1, 0, 0, 0], [0.5, 0, 0, 0]])).toThrow(/row 3: time must increase strictly/);
  });
});
