// Where a replay reads a flight log from: parsed camera.json (and filter.json) plus one line
// stream per CSV file. Browser-safe: the Node adapter (logSourceFromFolder.node.ts) streams
// files with readline; in a page, logSourceFromFiles() wraps dropped File objects.
import type { LogStreamName } from './logStreams.js';
import { STREAM_SPECS } from './logStreams.js';
import { JsonSyntaxError, parseJsonText } from '../jsonPositions.js';

export interface LogSource {
  /** A name for messages and reports (folder path or "dropped files"). */
  name: string;
  /** camera.json, parsed JSON (validated by parseLogCamera). */
  camera: unknown;
  /** filter.json, parsed JSON (a partial FilterSpec the lander flew with), or null. */
  filter: unknown;
  /** Line of each camera.json / filter.json field by dotted path (jsonLines), for messages. */
  cameraLines?: ReadonlyMap<string, number>;
  filterLines?: ReadonlyMap<string, number>;
  /** Text lines of a stream's CSV file (without line ends), or null when the file is absent. */
  open(stream: LogStreamName): AsyncIterable<string> | null;
  /**
   * Optional, faster: the same file as text chunks that may split lines anywhere (the reader
   * splits them), or null when absent. replayLog prefers it when given.
   */
  openChunks?(stream: LogStreamName): AsyncIterable<string> | null;
  /** File name shown in messages, e.g. "boxes.csv". */
  fileName(stream: LogStreamName): string;
}

/** Lines of a text, one at a time, without splitting the whole text into an array. */
export async function* linesOfText(text: string): AsyncGenerator<string> {
  let start = 0;
  while (start < text.length) {
    let end = text.indexOf('\n', start);
    if (end < 0) end = text.length;
    yield text.slice(start, end);
    start = end + 1;
  }
}

/** Lines of a stream of text chunks (chunks may split lines anywhere). */
export async function* linesOfChunks(chunks: AsyncIterable<string>): AsyncGenerator<string> {
  let rest = '';
  for await (const chunk of chunks) {
    let text = rest + chunk;
    let start = 0;
    for (let end = text.indexOf('\n'); end >= 0; end = text.indexOf('\n', start)) {
      yield text.slice(start, end);
      start = end + 1;
    }
    rest = text.slice(start);
    text = '';
  }
  if (rest.length > 0) yield rest;
}

async function* oneChunk(text: string): AsyncGenerator<string> {
  yield text;
}

/** Text chunks of a Blob/File (web streams; also in Node 20), decoded as UTF-8. */
export async function* chunksOfBlob(blob: Blob): AsyncGenerator<string> {
  const reader = blob.stream().getReader();
  const decoder = new TextDecoder();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    yield decoder.decode(value, { stream: true });
  }
  const tail = decoder.decode();
  if (tail.length > 0) yield tail;
}

/** A file handed to logSourceFromFiles: its text, or a Blob/File to stream. */
export type LogFile = string | Blob;

/**
 * A LogSource over files keyed by name ("camera.json", "boxes.csv", ...), e.g. files dropped
 * on a page. camera.json and filter.json are read whole (small); CSV files stream.
 * Throws LogLayoutError-free plain errors only for unreadable JSON: validation is replayLog's.
 */
export async function logSourceFromFiles(files: ReadonlyMap<string, LogFile>, name = 'dropped files'): Promise<LogSource> {
  const text = async (file: LogFile | undefined): Promise<string | null> =>
    file === undefined ? null : typeof file === 'string' ? file : await file.text();
  const cameraText = await text(files.get('camera.json'));
  const filterText = await text(files.get('filter.json'));
  const camera = cameraText === null ? undefined : parseJsonFile(cameraText);
  const filter = filterText === null ? undefined : parseJsonFile(filterText);
  return {
    name,
    camera: camera?.value,
    filter: filter === undefined ? null : filter.value,
    cameraLines: camera?.lines,
    filterLines: filter?.lines,
    open(stream) {
      const file = files.get(STREAM_SPECS[stream].file);
      if (file === undefined) return null;
      return typeof file === 'string' ? linesOfText(file) : linesOfChunks(chunksOfBlob(file));
    },
    openChunks(stream) {
      const file = files.get(STREAM_SPECS[stream].file);
      if (file === undefined) return null;
      return typeof file === 'string' ? oneChunk(file) : chunksOfBlob(file);
    },
    fileName: (stream) => STREAM_SPECS[stream].file,
  };
}

/** Invalid JSON passed on as a marker, with where it broke, for a clear message later. */
export class UnparsedJson {
  readonly text: string;
  readonly error: string;
  readonly line: number;
  readonly column: number;
  constructor(text: string, error: string, line: number, column: number) {
    this.text = text;
    this.error = error;
    this.line = line;
    this.column = column;
  }
}

/** JSON text -> value and the line of each field; invalid JSON (also a duplicate key or 1e999) as an UnparsedJson marker. */
export function parseJsonFile(text: string): { value: unknown; lines?: Map<string, number> } {
  try {
    return parseJsonText(text);
  } catch (error) {
    if (error instanceof JsonSyntaxError) return { value: new UnparsedJson(text, error.message, error.line, error.column) };
    throw error;
  }
}
