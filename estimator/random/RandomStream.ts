// A seeded random stream: xoroshiro128+ (Blackman & Vigna), keyed by a tuple of integers.
// The generator is written out here on four 32-bit words so one step yields the full 64-bit
// output: its low word is exactly pure-rand's xoroshiro128plus next() (uniform() draws are
// the same numbers), its high word — the generator's strongest bits — feeds the normal
// deviates. Draws allocate nothing; state can be saved and restored for replay.
import { splitmix64 } from './splitmix64.js';

// Ziggurat tables for the standard normal, 256 layers (Marsaglia & Tsang 2000, "The Ziggurat
// Method for Generating Random Variables", J. Statistical Software 5(8): set-up routine zigset
// with their 256-layer constants r and v), built once in double precision. Layer 0 is the
// base strip (rectangle plus tail), layer 1 the top; layer i >= 1 spans x in [0, x_i] at
// heights [f(x_i), f(x_{i-1})], f(x) = exp(-x²/2). Kept in this module: the draw loop reads
// them on every call, and module-local constants stay cheap under every loader.
/** Right edge of the base rectangle, where the tail starts. */
export const ZIGGURAT_R = 3.6541528853610088;
/** Area of every layer (including the tail for the base strip). */
const LAYER_AREA = 4.92867323399e-3;
/** The signed 32-bit integer that scales a layer's width (x = j · W[i], |j| < 2³¹). */
const M1 = 2147483648;

/** Fast-accept thresholds: |j| < K[i] lies under the next layer up, no density test needed. */
const ZIGGURAT_K = new Float64Array(256);
/** Layer widths per integer unit: x = j · W[i]. */
const ZIGGURAT_W = new Float64Array(256);
/** f(x_i) = exp(-x_i²/2) at each layer's right edge (F[0] = 1, the density's top). */
const ZIGGURAT_F = new Float64Array(256);

{
  let dn = ZIGGURAT_R, tn = dn;
  const q = LAYER_AREA / Math.exp(-0.5 * dn * dn);
  ZIGGURAT_K[0] = (dn / q) * M1;
  ZIGGURAT_K[1] = 0;
  ZIGGURAT_W[0] = q / M1;
  ZIGGURAT_W[255] = dn / M1;
  ZIGGURAT_F[0] = 1;
  ZIGGURAT_F[255] = Math.exp(-0.5 * dn * dn);
  for (let i = 254; i >= 1; i--) {
    dn = Math.sqrt(-2 * Math.log(LAYER_AREA / dn + Math.exp(-0.5 * dn * dn)));
    ZIGGURAT_K[i + 1] = (dn / tn) * M1;
    tn = dn;
    ZIGGURAT_F[i] = Math.exp(-0.5 * dn * dn);
    ZIGGURAT_W[i] = dn / M1;
  }
}

/**
 * Saved stream state: four 32-bit words of xoroshiro128+ in pure-rand's order (high and low
 * word of s0, then of s1), plus a cached normal deviate (always null since normal deviates
 * come from the ziggurat; a state saved by the earlier polar method may still carry one).
 */
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
  // xoroshiro128+ state: s0 = (s01, s00), s1 = (s11, s10) as (high, low) signed 32-bit words
  private s01: number;
  private s00: number;
  private s11: number;
  private s10: number;
  /** High word of the last 64-bit output (signed). */
  private high = 0;
  private spareNormal: number | null = null;

  private constructor(words: readonly number[]) {
    this.s01 = words[0]! | 0;
    this.s00 = words[1]! | 0;
    this.s11 = words[2]! | 0;
    this.s10 = words[3]! | 0;
  }

  /**
   * A stream keyed by integers, e.g. `RandomStream.fromKey([seed, point, trial, streamId('detector')])`.
   * @example RandomStream.fromKey([42]).uniform() // same value on every machine
   */
  static fromKey(key: readonly number[]): RandomStream {
    return new RandomStream(wordsFromKey(key));
  }

  static fromState(state: RandomStreamState): RandomStream {
    if (state.words.length !== 4) throw new RangeError('random stream state needs four 32-bit words');
    const stream = new RandomStream(state.words);
    stream.spareNormal = state.spareNormal;
    return stream;
  }

  /**
   * A child stream keyed by 52 bits drawn from `parent` (advances the parent by one draw).
   * A static method, not a closure made per caller: optimized code that inlined a closure
   * created anew in each trial was thrown away at the next trial ("wrong call target").
   */
  static childOf(parent: RandomStream): RandomStream {
    return RandomStream.fromKey([Math.floor(parent.uniform() * 2 ** 52)]);
  }

  /** An independent child stream: same key plus one more element. */
  derive(key: readonly number[], name: string): RandomStream {
    return RandomStream.fromKey([...key, streamId(name)]);
  }

  saveState(): RandomStreamState {
    return { words: [this.s01, this.s00, this.s11, this.s10], spareNormal: this.spareNormal };
  }

  /**
   * One xoroshiro128+ step: out = s0 + s1 (64-bit); returns the low word (signed 32-bit) and
   * keeps the high word in this.high. State update per Blackman & Vigna (a = 24, b = 16, c = 37).
   */
  private next(): number {
    const s00 = this.s00, s01 = this.s01, s10 = this.s10, s11 = this.s11;
    const low = (s00 + s10) | 0;
    // carry out of the unsigned low-word sum, in 32-bit integer operations only
    const carry = ((s00 & s10) | ((s00 | s10) & ~low)) >>> 31;
    this.high = (s01 + s11 + carry) | 0;
    const a0 = s10 ^ s00, a1 = s11 ^ s01;
    this.s00 = (s00 << 24) ^ (s01 >>> 8) ^ a0 ^ (a0 << 16);
    this.s01 = (s01 << 24) ^ (s00 >>> 8) ^ a1 ^ ((a1 << 16) | (a0 >>> 16));
    this.s10 = (a1 << 5) ^ (a0 >>> 27);
    this.s11 = (a0 << 5) ^ (a1 >>> 27);
    return low;
  }

  /** Uniform on [0, 1) with 53 random bits. */
  uniform(): number {
    const a = this.next() >>> 5; // 27 bits
    const b = this.next() >>> 6; // 26 bits
    return (a * 67108864 + b) / 9007199254740992;
  }

  /**
   * Standard normal deviate by the ziggurat (Marsaglia & Tsang 2000, 256 layers; tables in
   * the tables above). One generator step per draw in about 99 % of draws: the layer index
   * comes from bits 8..15 of the low word and the signed abscissa from the high word, so the
   * two are independent (the fix Doornik 2005 proposed for the original's shared bits).
   * Rejections use uniform(); the tail beyond r uses Marsaglia's exponential method.
   */
  gaussian(): number {
    if (this.spareNormal !== null) return this.takeSpare();
    // the ~99 % fast path stays small so callers can inline it (no boxed return value)
    const i = (this.next() >>> 8) & 255;
    const j = this.high;
    if (Math.abs(j) < ZIGGURAT_K[i]!) return j * ZIGGURAT_W[i]!;
    return this.gaussianSlow(i, j);
  }

  /** The rest of the ziggurat loop for a draw (layer i, abscissa j) outside the fast region. */
  private gaussianSlow(i: number, j: number): number {
    for (;;) {
      const x = j * ZIGGURAT_W[i]!;
      if (i === 0) return this.tail(j < 0);
      // wedge: accept x when a uniform height in layer i lies under the density
      const fi = ZIGGURAT_F[i]!;
      if (fi + this.uniform() * (ZIGGURAT_F[i - 1]! - fi) < Math.exp(-0.5 * x * x)) return x;
      i = (this.next() >>> 8) & 255;
      j = this.high;
      if (Math.abs(j) < ZIGGURAT_K[i]!) return j * ZIGGURAT_W[i]!;
    }
  }

  private takeSpare(): number {
    const v = this.spareNormal!;
    this.spareNormal = null;
    return v;
  }

  /** A deviate from the normal tail beyond ZIGGURAT_R (Marsaglia 1964). */
  private tail(negative: boolean): number {
    let x = 0, y = 0;
    do {
      x = -Math.log(1 - this.uniform()) / ZIGGURAT_R;
      y = -Math.log(1 - this.uniform());
    } while (y + y < x * x);
    return negative ? -(ZIGGURAT_R + x) : ZIGGURAT_R + x;
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
