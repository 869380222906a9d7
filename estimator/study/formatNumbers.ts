// Numbers in text output, rounded to what they support and with their unit. JSON output keeps
// full precision; these are for people reading a terminal.

/**
 * Decimals that resolve a step: the first digit that changes from one step to the next.
 * @example decimalsFor(0.0703) // 2
 * @example decimalsFor(5) // 0
 */
export function decimalsFor(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 3;
  return Math.max(0, Math.min(12, Math.ceil(-Math.log10(step) - 1e-9)));
}

/**
 * Decimals a user wrote a value with (at most 6), so an end of a range prints as given.
 * @example decimalsIn(0.02) // 2
 */
export function decimalsIn(value: number): number {
  const text = String(value);
  if (text.includes('e')) return 6;
  const dot = text.indexOf('.');
  return dot < 0 ? 0 : Math.min(6, text.length - dot - 1);
}

/**
 * A value rounded to `decimals`, with its unit when it has one.
 * @example quantity(4.015625, 2, 'px') // '4.02 px'
 */
export function quantity(value: number, decimals: number, unit: string): string {
  const text = value.toFixed(decimals);
  return unit ? `${text} ${unit}` : text;
}

/**
 * A rate in [0, 1] as a percentage with one decimal.
 * @example percent(0.925) // '92.5 %'
 */
export function percent(rate: number): string {
  return `${(100 * rate).toFixed(1)} %`;
}

/**
 * Decimals of a percentage that `trials` outcomes can resolve: one trial moves the rate by
 * 100/n %, so 3 trials show whole percent and 1000 trials one decimal.
 * @example rateDecimals(3) // 0
 * @example rateDecimals(1000) // 1
 */
export function rateDecimals(trials: number): number {
  return trials > 0 ? decimalsFor(100 / trials) : 0;
}

/**
 * A rate measured over `trials` outcomes as a percentage with the digits the count supports.
 * @example ratePercent(1, 3) // '100 %'
 * @example ratePercent(0.925, 1000) // '92.5 %'
 */
export function ratePercent(rate: number, trials: number): string {
  return `${(100 * rate).toFixed(rateDecimals(trials))} %`;
}
