import { describe, expect, it } from 'vitest';
import { LineBuffer } from '../../../estimator/io/log/LineBuffer.js';

async function* parts(...p: string[]): AsyncGenerator<string> {
  for (const x of p) yield x;
}

async function all(buffer: LineBuffer): Promise<[number, string][]> {
  const out: [number, string][] = [];
  for (let line = await buffer.nextLine(); line !== null; line = await buffer.nextLine()) out.push([buffer.line, line]);
  return out;
}

describe('LineBuffer', () => {
  it('splits chunks into lines, skips blanks and comments but keeps counting them', async () => {
    const buffer = new LineBuffer(parts('# log\r\ntime,v', 'x\r\n\r\n  \n1,', '2\n#x\n3,4'), true);
    expect(await all(buffer)).toEqual([[2, 'time,vx'], [5, '1,2'], [7, '3,4']]);
  });

  it('takes line input as it comes', async () => {
    const buffer = new LineBuffer(parts('time,vx', '', '1,2\r'), false);
    expect(await all(buffer)).toEqual([[1, 'time,vx'], [3, '1,2']]);
  });

  it('hands out buffered lines synchronously and says when it needs a fill', async () => {
    const buffer = new LineBuffer(parts('a\nb\nc'), true);
    expect(buffer.next()).toBeUndefined();
    await buffer.fill();
    expect([buffer.next(), buffer.next(), buffer.next()]).toEqual(['a', 'b', undefined]); // 'c' may continue in the next chunk
    await buffer.fill();
    expect([buffer.done, buffer.next()]).toEqual([true, 'c']);
  });
});
