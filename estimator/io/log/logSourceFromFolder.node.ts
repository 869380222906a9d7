// Node-only adapter: a LogSource over a log folder on disk. CSV files stream line by line
// through readline, or (openChunks, what replayLog uses) in 1 MB text chunks that the reader
// splits itself: bounded memory whatever the file size. The JSON files are read whole.
import { createReadStream, existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { LogLayoutError } from './LogProblem.js';
import { parseJsonFile, type LogSource } from './LogSource.js';
import { STREAM_SPECS } from './logStreams.js';

/** Largest camera.json or filter.json read (they hold a few hundred bytes). */
const MAX_JSON_BYTES = 1 << 20;

/** Read chunk size: large enough that readline, not the disk, sets the pace. */
const CHUNK_BYTES = 1 << 20;

/** @param name how messages and the report call the folder (default: the path as given). */
export function logSourceFromFolder(folder: string, name = folder): LogSource {
  if (!existsSync(folder)) throw new LogLayoutError(name, null, null, 'no such log folder');
  if (!statSync(folder).isDirectory()) throw new LogLayoutError(name, null, null, 'not a folder (a log is a folder with camera.json and CSV files)');
  const json = (file: string): { value: unknown; lines?: Map<string, number> } | undefined => {
    const path = join(folder, file);
    if (!existsSync(path)) return undefined;
    const bytes = statSync(path).size;
    if (bytes > MAX_JSON_BYTES) throw new LogLayoutError(file, null, null, `${bytes} bytes is over the limit of ${MAX_JSON_BYTES} for a settings file`);
    return parseJsonFile(readFileSync(path, 'utf8'));
  };
  const camera = json('camera.json');
  const filter = json('filter.json');
  return {
    name,
    camera: camera?.value,
    filter: filter === undefined ? null : filter.value,
    cameraLines: camera?.lines,
    filterLines: filter?.lines,
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
