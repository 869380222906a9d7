// A seeded random stream: xoroshiro128+ from pure-rand, keyed by a tuple of integers.
// next*/gaussian allocate nothing; state can be saved and restored for replay.
import { xoroshiro128plusFromState } from 'pure-rand/generator/xoroshiro128plus';
import { splitmix64 } from './splitmix64.js';

type Generator = ReturnType<typeof xoroshiro128plusFromState>;

/** Saved stream state: four 32-bit words of xoroshiro128+ plus a cached normal deviate. */
export interface RandomStreamState {
  words: [number, number, number, number];
  spareNormal: number | null;
}

const TWO_POW_32 = 4294967296;

/**
 * Derive the 128-bit generator state from a key tuple (e.g. master seed, sweep point,
 * trial, stream name hash). Each key element is folded through splitmix64, so keys that
 * differ in any element give unrelated streams, whatever their magnitude.
 */
function wordsFromKey(key: readonly number[]): [number, number, number, number] {
  const state = new Uint32Array(2);
  const out = new Uint32Array(2);
  for (const k of key) {
    if (!Number.isInteger(k)) throw new RangeError(`random stream key must be integers, got ${k}`);
    const hi = Math.floor(k / TWO_POW_32) >>> 0;
    const lo = (k >>> 0) ^ (k < 0 ? 0x80000000 : 0);
    state[0] = (state[0]! ^ hi) >>> 0;
    state[1] = (state[1]! ^ lo) >>> 0;
    splitmix64(state, out);
    state[0] = out[0]!;
    state[1] = out[1]!;
  }
  const words: [number, number, number, number] = [0, 0, 0, 0];
  for (let i = 0; i < 4; i += 2) {
    splitmix64(state, out);
    words[i] = out[0]! | 0;
    words[i + 1] = out[1]! | 0;
  }
  if ((words[0] | words[1] | words[2] | words[3]) === 0) words[3] = 1; // all-zero state is absorbing
  return words;
}

/** Stable 32-bit hash of a stream name (FNV-1a), so streams can be keyed by words. */
export function streamId(name: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < name.length; i++) {
    h ^= name.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

export class RandomStream {
  private generator: Generator;
  private spareNormal: number | null = null;

  private constructor(generator: Generator) {
    this.generator = generator;
  }

  /**
   * A stream keyed by integers, e.g. `RandomStream.fromKey([seed, point, trial, streamId('detector')])`.
   * @example RandomStream.fromKey([42]).uniform() // same value on every machine
   */
  static fromKey(key: readonly number[]): RandomStream {
    return new RandomStream(xoroshiro128plusFromState(wordsFromKey(key)));
  }

  static fromState(state: RandomStreamState): RandomStream {
    const stream = new RandomStream(xoroshiro128plusFromState(state.words));
    stream.spareNormal = state.spareNormal;
    return stream;
  }

  /** An independent child stream: same key plus one more element. */
  derive(key: readonly number[], name: string): RandomStream {
    return RandomStream.fromKey([...key, streamId(name)]);
  }

  saveState(): RandomStreamState {
    const s = this.generator.getState() as number[];
    return { words: [s[0]!, s[1]!, s[2]!, s[3]!], spareNormal: this.spareNormal };
  }

  /** Uniform on [0, 1) with 53 random bits. */
  uniform(): number {
    const a = this.generator.next() >>> 5; // 27 bits
    const b = this.generator.next() >>> 6; // 26 bits
    return (a * 67108864 + b) / 9007199254740992;
  }

  /** Standard normal deviate (Marsaglia polar method; caches the second value). */
  gaussian(): number {
    if (this.spareNormal !== null) {
      const v = this.spareNormal;
      this.spareNormal = null;
      return v;
    }
    let u = 0, v = 0, s = 0;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const m = Math.sqrt((-2 * Math.log(s)) / s);
    this.spareNormal = v * m;
    return u * m;
  }

  /** Normal with mean and standard deviation. */
  normal(mean: number, sigma: number): number {
    return mean + sigma * this.gaussian();
  }

  /** Exponential with the given rate (events per unit). */
  exponential(rate: number): number {
    return -Math.log(1 - this.uniform()) / rate;
  }

  /** True with probability p. */
  bernoulli(p: number): boolean {
    return this.uniform() < p;
  }

  /** Integer uniform on [0, n). */
  integer(n: number): number {
    return Math.floor(this.uniform() * n);
  }
}
