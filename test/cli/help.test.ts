// Help conventions (DEVELOPERS.md, "Adding a CLI command"): -h, --help and `alight help <command>`
// print the same text; the usage line names every option; errors carry one prefix.
import { describe, expect, it } from 'vitest';
import { commands } from '../../estimator/cli/commands.js';
import { errorText, main } from '../../estimator/cli/main.js';
import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { fakeIo } from './fakeIo.js';

async function run(...argv: string[]) {
  const io = fakeIo(process.cwd());
  const code = await main(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

describe('help', () => {
  for (const command of commands) {
    it(`${command.name}: -h, --help and help ${command.name} agree, and the usage line names every option`, async () => {
      const long = await run(command.name, '--help');
      expect(long.code).toBe(0);
      expect(long.err).toBe('');
      expect(await run(command.name, '-h')).toEqual(long);
      expect(await run('help', command.name)).toEqual(long);
      const [usage, ...rest] = long.out.split('\n');
      expect(usage).toMatch(new RegExp(`^usage: alight ${command.name} `));
      const options = rest.filter((l) => /^ {2}--[a-z]/.test(l)).map((l) => l.trim().split(/\s/)[0]!);
      expect(options).toContain('--help');
      for (const option of options.filter((o) => o !== '--help')) expect(usage, `${command.name} usage omits ${option}`).toContain(option);
    });
  }

  it('the top-level help lists every command and ends with the caution', async () => {
    const top = await run('--help');
    expect(top.code).toBe(0);
    for (const c of commands) expect(top.out).toContain(`  ${c.name} `);
    expect(top.out.trimEnd().endsWith(SAFETY_CAUTION)).toBe(true);
    expect(await run('help')).toEqual(top);
  });

  it('help of an unknown command, and unknown short options, are refused with exit 2', async () => {
    expect(await run('help', 'fly')).toEqual({ code: 2, out: '', err: 'alight help: unknown command "fly" (alight --help lists them)\n' });
    const short = await run('simulate', '-x');
    expect(short.code).toBe(2);
    expect(short.err).toBe('alight simulate: unknown option -x (options are long, e.g. --help; see alight simulate --help)\n');
  });

  it('every error line carries the command prefix once; indented lines continue the one above', () => {
    expect(errorText('summarize', 'a.jsonl:3: cut off\nalight summarize: done\n  detail')).toBe('alight summarize: a.jsonl:3: cut off\nalight summarize: done\n  detail\n');
  });
});
