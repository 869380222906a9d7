// FilterSpec checks at the boundary of the landing filter: every noise, rate and scale the
// filter turns into Q, R or a gate must be a finite positive number (R positive definite).
import type { FilterSpec } from './FilterSettings.js';

/** A FilterSpec field the filter cannot use; `field` is the scenario path. */
export class FilterSpecError extends Error {
  constructor(readonly field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'FilterSpecError';
  }
}

type NumericKey = { [K in keyof FilterSpec]-?: FilterSpec[K] extends number ? K : never }[keyof FilterSpec];

const POSITIVE: readonly NumericKey[] = ['rate', 'qScale', 'rScale', 'gateScale'];
const POSITIVE_R: readonly NumericKey[] = ['pixelNoise', 'sizeNoise', 'odometryNoise'];
const NON_NEGATIVE: readonly NumericKey[] = ['sizeNoiseFraction', 'pixelNoiseFraction', 'carrierAccelNoise', 'accelNoise', 'accelBiasWalk', 'historyLength'];

export function validateFilterSpec(spec: FilterSpec): void {
  for (const key of POSITIVE) {
    if (!(spec[key] > 0) || !Number.isFinite(spec[key])) throw new FilterSpecError(`filter.${key}`, `must be a positive number, got ${spec[key]}`);
  }
  for (const key of POSITIVE_R) {
    if (!(spec[key] > 0) || !Number.isFinite(spec[key])) throw new FilterSpecError(`filter.${key}`, `must be a positive number (it sets R, which must be positive definite), got ${spec[key]}`);
  }
  for (const key of NON_NEGATIVE) {
    if (!(spec[key] >= 0) || !Number.isFinite(spec[key])) throw new FilterSpecError(`filter.${key}`, `must be a non-negative number, got ${spec[key]}`);
  }
  if (!(spec.gateProbability > 0 && spec.gateProbability < 1)) throw new FilterSpecError('filter.gateProbability', `must be in (0, 1), got ${spec.gateProbability}`);
  if (spec.cameraUpdate !== 'tight' && spec.cameraUpdate !== 'loose') throw new FilterSpecError('filter.cameraUpdate', `must be "tight" or "loose", got ${String(spec.cameraUpdate)}`);
  if (spec.carrierModel !== 'constant-velocity' && spec.carrierModel !== 'singer') throw new FilterSpecError('filter.carrierModel', `must be "constant-velocity" or "singer", got ${String(spec.carrierModel)}`);
  if (spec.boxModel !== undefined && spec.boxModel !== 'outline' && spec.boxModel !== 'flat') throw new FilterSpecError('filter.boxModel', `must be "outline" or "flat", got ${String(spec.boxModel)}`);
  if (spec.boxTerms !== undefined && spec.boxTerms !== 'centre-size' && spec.boxTerms !== 'centre-width-height') throw new FilterSpecError('filter.boxTerms', `must be "centre-size" or "centre-width-height", got ${String(spec.boxTerms)}`);
  if (spec.headingMinSpeed !== undefined && (!(spec.headingMinSpeed >= 0) || !Number.isFinite(spec.headingMinSpeed))) throw new FilterSpecError('filter.headingMinSpeed', `must be a non-negative number of m/s, got ${spec.headingMinSpeed}`);
  if (spec.carrierVerticalAccelNoise !== undefined && (!(spec.carrierVerticalAccelNoise >= 0) || !Number.isFinite(spec.carrierVerticalAccelNoise))) throw new FilterSpecError('filter.carrierVerticalAccelNoise', `must be a non-negative number of m/s^2/sqrt(Hz), got ${spec.carrierVerticalAccelNoise}`);
  if (spec.pointingBiasSigmaDeg !== undefined && (!(spec.pointingBiasSigmaDeg >= 0 && spec.pointingBiasSigmaDeg <= 10) || !Number.isFinite(spec.pointingBiasSigmaDeg))) throw new FilterSpecError('filter.pointingBiasSigmaDeg', `must be a number of degrees from 0 to 10 (1 sigma of the camera's pointing bias; 0 = no pointing states), got ${spec.pointingBiasSigmaDeg}`);
  if ((spec.pointingBiasSigmaDeg ?? 0) > 0 && spec.cameraUpdate === 'loose') throw new FilterSpecError('filter.pointingBiasSigmaDeg', 'the pointing-bias states need the tight camera update (cameraUpdate "tight"); the loose fix has no column for them');
  if (spec.deckScaleSigma !== undefined && (!(spec.deckScaleSigma >= 0 && spec.deckScaleSigma <= 0.5) || !Number.isFinite(spec.deckScaleSigma))) throw new FilterSpecError('filter.deckScaleSigma', `must be a fraction from 0 to 0.5 (1 sigma of the deck size assumed; 0 = no scale state), got ${spec.deckScaleSigma}`);
  if (spec.carrierModel === 'singer' && (!(spec.singerTau > 0) || !Number.isFinite(spec.singerTau))) throw new FilterSpecError('filter.singerTau', `must be a positive number of seconds for the Singer model, got ${spec.singerTau}`);
}
