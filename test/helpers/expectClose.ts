// The one float comparison of the test suite: |actual - expected| <= abs + rel * |expected|.
// Every call site states why its tolerance is what it is.
import { expect } from 'vitest';

export interface Tolerance {
  /** Relative tolerance (fraction of |expected|). */
  rel?: number;
  /** Absolute tolerance (same unit as the values). */
  abs?: number;
}

export function isClose(actual: number, expected: number, { rel = 0, abs = 0 }: Tolerance): boolean {
  return Math.abs(actual - expected) <= abs + rel * Math.abs(expected);
}

export function expectClose(actual: number, expected: number, tolerance: Tolerance, label = ''): void {
  if (!Number.isFinite(actual) || !isClose(actual, expected, tolerance)) {
    const { rel = 0, abs = 0 } = tolerance;
    expect.fail(`${label ? label + ': ' : ''}expected ${expected} ± (${abs} + ${rel}·|expected|), got ${actual}`);
  }
}

export function expectAllClose(actual: ArrayLike<number>, expected: ArrayLike<number>, tolerance: Tolerance, label = ''): void {
  expect(actual.length, `${label} length`).toBe(expected.length);
  for (let i = 0; i < expected.length; i++) expectClose(actual[i]!, expected[i]!, tolerance, `${label}[${i}]`);
}
