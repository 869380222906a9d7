// Contrast ratio of two sRGB colours as WCAG 2.1 defines it (relative luminance, (L1 + 0.05) /
// (L2 + 0.05)); success criterion 1.4.11 asks 3:1 of graphical objects and focus indicators.

function channel(v: number): number {
  const c = v / 255;
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Parses #rrggbb, #rgb and rgb()/rgba() (alpha ignored: callers pass opaque colours). */
export function parseColour(text: string): [number, number, number] {
  const t = text.trim();
  let m = /^#([0-9a-f]{6})$/i.exec(t);
  if (m) return [0, 2, 4].map((i) => parseInt(m![1]!.slice(i, i + 2), 16)) as [number, number, number];
  m = /^#([0-9a-f]{3})$/i.exec(t);
  if (m) return [0, 1, 2].map((i) => parseInt(m![1]![i]!.repeat(2), 16)) as [number, number, number];
  m = /^rgba?\(\s*(\d+)[,\s]+(\d+)[,\s]+(\d+)/i.exec(t);
  if (m) return [Number(m[1]), Number(m[2]), Number(m[3])];
  throw new Error(`not a colour: ${text}`);
}

export function luminance(colour: string): number {
  const [r, g, b] = parseColour(colour);
  return 0.2126 * channel(r) + 0.7152 * channel(g) + 0.0722 * channel(b);
}

export function contrastRatio(a: string, b: string): number {
  const la = luminance(a);
  const lb = luminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}
