// Minimal well-formedness check for the SVG strings our figures produce (no DOM in Node).
import { expect } from 'vitest';

/** Minimal XML well-formedness: one root, every tag closed in order, attributes quoted. */
export function expectWellFormedSvg(svg: string): void {
  expect(svg.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
  const stack: string[] = [];
  const body = svg.replace(/^<\?xml[^>]*\?>/, '');
  for (const m of body.matchAll(/<(\/?)([a-zA-Z]+)((?:\s+[a-zA-Z:-]+="[^"<]*")*)\s*(\/?)>/g)) {
    const [, closing, name, , selfClosing] = m;
    if (selfClosing) continue;
    if (closing) expect(stack.pop(), `closing </${name}>`).toBe(name);
    else stack.push(name!);
  }
  expect(stack).toEqual([]);
  expect(body.replace(/<[^>]*>/g, '')).not.toMatch(/[<>]/); // no stray markup characters in text
  expect(svg).not.toContain('NaN');
}

