// Stands in for `alight` and `npx alight` while the README test runs the README's examples:
// runs the freshly built CLI (ALIGHT_README_CLI) with the sizes of studies reduced (leanArgs),
// so the examples stay quick on CI. Anything else given to npx is refused: an example must not
// install or fetch.
const [, , name, ...args] = process.argv;
if (name === 'npx' && args[0] !== 'alight') {
  process.stderr.write(`README test: npx ${args.join(' ')} is not an alight command (mark its block \`\`\`sh norun)\n`);
  process.exit(127);
}
const argv = name === 'npx' ? args.slice(1) : args;

/** Value of --name in args, or undefined. */
function option(list, name) {
  const i = list.indexOf(`--${name}`);
  return i >= 0 ? list[i + 1] : undefined;
}

/** Set --name to value (replacing a given one). */
function setOption(list, name, value) {
  const i = list.indexOf(`--${name}`);
  if (i >= 0) list[i + 1] = value;
  else list.push(`--${name}`, value);
}

// Sizes only (and --workers 1 where none is given): trials per point, COUNT of FROM:TO:COUNT ranges, require's probes, tune's
// recorded logs, grid and identified terms.
function leanArgs(list) {
  const out = list.map((a) => (/^[\w.]+=[^:]+:[^:]+:\d+$/.test(a) ? a.replace(/:(\d+)$/, (_, n) => `:${Math.min(Number(n), 3)}`) : a));
  const command = out[0];
  const target = out[1] ?? '';
  // One thread: a worker thread compiles the simulator anew, which costs more than these few trials.
  const onScenario = command !== 'tune' || target.endsWith('.json');
  if (['sweep', 'require', 'sensitivity', 'tune'].includes(command) && onScenario && option(out, 'workers') === undefined) setOption(out, 'workers', '1');
  if (command === 'sweep' || command === 'sensitivity') setOption(out, 'trials', String(Math.min(Number(option(out, 'trials') ?? 2), 2)));
  if (command === 'require') {
    setOption(out, 'trials', '40');
    setOption(out, 'first-batch', '40');
    setOption(out, 'steps', '1');
  }
  if (command === 'tune') {
    if (option(out, 'free') === undefined) setOption(out, 'free', 'pixelNoise');
    if (target.endsWith('.json')) {
      setOption(out, 'logs', '1');
      setOption(out, 'trials', '2');
      setOption(out, 'grid', '2');
    }
  }
  return out;
}

process.argv = [process.argv[0], process.env.ALIGHT_README_CLI, ...(argv[0] === '--help' || argv.includes('--help') ? argv : leanArgs(argv))];
await import(process.env.ALIGHT_README_CLI);
