// Plain SVG strings for figures (no DOM): document frame, text escaping and axes from d3 scales.
import { SAFETY_CAUTION_SHORT } from '../../safetyCaution.js';
import { GRID, GROUND, INK } from './palette.js';

export function escapeXml(text: string): string {
  return text.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** Round coordinates to 0.01 px: smaller files, stable bytes. */
export function px(v: number): string {
  return String(Math.round(v * 100) / 100);
}

export interface Frame {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
}

export const DEFAULT_FRAME: Frame = { width: 640, height: 400, margin: { top: 48, right: 24, bottom: 56, left: 64 } };

/** A standalone SVG document with our ground colour, title and a flight-safety note. */
export function svgDocument(frame: Frame, title: string, body: string): string {
  const { width, height } = frame;
  return (
    `<?xml version="1.0" encoding="UTF-8"?>\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" ` +
    `font-family="system-ui, -apple-system, 'Segoe UI', sans-serif" font-size="12" fill="${INK}">\n` +
    `<title>${escapeXml(title)}</title>\n` +
    `<rect width="${width}" height="${height}" fill="${GROUND}"/>\n` +
    `<text x="${Math.min(frame.margin.left, 64)}" y="24" font-size="15" font-weight="600">${escapeXml(title)}</text>\n` +
    body +
    `<text x="${width - 8}" y="${height - 8}" text-anchor="end" font-size="9" opacity="0.7">alight · ${escapeXml(SAFETY_CAUTION_SHORT)}</text>\n` +
    `</svg>\n`
  );
}

interface TickScale {
  (v: number): number;
  ticks(count?: number): number[];
  tickFormat(count?: number, specifier?: string): (v: number) => string;
}

export interface AxisOptions {
  /** Approximate tick count (default 6 bottom, 5 left). */
  ticks?: number;
  /** Exact tick values and their format (e.g. the cells of a log grid). */
  values?: readonly number[];
  format?: (v: number) => string;
  /** Light grid lines across the plot (default true). */
  grid?: boolean;
}

/** Bottom axis, with light grid lines across the plot unless grid is false. */
export function bottomAxis(scale: TickScale, frame: Frame, label: string, options: AxisOptions = {}): string {
  const { margin, height, width } = frame;
  const y = height - margin.bottom;
  const format = options.format ?? scale.tickFormat(options.ticks ?? 6);
  let out = `<g class="x-axis">\n<line x1="${margin.left}" x2="${width - margin.right}" y1="${y}" y2="${y}" stroke="${INK}"/>\n`;
  for (const t of options.values ?? scale.ticks(options.ticks ?? 6)) {
    const x = px(scale(t));
    if (options.grid !== false) out += `<line x1="${x}" x2="${x}" y1="${margin.top}" y2="${y}" stroke="${GRID}"/>`;
    out += `<line x1="${x}" x2="${x}" y1="${y}" y2="${y + 5}" stroke="${INK}"/>`;
    out += `<text x="${x}" y="${y + 18}" text-anchor="middle">${escapeXml(format(t))}</text>\n`;
  }
  out += `<text x="${px((margin.left + width - margin.right) / 2)}" y="${y + 36}" text-anchor="middle">${escapeXml(label)}</text>\n</g>\n`;
  return out;
}

/** Left axis, with light grid lines across the plot unless grid is false. */
export function leftAxis(scale: TickScale, frame: Frame, label: string, options: AxisOptions = {}): string {
  const { margin, height, width } = frame;
  const x = margin.left;
  const format = options.format ?? scale.tickFormat(options.ticks ?? 5);
  let out = `<g class="y-axis">\n<line x1="${x}" x2="${x}" y1="${margin.top}" y2="${height - margin.bottom}" stroke="${INK}"/>\n`;
  for (const t of options.values ?? scale.ticks(options.ticks ?? 5)) {
    const y = px(scale(t));
    if (options.grid !== false) out += `<line x1="${x}" x2="${width - margin.right}" y1="${y}" y2="${y}" stroke="${GRID}"/>`;
    out += `<line x1="${x - 5}" x2="${x}" y1="${y}" y2="${y}" stroke="${INK}"/>`;
    out += `<text x="${x - 8}" y="${y}" dy="0.32em" text-anchor="end">${escapeXml(format(t))}</text>\n`;
  }
  const cy = px((margin.top + height - margin.bottom) / 2);
  out += `<text transform="translate(16 ${cy}) rotate(-90)" text-anchor="middle">${escapeXml(label)}</text>\n</g>\n`;
  return out;
}
