// Node entry point bundled to dist/alight.mjs.
import { main } from './main.js';

const io = {
  stdout: (text: string) => void process.stdout.write(text),
  stderr: (text: string) => void process.stderr.write(text),
  interactive: Boolean(process.stderr.isTTY),
  cwd: process.cwd(),
  env: process.env,
};

main(process.argv.slice(2), io).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(`alight: ${String(error)}\n`);
    process.exitCode = 70;
  },
);
