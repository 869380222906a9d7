// Natural log of the gamma function (Lanczos approximation, g = 7, 9 terms; ~15 significant digits).

const COEFFICIENTS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/**
 * ln Γ(x) for x > 0:
 *   Γ(x) = sqrt(2π) t^(x - 1/2) e^(-t) A(x),  t = x + g - 1/2,  A(x) = c0 + Σ c_i / (x - 1 + i).
 * @example Math.exp(logGamma(5)) // 24
 */
export function logGamma(x: number): number {
  if (!(x > 0)) throw new RangeError(`logGamma: x must be positive, got ${x}`);
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x); // reflection
  const y = x - 1;
  let a = COEFFICIENTS[0]!;
  const t = y + 7.5;
  for (let i = 1; i < 9; i++) a += COEFFICIENTS[i]! / (y + i);
  return 0.5 * Math.log(2 * Math.PI) + (y + 0.5) * Math.log(t) - t + Math.log(a);
}
