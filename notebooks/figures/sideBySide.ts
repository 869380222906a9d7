// Several plots as one SVG (nested <svg> elements), so a multi-panel figure exports as one file.
import { el } from './svg.js';

export function sideBySide(title: string, panels: readonly { svg: string; width: number; height: number }[]): string {
  let x = 0;
  const height = Math.max(...panels.map((p) => p.height));
  const nested = panels.map((p) => {
    const inner = p.svg.replace(/^<svg /, `<svg x="${x}" y="0" `);
    x += p.width;
    return inner;
  });
  return el('svg', { xmlns: 'http://www.w3.org/2000/svg', viewBox: `0 0 ${x} ${height}`, width: x, height, role: 'img', 'aria-label': title }, el('title', {}, title), ...nested);
}
