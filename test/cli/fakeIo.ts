// A fake CommandIo that records what a command prints, for tests calling main() directly.
import type { CommandIo } from '../../estimator/cli/Command.js';

export interface RecordingIo extends CommandIo {
  out: string[];
  err: string[];
}

export function fakeIo(cwd: string, env: Record<string, string | undefined> = {}): RecordingIo {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, stdout: (t) => void out.push(t), stderr: (t) => void err.push(t), interactive: false, cwd, env };
}
