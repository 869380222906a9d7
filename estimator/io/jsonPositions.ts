// Where things are in a JSON text: the line of every value by its field path, and the
// line/column of the first syntax error. JSON.parse reports neither on Node 20, and users
// need "file:line: field" messages. A small recursive-descent scanner; values themselves
// still come from JSON.parse. It also refuses what JSON.parse lets through silently: a key
// given twice (JSON.parse keeps the last), a number beyond the double range (1e999 becomes
// Infinity, then null on the next write), and nesting deep enough to overflow the stack.
// A leading UTF-8 byte-order mark is skipped, as editors on some systems write one.

/** A JSON syntax error at a 1-based line and column. */
export class JsonSyntaxError extends Error {
  readonly line: number;
  readonly column: number;
  constructor(message: string, line: number, column: number) {
    super(message);
    this.name = 'JsonSyntaxError';
    this.line = line;
    this.column = column;
  }
}

/** Deepest nesting of objects and arrays accepted (a scenario needs 5). */
export const MAX_DEPTH = 64;

const LITERAL = /true|false|null|-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;

/**
 * Parse JSON text (a leading byte-order mark skipped) with the line of every value.
 * @throws JsonSyntaxError at the first syntax error, duplicate key, non-finite number or
 *   nesting beyond MAX_DEPTH, with 1-based line and column.
 * @example parseJsonText('\uFEFF{"a": 1}').value // { a: 1 }
 */
export function parseJsonText(text: string): { value: unknown; lines: Map<string, number>; columns: Map<string, number> } {
  const columns = new Map<string, number>();
  const lines = jsonLines(text, columns);
  return { value: JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text) as unknown, lines, columns };
}

/**
 * Scan `text` and return the 1-based line of every value, keyed by dotted path
 * ('' for the root, 'detector.pixelNoise', 'lander.startOffset.2'). Throws JsonSyntaxError
 * at the first syntax error. When `columns` is given it receives the 1-based column of every
 * value by the same path (counted in UTF-16 units, as the syntax-error column is), so messages
 * can read file:line:column.
 * @example jsonLines('{\n "a": {\n  "b": 1 }}').get('a.b') // 3
 */
export function jsonLines(text: string, columns?: Map<string, number>): Map<string, number> {
  const lines = new Map<string, number>();
  const start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let i = start;
  let depth = 0;

  const failAt = (at: number, message: string): never => {
    let line = 1, column = 1;
    for (let k = start; k < at && k < text.length; k++) {
      if (text.charCodeAt(k) === 10) { line++; column = 1; } else column++;
    }
    throw new JsonSyntaxError(message, line, column);
  };
  const fail = (what: string): never => {
    const found = i < text.length ? `'${text[i]}'` : 'end of file';
    return failAt(i, `expected ${what}, found ${found}`);
  };
  const lineStarts = [0];
  for (let k = 0; k < text.length; k++) if (text.charCodeAt(k) === 10) lineStarts.push(k + 1);
  const lineAt = (pos: number): number => {
    let lo = 0, hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lineStarts[mid]! <= pos) lo = mid; else hi = mid - 1;
    }
    return lo + 1;
  };
  const space = (): void => {
    while (i < text.length && ' \t\n\r'.includes(text[i]!)) i++;
  };
  const string = (): string => {
    if (text[i] !== '"') fail('a string');
    const start = i++;
    while (i < text.length && text[i] !== '"') {
      if (text.charCodeAt(i) < 0x20) fail('a closing quote');
      i += text[i] === '\\' ? 2 : 1;
    }
    if (i >= text.length) fail('a closing quote');
    i++;
    return JSON.parse(text.slice(start, i)) as string;
  };
  const value = (path: string): void => {
    space();
    const line = lineAt(i);
    lines.set(path, line);
    // column from the line start; the byte-order mark is not a column
    columns?.set(path, i - Math.max(lineStarts[line - 1]!, start) + 1);
    const c = text[i];
    const join = (key: string) => (path === '' ? key : `${path}.${key}`);
    if ((c === '{' || c === '[') && ++depth > MAX_DEPTH) failAt(i, `nesting deeper than ${MAX_DEPTH} levels`);
    if (c === '{') {
      i++;
      space();
      if (text[i] === '}') { i++; depth--; return; }
      const keyLines = new Map<string, number>();
      for (;;) {
        space();
        const keyAt = i;
        const key = string();
        const first = keyLines.get(key);
        if (first !== undefined) failAt(keyAt, `duplicate key "${key}" (first given on line ${first}); each key may appear once`);
        keyLines.set(key, lineAt(keyAt));
        space();
        if (text[i] !== ':') fail("':'");
        i++;
        value(join(key));
        space();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === '}') { i++; depth--; return; }
        fail("',' or '}'");
      }
    }
    if (c === '[') {
      i++;
      space();
      if (text[i] === ']') { i++; depth--; return; }
      for (let n = 0; ; n++) {
        value(join(String(n)));
        space();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === ']') { i++; depth--; return; }
        fail("',' or ']'");
      }
    }
    if (c === '"') { string(); return; }
    LITERAL.lastIndex = i;
    const literal = LITERAL.exec(text);
    if (!literal) fail('a value');
    const word = literal![0];
    if (word !== 'true' && word !== 'false' && word !== 'null' && !Number.isFinite(Number(word))) {
      failAt(i, `number ${word.length > 24 ? `${word.slice(0, 21)}...` : word} is not finite (beyond the largest double, about 1.8e308)`);
    }
    i += word.length;
  };

  value('');
  space();
  if (i < text.length) fail('end of file');
  return lines;
}
