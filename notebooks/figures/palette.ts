// Colours: the hues of the eight-colour set of Okabe & Ito (2008, "Color Universal Design"),
// distinguishable under the common colour-vision deficiencies; series also differ by dash or
// marker shape. The set's light members (green, purple, orange, sky blue, yellow) are darkened
// here so every series line stands at least 3:1 against the plate (#fffdf8), the contrast WCAG
// 2.1 asks of graphical objects (success criterion 1.4.11); a test checks each one.
export const INK = '#1f2a33';
export const MUTED = '#6b7580';
export const GRID = '#e4e0d6';

export const SERIES = ['#0072B2', '#D55E00', '#007A5A', '#B5508A', '#A86F00', '#2E86BF', '#6E6A00', '#000000'] as const;

/** The plate figures are drawn on, and the page around them: the backgrounds contrast is measured against. */
export const PLATE = '#fffdf8';
export const PAPER = '#f3efe6';
/** Keyboard focus ring: 3:1 or more against both backgrounds. */
export const FOCUS = '#a34400';
export const DASHES = ['', '6 3', '2 3', '8 3 2 3', '1 2', '10 4'] as const;

export const TRUTH = SERIES[0];
export const ESTIMATE = SERIES[1];
export const CARRIER = SERIES[2];
export const DETECTOR = SERIES[3];

/** Sequential ramp for surfaces (light = low, dark = high), from the blue end of the set. */
export function sequential(t: number): string {
  const clamped = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  // Interpolate in sRGB between a pale sand and the Okabe–Ito blue, through sky blue.
  const stops: [number, number, number][] = [[247, 243, 228], [86, 180, 233], [0, 114, 178], [12, 44, 84]];
  const scaled = clamped * (stops.length - 1);
  const i = Math.min(stops.length - 2, Math.floor(scaled));
  const f = scaled - i;
  const a = stops[i]!;
  const b = stops[i + 1]!;
  const c = a.map((v, k) => Math.round(v + (b[k]! - v) * f));
  return `rgb(${c[0]},${c[1]},${c[2]})`;
}
