// Tiny argument parser shared by every command: long options only, repeatable options
// collected into arrays, unknown options refused with a message (exit 2).
import { CliError } from './CliError.js';

export interface OptionSpec {
  /** Option name without dashes, e.g. "seed". */
  name: string;
  /** 'flag' takes no value; 'value' takes one; 'list' is repeatable. */
  kind: 'flag' | 'value' | 'list';
  /** One-line description for --help, with the value's unit or form. */
  help: string;
  valueName?: string;
}

/** The --help flag every command takes (also -h). */
export const HELP_OPTION: OptionSpec = { name: 'help', kind: 'flag', help: 'show this help (also -h)' };

export interface ParsedArgs {
  positional: string[];
  flags: Set<string>;
  values: Map<string, string>;
  lists: Map<string, string[]>;
}

export function parseArgs(command: string, argv: readonly string[], specs: readonly OptionSpec[]): ParsedArgs {
  const byName = new Map(specs.map((s) => [s.name, s]));
  const parsed: ParsedArgs = { positional: [], flags: new Set(), values: new Map(), lists: new Map() };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    // -h is the one short option (help, on every command); other short forms are refused
    // rather than taken for a file name.
    if (arg === '-h' && byName.has('help')) {
      parsed.flags.add('help');
      continue;
    }
    if (/^-[^-]/.test(arg) && !/^-\d/.test(arg)) throw new CliError(`alight ${command}: unknown option ${arg} (options are long, e.g. --help; see alight ${command} --help)`);
    if (!arg.startsWith('--') || arg === '--') {
      parsed.positional.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = eq > 0 ? arg.slice(2, eq) : arg.slice(2);
    const spec = byName.get(name);
    if (!spec) throw new CliError(`alight ${command}: unknown option --${name} (see alight ${command} --help)`);
    if (spec.kind === 'flag') {
      if (eq > 0) throw new CliError(`alight ${command}: --${name} takes no value`);
      parsed.flags.add(name);
      continue;
    }
    let value: string | undefined;
    if (eq > 0) value = arg.slice(eq + 1);
    else {
      value = argv[i + 1];
      i++;
    }
    if (value === undefined) throw new CliError(`alight ${command}: --${name} needs a value (${spec.valueName ?? 'VALUE'})`);
    if (spec.kind === 'value') parsed.values.set(name, value);
    else parsed.lists.set(name, [...(parsed.lists.get(name) ?? []), value]);
  }
  return parsed;
}

/** A number option, checked: names the option and the bad text on failure. */
export function numberOption(command: string, parsed: ParsedArgs, name: string, fallback: number, check?: (v: number) => boolean, expected?: string): number {
  const text = parsed.values.get(name);
  if (text === undefined) return fallback;
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value) || (check && !check(value))) {
    throw new CliError(`alight ${command}: --${name} expects ${expected ?? 'a number'}, got "${text}"`);
  }
  return value;
}

export function formatHelp(usage: string, purpose: string, specs: readonly OptionSpec[]): string {
  const lines = [`usage: ${usage}`, '', purpose, ''];
  if (specs.length > 0) {
    lines.push('options:');
    const left = specs.map((s) => `  --${s.name}${s.kind === 'flag' ? '' : ` ${s.valueName ?? 'VALUE'}`}`);
    const width = Math.max(...left.map((l) => l.length)) + 2;
    specs.forEach((s, i) => lines.push(left[i]!.padEnd(width) + s.help + (s.kind === 'list' ? ' (repeatable)' : '')));
  }
  return lines.join('\n') + '\n';
}
