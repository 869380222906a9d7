// Confidence levels offered for Wilson bands, with their two-sided normal quantile z
// (standard normal table values, common practice; 95 % uses 1.96 like `alight summarize`).
import type { ChoiceParameter } from './Parameter.js';

export const Z_OF_LEVEL: Record<string, number> = { '0.90': 1.6449, '0.95': 1.96, '0.99': 2.5758 };

export const CONFIDENCE_PARAMETER: ChoiceParameter = {
  kind: 'choice',
  name: 'confidence',
  label: 'Confidence of the bands',
  options: [
    { value: '0.90', label: '90 %' },
    { value: '0.95', label: '95 %' },
    { value: '0.99', label: '99 %' },
  ],
  default: '0.95',
};
