// How an identified term is shown: the significant digits its interval supports, and the words
// for a term bounded on one side only or not at all. Shared by the CLI and the page.

export type Identifiability = 'identified' | 'upper-bound-only' | 'lower-bound-only' | 'not-identifiable';

/** What a term needs to be shown (a TermEstimate has all of it). */
export interface ShownTerm {
  unit: string;
  estimate: number;
  low: number | null;
  high: number | null;
  status: Identifiability;
  digits: number;
}

/**
 * Significant digits of `estimate` that its interval supports: the fewest whose rounding step
 * 10^(floor(log10 v) - d + 1) is at most a quarter of the interval's width (1 to 3).
 * @example supportedDigits(0.169, 0.124, 0.231) // 2 -> "0.17"
 */
export function supportedDigits(estimate: number, low: number, high: number): number {
  const width = high - low;
  if (!(width > 0) || !(estimate > 0)) return 3;
  const magnitude = Math.floor(Math.log10(estimate));
  for (let d = 1; d < 3; d++) if (10 ** (magnitude - d + 1) <= width / 4) return d;
  return 3;
}

/** v rounded to d significant digits (d = 0: unchanged). */
export function roundTo(v: number, d: number): number {
  return d > 0 ? Number(v.toPrecision(d)) : v;
}

/** A term's value as the data support it: digits from its interval, or what bounds it, or nothing. */
export function termValueText(t: ShownTerm): string {
  const unit = t.unit.startsWith('of ') ? '' : ` ${t.unit}`;
  switch (t.status) {
    case 'identified':
      return `${roundTo(t.estimate, t.digits)}${unit} (95 %: ${roundTo(t.low!, 2)} to ${roundTo(t.high!, 2)})`;
    case 'upper-bound-only':
      return `at most ${roundTo(t.high!, 2)}${unit}`;
    case 'lower-bound-only':
      return `at least ${roundTo(t.low!, 2)}${unit}`;
    case 'not-identifiable':
      return 'not identifiable';
  }
}
