// One CLI command: a name, a one-line purpose for `alight --help`, and a runner.
// Runners print to the given streams and return an exit code; they hold no computation.
export interface CommandIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** True when stderr is a terminal (progress bars only then). */
  interactive: boolean;
  cwd: string;
  env: Record<string, string | undefined>;
}

export interface Command {
  name: string;
  purpose: string;
  run(argv: string[], io: CommandIo): Promise<number>;
}
