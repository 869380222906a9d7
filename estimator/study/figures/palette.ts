// Colours of alight's figures: the Okabe–Ito colour-blind-safe set (Okabe and Ito 2008),
// on a warm off-white ground with slate ink, and cividis for heat maps (readable in grey).
import type { Outcome } from '../../sim/TrialResult.js';

export const INK = '#2b3440';
export const GROUND = '#fbfaf7';
export const GRID = '#e4e1da';
export const ACCENT = '#0072b2'; // blue
export const BAND = '#56b4e9'; // sky blue
export const TARGET = '#d55e00'; // vermillion

export const OUTCOME_COLOURS: Record<Outcome, string> = {
  landed: '#009e73', // bluish green
  'off-pad': '#e69f00', // orange
  'hard-contact': '#d55e00', // vermillion
  aborted: '#cc79a7', // reddish purple
  'timed-out': '#999999',
  'off-carrier': '#56b4e9', // sky blue
  diverged: '#000000',
  'silent-divergence': '#0072b2', // blue
};
