import { describe, expect, it } from 'vitest';
import type { LogTextSink } from '../../../estimator/io/log/LogRecorder.js';
import { LayoutRows } from '../../../estimator/io/ros/LayoutRows.js';

/** A sink keeping each file's text; with `bytes`, it takes the encoded pieces (as folderSink does). */
function memorySink(bytes: boolean): LogTextSink & { files: Map<string, string>; pieces: number; closed: boolean } {
  const files = new Map<string, string>();
  const decoder = new TextDecoder();
  const sink = {
    files,
    pieces: 0,
    closed: false,
    write: (file: string, text: string) => {
      files.set(file, (files.get(file) ?? '') + text);
      sink.pieces++;
    },
    close: () => void (sink.closed = true),
  };
  return bytes ? Object.assign(sink, { writeBytes: (file: string, piece: Uint8Array) => sink.write(file, decoder.decode(piece)) }) : sink;
}

describe('LayoutRows', () => {
  it.each([true, false])('writes the header, then each row and its line end, to a sink that takes bytes (%s) or text', (bytes) => {
    const sink = memorySink(bytes);
    const rows = new LayoutRows(sink, { 'imu.csv': 't,fx,fy,fz', 'resets.csv': 't' });
    rows.ensure('resets.csv'); // required: written with its header though no row comes
    rows.add('imu.csv', '0.005,0.2,-0,9.81');
    rows.add('imu.csv', '0.01,1e-7,NaN,-Infinity');
    rows.close();
    expect(sink.files.get('imu.csv')).toBe('t,fx,fy,fz\n0.005,0.2,-0,9.81\n0.01,1e-7,NaN,-Infinity\n');
    expect(sink.files.get('resets.csv')).toBe('t\n');
    expect(rows.rows).toEqual(new Map([['resets.csv', 0], ['imu.csv', 2]]));
    expect(sink.closed).toBe(true);
  });

  it('keeps text outside ASCII and rows longer than its buffer whole, and flushes in pieces', () => {
    const sink = memorySink(true);
    const rows = new LayoutRows(sink, { 'notes.csv': 'note' });
    const long = 'ü'.repeat(200_000); // 400 kB of UTF-8: more than one 256 kB piece
    const lines = ['café 🛬', long, ...Array.from({ length: 30_000 }, (_, i) => String(i / 7))];
    for (const line of lines) rows.add('notes.csv', line);
    rows.close();
    expect(sink.files.get('notes.csv')).toBe(['note', ...lines].join('\n') + '\n');
    expect(sink.pieces).toBeGreaterThan(2);
  });

  it('writes a row of numbers value by value as the template literal would, rows crossing a piece boundary included', () => {
    const sink = memorySink(true);
    const rows = new LayoutRows(sink, { 'truth.csv': 't,a,b,c' });
    const values = [0.1 + 0.2, -0, Number.NaN, -Infinity, 1e21, 5e-324, -2.2250738585072014e-308, 123456789.125, 2 ** 53 + 2];
    const expected: string[] = ['t,a,b,c'];
    for (let k = 0; k < 20_000; k++) { // about 2 MB: rows end up split across 256 kB pieces
      const [t, a, b, c] = [k / 3, values[k % values.length]!, values[(k + 1) % values.length]!, values[(k + 4) % values.length]!];
      rows.start('truth.csv', t).next(a).next(b).next(c).end();
      expected.push(`${t},${a},${b},${c}`);
    }
    rows.close();
    expect(sink.files.get('truth.csv')).toBe(expected.join('\n') + '\n');
    expect(rows.rows.get('truth.csv')).toBe(20_000);
    expect(sink.pieces).toBeGreaterThan(2);
  });
});
