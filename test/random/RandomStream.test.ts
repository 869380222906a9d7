import { describe, expect, it } from 'vitest';
import { xoroshiro128plusFromState } from 'pure-rand/generator/xoroshiro128plus';
import { RandomStream, streamId, ZIGGURAT_R } from '../../estimator/random/RandomStream.js';
import { chiSquareCdf, chiSquareQuantile } from '../../estimator/stats/chiSquare.js';
import { expectClose } from '../helpers/expectClose.js';

const N = 400_000;

function draws(stream: RandomStream, count: number): Float64Array {
  const out = new Float64Array(count);
  for (let i = 0; i < count; i++) out[i] = stream.gaussian();
  return out;
}

describe('RandomStream: the generator', () => {
  it('uniform() draws the same numbers as pure-rand xoroshiro128plus (two implementations of one generator)', () => {
    const stream = RandomStream.fromKey([7, 1, 2, streamId('check')]);
    const reference = xoroshiro128plusFromState(stream.saveState().words);
    const ours: number[] = [], theirs: number[] = [];
    for (let i = 0; i < 10_000; i++) {
      const a = reference.next() >>> 5, b = reference.next() >>> 6;
      theirs.push((a * 67108864 + b) / 9007199254740992);
      ours.push(stream.uniform());
    }
    expect(ours).toEqual(theirs);
  });

  it('same key, same draws; a saved state replays the rest of the stream exactly', () => {
    const a = RandomStream.fromKey([42, 3]), b = RandomStream.fromKey([42, 3]);
    for (let i = 0; i < 1000; i++) expect(a.gaussian()).toBe(b.gaussian());
    const saved = a.saveState();
    const expected = [a.gaussian(), a.uniform(), a.gaussian(), a.exponential(2)];
    const replay = RandomStream.fromState(saved);
    expect([replay.gaussian(), replay.uniform(), replay.gaussian(), replay.exponential(2)]).toEqual(expected);
  });

  it('a state saved with a cached normal deviate (earlier polar method) returns that deviate first', () => {
    const base = RandomStream.fromKey([5]).saveState();
    const restored = RandomStream.fromState({ words: base.words, spareNormal: 0.625 });
    expect(restored.gaussian()).toBe(0.625);
    expect(restored.gaussian()).toBe(RandomStream.fromState(base).gaussian());
  });
});

describe('RandomStream.gaussian (ziggurat, Marsaglia & Tsang 2000) is standard normal', () => {
  const x = draws(RandomStream.fromKey([2026, streamId('normal-test')]), N);

  it('has mean 0 and variance 1 (tolerance: 5 standard errors, sqrt(1/N) and sqrt(2/N))', () => {
    let sum = 0, squares = 0, fourth = 0;
    for (const v of x) {
      sum += v;
      squares += v * v;
      fourth += v * v * v * v;
    }
    expectClose(sum / N, 0, { abs: 5 / Math.sqrt(N) }, 'mean');
    expectClose(squares / N, 1, { abs: 5 * Math.sqrt(2 / N) }, 'variance');
    // E X⁴ = 3, Var X⁴ = 105 - 9 = 96 (normal moments, common practice)
    expectClose(fourth / N, 3, { abs: 5 * Math.sqrt(96 / N) }, 'fourth moment');
  });

  it('fills |x| bins as the chi-square(1) law of x² says, both signs alike (goodness of fit at p = 0.001)', () => {
    // P(|X| <= a) = P(X² <= a²) = chiSquareCdf(a², 1) for X ~ N(0, 1) (definition of chi-square(1)).
    // Edges include the ziggurat's own seams: the base-strip edge r and the tail beyond it.
    const edges = [0, 0.1, 0.25, 0.5, 0.75, 1, 1.25, 1.5, 1.75, 2, 2.25, 2.5, 2.75, 3, 3.25, 3.5, ZIGGURAT_R, 4, 4.5, Infinity];
    const bins = edges.length - 1;
    const counts = new Float64Array(2 * bins);
    for (const v of x) {
      const a = Math.abs(v);
      let b = 0;
      while (a >= edges[b + 1]!) b++;
      counts[(v < 0 ? bins : 0) + b]!++;
    }
    let statistic = 0;
    for (let side = 0; side < 2; side++) {
      for (let b = 0; b < bins; b++) {
        const lo = chiSquareCdf(edges[b]! * edges[b]!, 1);
        const hi = edges[b + 1] === Infinity ? 1 : chiSquareCdf(edges[b + 1]! * edges[b + 1]!, 1);
        const expected = (N * (hi - lo)) / 2;
        statistic += (counts[side * bins + b]! - expected) ** 2 / expected;
      }
    }
    expect(statistic).toBeLessThan(chiSquareQuantile(0.999, 2 * bins - 1));
  });

  it('draws the tail beyond r = 3.654 at its normal rate (tolerance: 5 Poisson standard deviations)', () => {
    let tail = 0;
    for (const v of x) if (Math.abs(v) > ZIGGURAT_R) tail++;
    const expected = N * (1 - chiSquareCdf(ZIGGURAT_R * ZIGGURAT_R, 1));
    expectClose(tail, expected, { abs: 5 * Math.sqrt(expected) }, 'draws beyond r');
  });

  it('gives uncorrelated successive draws (lag-1 and lag-2 correlation within 5/sqrt(N))', () => {
    for (const lag of [1, 2]) {
      let s = 0;
      for (let i = lag; i < N; i++) s += x[i]! * x[i - lag]!;
      expectClose(s / (N - lag), 0, { abs: 5 / Math.sqrt(N) }, `lag ${lag}`);
    }
  });
});
