// Where things are in a JSON text: the line of every value by its field path, and the
// line/column of the first syntax error. JSON.parse reports neither on Node 20, and users
// need "file:line: field" messages. A small recursive-descent scanner; values themselves
// still come from JSON.parse.

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

/**
 * Scan `text` and return the 1-based line of every value, keyed by dotted path
 * ('' for the root, 'detector.pixelNoise', 'lander.startOffset.2'). Throws JsonSyntaxError
 * at the first syntax error.
 * @example jsonLines('{\n "a": {\n  "b": 1 }}').get('a.b') // 3
 */
export function jsonLines(text: string): Map<string, number> {
  const lines = new Map<string, number>();
  let i = 0;

  const fail = (what: string): never => {
    let line = 1, column = 1;
    for (let k = 0; k < i && k < text.length; k++) {
      if (text.charCodeAt(k) === 10) { line++; column = 1; } else column++;
    }
    const found = i < text.length ? `'${text[i]}'` : 'end of file';
    throw new JsonSyntaxError(`expected ${what}, found ${found}`, line, column);
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
    lines.set(path, lineAt(i));
    const c = text[i];
    const join = (key: string) => (path === '' ? key : `${path}.${key}`);
    if (c === '{') {
      i++;
      space();
      if (text[i] === '}') { i++; return; }
      for (;;) {
        space();
        const key = string();
        space();
        if (text[i] !== ':') fail("':'");
        i++;
        value(join(key));
        space();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === '}') { i++; return; }
        fail("',' or '}'");
      }
    }
    if (c === '[') {
      i++;
      space();
      if (text[i] === ']') { i++; return; }
      for (let n = 0; ; n++) {
        value(join(String(n)));
        space();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === ']') { i++; return; }
        fail("',' or ']'");
      }
    }
    if (c === '"') { string(); return; }
    const literal = /^(?:true|false|null|-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?)/.exec(text.slice(i, i + 64));
    if (!literal) fail('a value');
    i += literal![0].length;
  };

  value('');
  space();
  if (i < text.length) fail('end of file');
  return lines;
}
