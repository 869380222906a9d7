// A log folder written in full before it gets its name: `record` and `ingest` write into a
// hidden staging folder beside the target and move the files in only when every file is
// complete, so a kill or a failure mid-way never leaves a half-written log that looks finished
// (replay would read it as a short flight). Node-only, like every command.
import { existsSync, mkdirSync, readdirSync, renameSync, rmdirSync, rmSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/** The staging folder beside `folder` (same file system, so the moves are renames). */
export function stagingFolder(folder: string): string {
  return join(dirname(folder), `.${basename(folder)}.${process.pid}.partial`);
}

/**
 * A fresh, empty staging folder for `folder`; its parent is created when missing.
 * @example const staging = startStaging('/logs/run1') // '/logs/.run1.4242.partial'
 */
export function startStaging(folder: string): string {
  const staging = stagingFolder(folder);
  rmSync(staging, { recursive: true, force: true });
  // Plain mkdir when the parent exists: recursive mkdir only where it is needed.
  mkdirSync(staging, { recursive: !existsSync(dirname(folder)) });
  return staging;
}

/**
 * Move a complete staged log into `folder`: a new folder is one rename; an existing one loses
 * its old log files (`logFiles`, so no stale truth.csv survives --force) and receives the new.
 */
export function commitStaging(staging: string, folder: string, logFiles: readonly string[]): void {
  if (!existsSync(folder)) {
    renameSync(staging, folder);
    return;
  }
  for (const f of logFiles) rmSync(join(folder, f), { force: true });
  for (const f of readdirSync(staging)) renameSync(join(staging, f), join(folder, f));
  rmdirSync(staging);
}

/** Remove a staging folder after a failure; the target folder is left as it was. */
export function discardStaging(staging: string): void {
  rmSync(staging, { recursive: true, force: true });
}
