// splitmix64 on two 32-bit halves (no BigInt: this runs inside hot loops and workers).
// Used to scramble seeds before they reach xoroshiro128+, whose first draws are
// nearly constant across small neighbouring seeds.

const MASK16 = 0xffff;

/** 32x32 -> low 64 bits of the product, as [hi, lo] unsigned. Writes into out. */
function mul64(aHi: number, aLo: number, bHi: number, bLo: number, out: Uint32Array): void {
  const a0 = aLo & MASK16, a1 = aLo >>> 16, a2 = aHi & MASK16, a3 = aHi >>> 16;
  const b0 = bLo & MASK16, b1 = bLo >>> 16, b2 = bHi & MASK16, b3 = bHi >>> 16;
  let c0 = a0 * b0;
  let c1 = (c0 >>> 16) + a0 * b1;
  let c2 = c1 >>> 16;
  c1 = (c1 & MASK16) + a1 * b0;
  c2 += c1 >>> 16;
  c2 += a0 * b2;
  let c3 = c2 >>> 16;
  c2 = (c2 & MASK16) + a1 * b1;
  c3 += c2 >>> 16;
  c2 = (c2 & MASK16) + a2 * b0;
  c3 += c2 >>> 16;
  c3 += a0 * b3 + a1 * b2 + a2 * b1 + a3 * b0;
  out[0] = (((c3 & MASK16) << 16) | (c2 & MASK16)) >>> 0;
  out[1] = (((c1 & MASK16) << 16) | (c0 & MASK16)) >>> 0;
}

function add64(aHi: number, aLo: number, bHi: number, bLo: number, out: Uint32Array): void {
  const lo = (aLo >>> 0) + (bLo >>> 0);
  out[1] = lo >>> 0;
  out[0] = ((aHi >>> 0) + (bHi >>> 0) + (lo > 0xffffffff ? 1 : 0)) >>> 0;
}

/**
 * One splitmix64 step (Steele, Lea, Flood 2014 constants).
 * `state` is [hi, lo]; it is advanced in place and the mixed output written to `out`.
 */
export function splitmix64(state: Uint32Array, out: Uint32Array): void {
  // state += 0x9E3779B97F4A7C15
  add64(state[0]!, state[1]!, 0x9e3779b9, 0x7f4a7c15, state);
  let hi = state[0]!, lo = state[1]!;
  // z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9
  let xHi = hi ^ (hi >>> 30);
  let xLo = lo ^ ((lo >>> 30) | (hi << 2));
  mul64(xHi, xLo, 0xbf58476d, 0x1ce4e5b9, out);
  hi = out[0]!; lo = out[1]!;
  // z = (z ^ (z >>> 27)) * 0x94D049BB133111EB
  xHi = hi ^ (hi >>> 27);
  xLo = lo ^ ((lo >>> 27) | (hi << 5));
  mul64(xHi, xLo, 0x94d049bb, 0x133111eb, out);
  hi = out[0]!; lo = out[1]!;
  // z ^ (z >>> 31)
  out[1] = (lo ^ ((lo >>> 31) | (hi << 1))) >>> 0;
  out[0] = (hi ^ (hi >>> 31)) >>> 0;
}
