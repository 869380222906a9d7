// Output files of the CLI: no command ever writes a file it reads, and no output appears
// half-written under its final name. Node-only (node:fs), like every command.
import { closeSync, existsSync, openSync, readdirSync, realpathSync, renameSync, statSync, unlinkSync, writeFileSync, writeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import type { Scenario } from '../sim/Scenario.js';
import { CliError } from './CliError.js';

/** An output as the user named it: the option (e.g. "--csv"), the text typed, the absolute path. */
export interface OutputTarget {
  option: string;
  name: string;
  path: string;
}

/** The path with every link resolved; a file that does not exist yet by its resolved folder. */
function canonicalPath(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    try {
      return join(realpathSync(dirname(path)), basename(path));
    } catch {
      return resolve(path);
    }
  }
}

/** Same file by real path, or by device and inode (a hard link has another path). */
export function sameFile(a: string, b: string): boolean {
  if (canonicalPath(a) === canonicalPath(b)) return true;
  try {
    const sa = statSync(a);
    const sb = statSync(b);
    return sa.ino !== 0 && sa.dev === sb.dev && sa.ino === sb.ino;
  } catch {
    return false;
  }
}

/** The files in a folder input (a flight log): each is an input an output must not replace. */
export function filesIn(folder: string): string[] {
  try {
    return readdirSync(folder).map((f) => join(folder, f));
  } catch {
    return [];
  }
}

/**
 * Refuse (exit 2) before any work when an output is one of the inputs or two outputs are one
 * file; `inputs` are absolute paths (missing ones are ignored by the identity check).
 */
export function checkOutputs(command: string, outputs: readonly OutputTarget[], inputs: readonly string[]): void {
  for (let i = 0; i < outputs.length; i++) {
    const out = outputs[i]!;
    const input = inputs.find((p) => sameFile(out.path, p));
    if (input !== undefined) {
      throw new CliError(`alight ${command}: ${out.option} ${out.name} is an input of this command (${input}); refusing to overwrite it, choose another file`);
    }
    const twin = outputs.slice(0, i).find((o) => sameFile(o.path, out.path));
    if (twin) throw new CliError(`alight ${command}: ${twin.option} and ${out.option} name the same file (${out.name}); give each output its own file`);
  }
}

/** A temporary name beside `path` (same folder, so the final rename is atomic). */
export function temporaryPath(path: string): string {
  return join(dirname(path), `.${basename(path)}.${process.pid}.partial`);
}

function cannotWrite(command: string, target: OutputTarget, error: unknown): CliError {
  const code = (error as { code?: string }).code ?? String(error);
  return new CliError(`alight ${command}: cannot write ${target.option} ${target.name} (${code})`);
}

/** Write `text` to a temporary file beside the target, then rename it into place. */
export function writeOutput(command: string, target: OutputTarget, text: string): void {
  const temporary = temporaryPath(target.path);
  try {
    writeFileSync(temporary, text);
    renameSync(temporary, target.path);
  } catch (error) {
    if (existsSync(temporary)) unlinkSync(temporary);
    throw cannotWrite(command, target, error);
  }
}

/** A streamed output: chunks go to a temporary file that becomes the target only on `finish`. */
export interface StreamedOutput {
  write(text: string): void;
  /** Rename into place (complete = true) or remove the temporary file (the run failed). */
  finish(complete: boolean): void;
}

export function openOutput(command: string, target: OutputTarget): StreamedOutput {
  const temporary = temporaryPath(target.path);
  let fd: number;
  try {
    fd = openSync(temporary, 'w');
  } catch (error) {
    throw cannotWrite(command, target, error);
  }
  let open = true;
  return {
    write(text) {
      writeSync(fd, text);
    },
    finish(complete) {
      if (!open) return;
      open = false;
      closeSync(fd);
      if (!complete) {
        unlinkSync(temporary);
        return;
      }
      try {
        renameSync(temporary, target.path);
      } catch (error) {
        unlinkSync(temporary);
        throw cannotWrite(command, target, error);
      }
    },
  };
}

/** The OutputTarget of an option value, resolved against the working directory. */
export function outputTarget(option: string, name: string | undefined, cwd: string): OutputTarget | undefined {
  return name === undefined ? undefined : { option, name, path: resolve(cwd, name) };
}

/** The files a scenario reads: the scenario itself and a recorded carrier path's CSV. */
export function scenarioFiles(path: string, scenario: Scenario, cwd: string): string[] {
  const file = resolve(cwd, path);
  const carrierPath = scenario.carrier.path;
  return carrierPath.shape === 'recorded' && carrierPath.file !== undefined ? [file, resolve(dirname(file), carrierPath.file)] : [file];
}
