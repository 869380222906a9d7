import { describe, expect, it } from 'vitest';
import { TruthPairing } from '../../../estimator/io/ros/TruthPairing.js';
import { expectAllClose } from '../../helpers/expectClose.js';

const sample = (t: number, p: number[], v: number[]) => Float64Array.from([t, ...p, ...v]);

function collect(maxGap = 0.1) {
  const rows: number[][] = [];
  const pairing = new TruthPairing(maxGap, (t, r, vC, vL) => rows.push([t, ...r, ...vC, ...vL]));
  return { rows, pairing };
}

describe('TruthPairing', () => {
  it('pairs same-time samples exactly, in whichever order they come', () => {
    const { rows, pairing } = collect();
    pairing.lander(sample(1, [1, 2, 3], [0.1, 0.2, 0.3]));
    pairing.carrier(sample(1, [11, 12, 13], [1, 2, 3]));
    pairing.carrier(sample(2, [21, 22, 23], [1, 2, 3]));
    pairing.lander(sample(2, [1, 1, 1], [0, 0, 0]));
    pairing.finish();
    expect(rows).toEqual([
      [1, 10, 10, 10, 1, 2, 3, 0.1, 0.2, 0.3],
      [2, 20, 21, 22, 1, 2, 3, 0, 0, 0],
    ]);
  });

  // Tolerance 1e-12: one linear interpolation of numbers near 10.
  it('interpolates the carrier linearly between its neighbours: x(t) = x0 + (t - t0)/(t1 - t0) (x1 - x0)', () => {
    const { rows, pairing } = collect();
    pairing.carrier(sample(0.0, [0, 0, 0], [1, 0, 0]));
    pairing.lander(sample(0.025, [0, 0, 0], [0, 0, 0]));
    pairing.carrier(sample(0.1, [10, 0, -1], [3, 0, 0]));
    expectAllClose(rows[0]!, [0.025, 2.5, 0, -0.25, 1.5, 0, 0, 0, 0, 0], { abs: 1e-12 }, 'row');
  });

  it('counts lander samples it cannot pair: before the first carrier sample, across a gap, after the last', () => {
    const { rows, pairing } = collect(0.05);
    pairing.lander(sample(0, [0, 0, 0], [0, 0, 0]));
    pairing.carrier(sample(0.01, [0, 0, 0], [0, 0, 0]));
    pairing.lander(sample(0.05, [0, 0, 0], [0, 0, 0]));
    pairing.carrier(sample(0.5, [0, 0, 0], [0, 0, 0]));
    pairing.lander(sample(0.6, [0, 0, 0], [0, 0, 0]));
    pairing.finish();
    expect(rows).toEqual([]);
    expect(pairing.counts).toEqual({ rows: 0, unpaired: 3 });
  });
});
