import { describe, expect, it } from 'vitest';
import { chunksOfBlob, linesOfChunks, linesOfText, logSourceFromFiles } from '../../../estimator/io/log/LogSource.js';

async function collect(lines: AsyncIterable<string>): Promise<string[]> {
  const out: string[] = [];
  for await (const line of lines) out.push(line);
  return out;
}

async function* chunks(...parts: string[]): AsyncGenerator<string> {
  for (const p of parts) yield p;
}

describe('LogSource helpers', () => {
  it('linesOfText splits on newlines and drops nothing but the final empty line', async () => {
    expect(await collect(linesOfText('a,b\n1,2\n\n3,4\n'))).toEqual(['a,b', '1,2', '', '3,4']);
    expect(await collect(linesOfText('x'))).toEqual(['x']);
  });

  it('linesOfChunks joins lines split across chunks anywhere', async () => {
    expect(await collect(linesOfChunks(chunks('time,f', 'x\n0.1,', '2\n0.2,3', '\n0.3,4')))).toEqual(['time,fx', '0.1,2', '0.2,3', '0.3,4']);
  });

  it('chunksOfBlob decodes UTF-8 split inside a character', async () => {
    const bytes = new TextEncoder().encode('note,ü\n');
    const blob = new Blob([bytes.slice(0, 6), bytes.slice(6)]); // ü is 2 bytes at 5..6
    expect((await collect(chunksOfBlob(blob))).join('')).toBe('note,ü\n');
  });

  it('logSourceFromFiles reads JSON files whole and streams the CSV files, from texts or Blobs', async () => {
    const source = await logSourceFromFiles(new Map<string, string | Blob>([
      ['camera.json', '{"a": 1}'],
      ['filter.json', new Blob(['{"qScale": 2}'])],
      ['imu.csv', new Blob(['time,fx,fy,fz\n0,0,0,9.8\n'])],
    ]));
    expect(source.camera).toEqual({ a: 1 });
    expect(source.filter).toEqual({ qScale: 2 });
    expect(await collect(source.open('imu')!)).toEqual(['time,fx,fy,fz', '0,0,0,9.8']);
    expect((await collect(source.openChunks!('imu')!)).join('')).toBe('time,fx,fy,fz\n0,0,0,9.8\n');
    expect(source.open('boxes')).toBeNull();
    expect(source.fileName('truth')).toBe('truth.csv');
  });
});
