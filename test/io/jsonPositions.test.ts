import { describe, expect, it } from 'vitest';
import { JsonSyntaxError, jsonLines, MAX_DEPTH, parseJsonText } from '../../estimator/io/jsonPositions.js';

describe('jsonLines', () => {
  it('maps every field path to its line', () => {
    const lines = jsonLines('{\n  "a": {\n    "b": 1,\n    "c": [\n      2,\n      3\n    ]\n  },\n  "d": "x"\n}');
    expect(lines.get('')).toBe(1);
    expect(lines.get('a')).toBe(2);
    expect(lines.get('a.b')).toBe(3);
    expect(lines.get('a.c.1')).toBe(6);
    expect(lines.get('d')).toBe(9);
  });

  it('reports line and column of the first syntax error', () => {
    try {
      jsonLines('{\n  "a": 1,\n  "b": }');
      expect.fail('should throw');
    } catch (error) {
      expect(error).toBeInstanceOf(JsonSyntaxError);
      expect((error as JsonSyntaxError).line).toBe(3);
      expect((error as JsonSyntaxError).column).toBe(8);
      expect((error as JsonSyntaxError).message).toBe("expected a value, found '}'");
    }
  });

  it('skips a byte-order mark without shifting columns', () => {
    expect(parseJsonText('\uFEFF{"a": 1}').value).toEqual({ a: 1 });
    expect(() => jsonLines('\uFEFF{"a": }')).toThrow(expect.objectContaining({ line: 1, column: 7 }));
  });

  it('refuses a duplicate key at its second place, naming the first line; equal keys in different objects are fine', () => {
    expect(() => jsonLines('{"a": {"b": 1},\n "a": 2}')).toThrow(expect.objectContaining({ line: 2, column: 2, message: 'duplicate key "a" (first given on line 1); each key may appear once' }));
    expect(jsonLines('{"a": {"b": 1}, "c": {"b": 2}}').get('c.b')).toBe(1);
  });

  it('refuses numbers beyond the double range and accepts the largest finite one', () => {
    expect(() => jsonLines('[1, -2e400]')).toThrow(expect.objectContaining({ column: 5, message: 'number -2e400 is not finite (beyond the largest double, about 1.8e308)' }));
    expect(() => jsonLines(`[${'9'.repeat(400)}]`)).toThrow(/^number 9{21}\.\.\. is not finite/);
    expect(parseJsonText('[1.7976931348623157e308]').value).toEqual([Number.MAX_VALUE]);
  });

  it('refuses nesting deeper than MAX_DEPTH instead of overflowing the stack', () => {
    expect(jsonLines(`${'['.repeat(MAX_DEPTH)}${']'.repeat(MAX_DEPTH)}`).size).toBe(MAX_DEPTH);
    expect(() => jsonLines('['.repeat(100_000))).toThrow(expect.objectContaining({ line: 1, column: MAX_DEPTH + 1, message: `nesting deeper than ${MAX_DEPTH} levels` }));
  });

  it('refuses a trailing comma and trailing text', () => {
    expect(() => jsonLines('{"a": 1,}')).toThrow(/expected a string, found '}'/);
    expect(() => jsonLines('{"a": 1} x')).toThrow(/expected end of file/);
    expect(() => jsonLines('{"a": "open')).toThrow(/closing quote/);
  });

  it('agrees with JSON.parse on what is valid', () => {
    for (const text of ['1', '"s\\"q"', '[1, -2.5e3, true, null]', '{"a": {"b": []}}', '  {}  ']) {
      expect(() => JSON.parse(text)).not.toThrow();
      expect(() => jsonLines(text)).not.toThrow();
    }
  });
});
