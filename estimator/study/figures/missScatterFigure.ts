// Touchdown points on the deck: deck outline, landing pad circle and one dot per contact, by outcome.
// The view is fixed by the deck (twice its half-extent), not stretched to the farthest contact:
// one contact 12.7 m off the carrier had scaled the axes to +-180 m and the pad and rings
// vanished. Contacts outside the view are listed beside it, farthest first.
import { scaleLinear } from 'd3';
import { OUTCOMES, type Outcome } from '../../sim/TrialResult.js';
import { GRID, INK, OUTCOME_COLOURS } from './palette.js';
import { bottomAxis, escapeXml, leftAxis, px, svgDocument, type Frame } from './svg.js';

export interface MissPoint {
  /** Contact point in the deck frame: x along travel, y left (m). */
  x: number;
  y: number;
  outcome: Outcome;
}

export interface MissFigureOptions {
  padRadius: number;
  deckLength: number;
  deckWidth: number;
  title?: string;
  /** Drawn as a dashed circle when given (m). */
  cep50?: number | null;
}

/** The view's half-width in multiples of the deck's (or pad's) larger half-extent. */
const VIEW = 2;
/** Contacts outside the view listed one per line; the rest counted. */
const OUTSIDE_LISTED = 8;

export function missScatterFigure(points: readonly MissPoint[], options: MissFigureOptions): string {
  const frame: Frame = { width: 600, height: 520, margin: { top: 48, right: 170, bottom: 56, left: 64 } };
  const { margin, width, height } = frame;
  const extent = Math.max(options.deckLength / 2, options.deckWidth / 2, options.padRadius) * VIEW;
  const inside = points.filter((p) => Math.abs(p.x) <= extent && Math.abs(p.y) <= extent);
  const outside = points.filter((p) => !(Math.abs(p.x) <= extent && Math.abs(p.y) <= extent)).sort((a, b) => Math.hypot(b.x, b.y) - Math.hypot(a.x, a.y));
  const side = Math.min(width - margin.left - margin.right, height - margin.top - margin.bottom);
  // Deck frame drawn with travel to the right and left-of-travel up: equal scale on both axes.
  const x = scaleLinear().domain([-extent, extent]).range([margin.left, margin.left + side]);
  const y = scaleLinear().domain([-extent, extent]).range([margin.top + side, margin.top]);
  const square: Frame = { width: margin.left + side + margin.right, height: margin.top + side + margin.bottom, margin };
  let body = bottomAxis(x, square, 'along travel (m)') + leftAxis(y, square, 'left of travel (m)');
  const dx = x(-options.deckLength / 2), dy = y(options.deckWidth / 2);
  body += `<rect x="${px(dx)}" y="${px(dy)}" width="${px(x(options.deckLength / 2) - dx)}" height="${px(y(-options.deckWidth / 2) - dy)}" fill="${GRID}" fill-opacity="0.6" stroke="${INK}"><title>deck</title></rect>\n`;
  body += `<circle cx="${px(x(0))}" cy="${px(y(0))}" r="${px(x(options.padRadius) - x(0))}" fill="none" stroke="${INK}" stroke-width="1.5"><title>landing pad</title></circle>\n`;
  if (options.cep50) body += `<circle cx="${px(x(0))}" cy="${px(y(0))}" r="${px(x(options.cep50) - x(0))}" fill="none" stroke="${INK}" stroke-dasharray="3 3"><title>CEP50 ${options.cep50.toFixed(3)} m</title></circle>\n`;
  for (const p of inside) {
    body += `<circle cx="${px(x(p.x))}" cy="${px(y(p.y))}" r="3" fill="${OUTCOME_COLOURS[p.outcome]}" fill-opacity="0.8"/>\n`;
  }
  const counts = new Map<Outcome, number>();
  for (const p of points) counts.set(p.outcome, (counts.get(p.outcome) ?? 0) + 1);
  let ly = margin.top + 8;
  for (const o of OUTCOMES) {
    if (!counts.has(o)) continue;
    body += `<circle cx="${margin.left + side + 20}" cy="${ly}" r="4" fill="${OUTCOME_COLOURS[o]}"/><text x="${margin.left + side + 30}" y="${ly}" dy="0.32em">${escapeXml(`${o} (${counts.get(o)})`)}</text>\n`;
    ly += 18;
  }
  if (options.cep50) {
    body += `<text x="${margin.left + side + 14}" y="${ly + 6}" font-size="11">dashed: CEP50</text>\n`;
    ly += 18;
  }
  if (outside.length > 0) {
    ly += 10;
    body += `<text x="${margin.left + side + 14}" y="${ly}" font-size="11" font-weight="bold">${escapeXml(`outside the view: ${outside.length}`)}</text>\n`;
    for (const p of outside.slice(0, OUTSIDE_LISTED)) {
      ly += 15;
      body += `<text x="${margin.left + side + 14}" y="${ly}" font-size="11"><title>${escapeXml(`${p.outcome} at (${p.x.toFixed(2)}, ${p.y.toFixed(2)}) m`)}</title>${escapeXml(`${p.outcome} ${Math.hypot(p.x, p.y).toFixed(1)} m`)}</text>\n`;
    }
    if (outside.length > OUTSIDE_LISTED) body += `<text x="${margin.left + side + 14}" y="${ly + 15}" font-size="11">${escapeXml(`and ${outside.length - OUTSIDE_LISTED} more`)}</text>\n`;
  }
  return svgDocument(square, options.title ?? `Touchdown points on the deck (${points.length} contacts)`, body);
}
