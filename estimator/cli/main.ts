// Entry of the `alight` command: dispatch, help, and the one place errors become messages.
import { CliError } from './CliError.js';
import type { CommandIo } from './Command.js';
import { commands } from './commands.js';
import { VERSION } from '../version.js';

export async function main(argv: string[], io: CommandIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    const width = Math.max(...commands.map((c) => c.name.length)) + 2;
    io.stdout(
      `alight ${VERSION}: camera-based landing on a moving carrier: estimate, simulate, study, replay\n\n` +
        `usage: alight <command> [options]   (alight <command> --help for its options)\n\ncommands:\n` +
        commands.map((c) => `  ${c.name.padEnd(width)}${c.purpose}`).join('\n') +
        '\n\nSimulation results clear nothing for flight: fly under local aviation rules and licensed practice.\n',
    );
    return name === undefined ? 2 : 0;
  }
  if (name === '--version') {
    io.stdout(`${VERSION}\n`);
    return 0;
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
      io.stderr(`${error.message}\n`);
      return error.exitCode;
    }
    if (error && typeof error === 'object' && 'code' in error && (error as { code: unknown }).code === 'ENOENT') {
      io.stderr(`alight ${name}: ${String((error as { message?: unknown }).message)}\n`);
      return 2;
    }
    io.stderr(`alight ${name}: internal error: ${(error as Error)?.stack ?? String(error)}\n`);
    return 70;
  }
}
