// Node-only adapter: a LogTextSink that writes each file of a log into a folder (created if
// missing), appending chunks with synchronous writes (runTrial is synchronous).
import { closeSync, existsSync, mkdirSync, openSync, writeSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { LogTextSink } from './LogRecorder.js';

export function folderSink(folder: string): LogTextSink {
  // Plain mkdir when the parent exists: Node's recursive mkdir can spin forever on special
  // file systems (/proc), and the plain one reports the real error.
  if (!existsSync(folder)) mkdirSync(folder, { recursive: !existsSync(dirname(folder)) });
  const fds = new Map<string, number>();
  const fdOf = (file: string): number => {
    let fd = fds.get(file);
    if (fd === undefined) {
      fd = openSync(join(folder, file), 'w');
      fds.set(file, fd);
    }
    return fd;
  };
  return {
    write(file, text) {
      writeSync(fdOf(file), text);
    },
    writeBytes(file, bytes) {
      writeSync(fdOf(file), bytes);
    },
    close() {
      for (const fd of fds.values()) closeSync(fd);
      fds.clear();
    },
  };
}
