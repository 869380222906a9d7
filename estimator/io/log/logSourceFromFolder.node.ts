// Node-only adapter: a LogSource over a log folder on disk. CSV files stream line by line
// through readline, or (openChunks, what replayLog uses) in 1 MB text chunks that the reader
// splits itself: bounded memory whatever the file size. The JSON files are read whole.
import { createReadStream, existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { LogLayoutError } from './LogProblem.js';
import { parseJsonOrText, type LogSource } from './LogSource.js';
import { STREAM_SPECS } from './logStreams.js';

/** Read chunk size: large enough that readline, not the disk, sets the pace. */
const CHUNK_BYTES = 1 << 20;

/** @param name how messages and the report call the folder (default: the path as given). */
export function logSourceFromFolder(folder: string, name = folder): LogSource {
  if (!existsSync(folder)) throw new LogLayoutError(name, null, null, 'no such log folder');
  if (!statSync(folder).isDirectory()) throw new LogLayoutError(name, null, null, 'not a folder (a log is a folder with camera.json and CSV files)');
  const json = (name: string): unknown => {
    const path = join(folder, name);
    return existsSync(path) ? parseJsonOrText(readFileSync(path, 'utf8')) : undefined;
  };
  return {
    name,
    camera: json('camera.json'),
    filter: json('filter.json') ?? null,
    open(stream) {
      const path = join(folder, STREAM_SPECS[stream].file);
      if (!existsSync(path)) return null;
      return createInterface({ input: createReadStream(path, { encoding: 'utf8', highWaterMark: CHUNK_BYTES }), crlfDelay: Infinity });
    },
    openChunks(stream) {
      const path = join(folder, STREAM_SPECS[stream].file);
      if (!existsSync(path)) return null;
      return createReadStream(path, { encoding: 'utf8', highWaterMark: CHUNK_BYTES }) as AsyncIterable<string>;
    },
    fileName: (stream) => STREAM_SPECS[stream].file,
  };
}
