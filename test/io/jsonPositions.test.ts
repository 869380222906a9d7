import { describe, expect, it } from 'vitest';
import { JsonSyntaxError, jsonLines } from '../../estimator/io/jsonPositions.js';

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
