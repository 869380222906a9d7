// Markup as strings: the same figure code runs in the page and in `alight report` (no DOM in Node).

export function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

export type Attributes = Record<string, string | number | null | undefined | false>;

/** One element; numbers are written with 2 decimals at most (pixel coordinates). */
export function el(tag: string, attributes: Attributes, ...children: string[]): string {
  let open = '<' + tag;
  for (const [key, value] of Object.entries(attributes)) {
    if (value === null || value === undefined || value === false) continue;
    const text = typeof value === 'number' ? px(value) : value;
    open += ` ${key}="${escapeXml(text)}"`;
  }
  return children.length === 0 ? open + '/>' : open + '>' + children.join('') + `</${tag}>`;
}

export function px(value: number): string {
  return String(Math.round(value * 100) / 100);
}

/** A number for people: 3 significant digits, no exponent for everyday magnitudes. */
export function formatNumber(value: number | null, digits = 3): string {
  if (value === null || !Number.isFinite(value)) return '–';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e5 || magnitude < 1e-3) return value.toExponential(digits - 1);
  return String(Number(value.toPrecision(digits)));
}

export function formatPercent(fraction: number | null, digits = 1): string {
  if (fraction === null || !Number.isFinite(fraction)) return '–';
  return (fraction * 100).toFixed(digits) + ' %';
}
