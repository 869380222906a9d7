// Poisson-distributed counts from a seeded stream (false boxes per frame). Allocation-free.
import type { RandomStream } from '../../random/RandomStream.js';

/**
 * Count with mean mu by Knuth's product of uniforms: the number of uniforms whose running
 * product stays above e^-mu. Cost grows with mu; meant for the small means of one frame.
 * mu <= 0 (or NaN) gives 0 and draws nothing.
 */
export function poissonCount(stream: RandomStream, mu: number): number {
  if (!(mu > 0)) return 0;
  const limit = Math.exp(-mu);
  let k = 0;
  let p = stream.uniform();
  while (p > limit) {
    k++;
    p *= stream.uniform();
  }
  return k;
}
