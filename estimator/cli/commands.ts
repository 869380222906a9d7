// The command list: one import and one entry per command, in the order --help shows them.
import type { Command } from './Command.js';

export const commands: Command[] = [];
