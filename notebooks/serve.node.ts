// Node-only entry of `npm start` (bundled to dist/serve.mjs): serves the notebook page built by
// build.mjs and the demo data on 127.0.0.1 and prints the address. Port: --port N, else $PORT,
// else 8737; a busy port moves to the next one (ten tries).
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { startStaticServer } from './server/staticServer.node.js';
import { SAFETY_CAUTION } from '../estimator/safetyCaution.js';

const repo = join(dirname(fileURLToPath(import.meta.url)), '..');
const pageDir = join(repo, 'dist', 'notebooks');
const demoDir = join(repo, 'data-demo');

function requestedPort(argv: string[]): number {
  const i = argv.indexOf('--port');
  const text = i >= 0 ? argv[i + 1] : process.env.PORT;
  if (text === undefined || text === '') return 8737;
  const port = Number(text);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    process.stderr.write(`alight notebooks: port must be a whole number 0..65535, got "${text}"\n`);
    process.exit(2);
  }
  return port;
}

async function serve(): Promise<void> {
  if (!existsSync(join(pageDir, 'app.js'))) {
    process.stderr.write(`alight notebooks: ${pageDir}/app.js is missing; run "node build.mjs" first\n`);
    process.exit(2);
  }
  const first = requestedPort(process.argv.slice(2));
  for (let attempt = 0; attempt < 10; attempt++) {
    try {
      const running = await startStaticServer({ pageDir, demoDir, port: first === 0 ? 0 : first + attempt });
      process.stdout.write(`alight notebooks: ${running.url}  (Ctrl-C stops)\n`);
      process.stdout.write(`${SAFETY_CAUTION}\n`);
      return;
    } catch (error) {
      if ((error as { code?: string }).code !== 'EADDRINUSE') throw error;
    }
  }
  process.stderr.write(`alight notebooks: ports ${first}..${first + 9} are all busy; try --port 0\n`);
  process.exit(2);
}

serve().catch((error: unknown) => {
  process.stderr.write(`alight notebooks: ${String(error)}\n`);
  process.exit(1);
});
