// Entry of the `alight` command: dispatch, help, and the one place errors become messages.
// Every error line starts with "alight <command>: " (file positions follow it as file:line:column).
import { CliError } from './CliError.js';
import type { CommandIo } from './Command.js';
import { commands } from './commands.js';
import { VERSION } from '../version.js';
import { SAFETY_CAUTION } from '../safetyCaution.js';

function topLevelHelp(): string {
  const width = Math.max(...commands.map((c) => c.name.length)) + 2;
  return (
    `alight ${VERSION}: camera-based landing on a moving carrier: estimate, simulate, study, replay\n\n` +
    `usage: alight <command> [options]   (alight <command> --help, or alight help <command>, for its options)\n\ncommands:\n` +
    commands.map((c) => `  ${c.name.padEnd(width)}${c.purpose}`).join('\n') +
    `\n\n${SAFETY_CAUTION}\n`
  );
}

/** Prefix every line of an error that does not carry one yet (indented lines continue the one above). */
export function errorText(command: string, message: string): string {
  const prefix = `alight ${command}: `;
  return message
    .split('\n')
    .map((line) => (line === '' || line.startsWith('alight ') || /^\s/.test(line) ? line : prefix + line))
    .join('\n') + '\n';
}

export async function main(argv: string[], io: CommandIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || (name === 'help' && rest.length === 0)) {
    io.stdout(topLevelHelp());
    return name === undefined ? 2 : 0;
  }
  if (name === '--version') {
    io.stdout(`${VERSION}\n`);
    return 0;
  }
  if (name === 'help') {
    const topic = commands.find((c) => c.name === rest[0]);
    if (!topic || rest.length > 1) {
      io.stderr(`alight help: unknown command "${rest.join(' ')}" (alight --help lists them)\n`);
      return 2;
    }
    return main([topic.name, '--help'], io);
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    io.stderr(`alight: unknown command "${name}" (alight --help lists them)\n`);
    return 2;
  }
  try {
    return await command.run(rest, io);
  } catch (error) {
    if (error instanceof CliError) {
      io.stderr(errorText(name, error.message));
      return error.exitCode;
    }
    if (error && typeof error === 'object' && 'code' in error && (error as { code: unknown }).code === 'ENOENT') {
      io.stderr(errorText(name, String((error as { message?: unknown }).message)));
      return 2;
    }
    io.stderr(`alight ${name}: internal error (please report): ${(error as Error)?.stack ?? String(error)}\n`);
    return 70;
  }
}
