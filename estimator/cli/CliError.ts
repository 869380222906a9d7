// A user-facing failure: printed without a stack trace, exits with `exitCode`.
// Messages name the file, line and field when there is one.
export class CliError extends Error {
  readonly exitCode: number;
  constructor(message: string, exitCode = 2) {
    super(message);
    this.name = 'CliError';
    this.exitCode = exitCode;
  }
}
