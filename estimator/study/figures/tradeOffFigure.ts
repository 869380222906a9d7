// The landing trade-off as a scatter: each setting's landing success (with its Wilson 95 %
// interval) against how far its ANEES sits from the dimension, |ln(ANEES/n)|; the non-dominated
// settings joined in order, the named one ringed.
import { scaleLinear } from 'd3';
import type { LandingTradeOff } from '../landingTradeOff.js';
import { ACCENT, INK, TARGET } from './palette.js';
import { bottomAxis, DEFAULT_FRAME, escapeXml, leftAxis, px, svgDocument } from './svg.js';

export function tradeOffFigure(t: LandingTradeOff, title = 'Landing success against consistency'): string {
  const frame = DEFAULT_FRAME;
  const { margin, width, height } = frame;
  const shown = t.settings.filter((s) => s.neesDistance !== null);
  const maxD = Math.max(0.5, ...shown.map((s) => s.neesDistance!));
  const x = scaleLinear().domain([0, maxD]).range([margin.left, width - margin.right]).nice();
  const y = scaleLinear().domain([0, 1]).range([height - margin.bottom, margin.top]);
  let body = bottomAxis(x, frame, '|ln(ANEES / n)|  (0 = consistent; ln 2 = a factor 2 off)');
  body += leftAxis(y, frame, 'landing success (Wilson 95 %)', { format: (v) => `${Math.round(v * 100)} %` });
  const front = t.front.map((i) => t.settings[i]!).filter((s) => s.neesDistance !== null).sort((a, b) => a.neesDistance! - b.neesDistance!);
  if (front.length > 1) body += `<polyline fill="none" stroke="${ACCENT}" stroke-dasharray="4 3" points="${front.map((s) => `${px(x(s.neesDistance!))},${px(y(s.summary.successRate))}`).join(' ')}"/>\n`;
  for (const s of shown) {
    const cx = x(s.neesDistance!), cy = y(s.summary.successRate);
    const label = `qScale ${s.qScale}, rScale ${s.rScale}: ${s.summary.landed} of ${s.summary.trials} landed, ANEES ${s.summary.neesMean!.toPrecision(3)} for n = ${s.summary.neesDim} (${s.summary.neesVerdict})${s.nonDominated ? ', non-dominated' : ''}`;
    body += `<line x1="${px(cx)}" x2="${px(cx)}" y1="${px(y(s.summary.wilsonLow))}" y2="${px(y(s.summary.wilsonHigh))}" stroke="${INK}" stroke-opacity="0.4"/>`;
    body += `<circle cx="${px(cx)}" cy="${px(cy)}" r="${s.nonDominated ? 5 : 3.5}" fill="${s.nonDominated ? ACCENT : 'none'}" stroke="${s.nonDominated ? ACCENT : INK}"><title>${escapeXml(label)}</title></circle>\n`;
  }
  const chosen = t.chosen !== null ? t.settings[t.chosen]! : null;
  if (chosen && chosen.neesDistance !== null) body += `<circle cx="${px(x(chosen.neesDistance))}" cy="${px(y(chosen.summary.successRate))}" r="9" fill="none" stroke="${TARGET}" stroke-width="2"><title>${escapeXml(`named setting: qScale ${chosen.qScale}, rScale ${chosen.rScale}`)}</title></circle>\n`;
  return svgDocument(frame, title, body);
}
