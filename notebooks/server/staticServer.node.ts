// Node-only: the notebook server. Serves the built page (dist/notebooks), the host HTML and the
// demo data (data-demo/) read-only, on the loopback interface only. Refuses requests whose Host
// is not this server's loopback address and port (DNS-rebinding guard), paths that climb out of
// the served folders (including encoded ../ and backslashes), and anything but GET/HEAD.
// Scripts come from this server only and may not eval: the page's scenario check is generated
// ahead of time (notebooks/scripts/buildScenarioValidator.mjs), not compiled in the browser.
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { createReadStream, promises as fs } from 'node:fs';
import { extname, join, resolve, sep } from 'node:path';
import { hostPageHtml } from '../host/hostPage.js';

export interface StaticServerOptions {
  /** Built page files (app.js, app.css, worker.js). */
  pageDir: string;
  /** Demo data folder served under /data-demo/. */
  demoDir: string;
  /** Port to listen on (0 = any free port). Default 8737. */
  port?: number;
}

export interface RunningServer {
  server: Server;
  port: number;
  url: string;
  close(): Promise<void>;
}

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.csv': 'text/csv; charset=utf-8',
  '.jsonl': 'application/x-ndjson; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.md': 'text/markdown; charset=utf-8',
};

export const SECURITY_HEADERS = {
  'X-Content-Type-Options': 'nosniff',
  'Cache-Control': 'no-store',
  'Content-Security-Policy':
    "default-src 'self'; script-src 'self'; img-src 'self' data: blob:; style-src 'self' 'unsafe-inline'; worker-src 'self'; connect-src 'self'; object-src 'none'; base-uri 'none'; frame-ancestors 'none'",
};

function refuse(res: ServerResponse, status: number, message: string): void {
  res.writeHead(status, { 'Content-Type': 'text/plain; charset=utf-8', ...SECURITY_HEADERS });
  res.end(message + '\n');
}

/** The file a URL path names inside `root`, or null when it would leave `root` or is malformed. */
export function safeFilePath(root: string, urlPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  if (decoded.includes('\0') || decoded.includes('\\')) return null;
  const segments = decoded.split('/');
  if (segments.some((s) => s === '..' || s === '.')) return null;
  const base = resolve(root);
  const full = resolve(base, '.' + (decoded.startsWith('/') ? decoded : '/' + decoded));
  if (full !== base && !full.startsWith(base + sep)) return null;
  return full;
}

async function listDemoLogs(demoDir: string): Promise<{ name: string; files: string[] }[]> {
  const logs: { name: string; files: string[] }[] = [];
  const walk = async (dir: string, rel: string): Promise<void> => {
    let entries;
    try {
      entries = await fs.readdir(dir, { withFileTypes: true });
    } catch {
      return;
    }
    const files = entries.filter((e) => e.isFile()).map((e) => e.name).sort();
    if (files.includes('camera.json')) logs.push({ name: rel, files });
    for (const e of entries) if (e.isDirectory()) await walk(join(dir, e.name), rel ? `${rel}/${e.name}` : e.name);
  };
  await walk(demoDir, '');
  return logs.sort((a, b) => a.name.localeCompare(b.name));
}

export function startStaticServer(options: StaticServerOptions): Promise<RunningServer> {
  let port = options.port ?? 8737;
  const handle = async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    const allowedHosts = [`127.0.0.1:${port}`, `localhost:${port}`];
    const host = req.headers.host;
    if (host === undefined || !allowedHosts.includes(host.toLowerCase())) {
      refuse(res, 403, `refused: Host "${host ?? ''}" is not this server (${allowedHosts[0]})`);
      return;
    }
    if (req.method !== 'GET' && req.method !== 'HEAD') {
      refuse(res, 405, `refused: ${req.method} (this server only reads)`);
      return;
    }
    const rawPath = (req.url ?? '/').split('?')[0]!.split('#')[0]!;
    if (rawPath === '/' || rawPath === '/index.html') {
      const body = hostPageHtml();
      res.writeHead(200, { 'Content-Type': TYPES['.html']!, ...SECURITY_HEADERS });
      res.end(req.method === 'HEAD' ? undefined : body);
      return;
    }
    if (rawPath === '/data-demo/scenarios.json') {
      const names = (await fs.readdir(options.demoDir).catch(() => [] as string[])).filter((n) => n.endsWith('.scenario.json')).sort();
      res.writeHead(200, { 'Content-Type': TYPES['.json']!, ...SECURITY_HEADERS });
      res.end(req.method === 'HEAD' ? undefined : JSON.stringify(names));
      return;
    }
    if (rawPath === '/data-demo/logs.json') {
      const body = JSON.stringify(await listDemoLogs(options.demoDir));
      res.writeHead(200, { 'Content-Type': TYPES['.json']!, ...SECURITY_HEADERS });
      res.end(req.method === 'HEAD' ? undefined : body);
      return;
    }
    const demo = rawPath.startsWith('/data-demo/');
    const root = demo ? options.demoDir : options.pageDir;
    const file = safeFilePath(root, demo ? rawPath.slice('/data-demo'.length) : rawPath);
    if (file === null) {
      refuse(res, 400, 'refused: path leaves the served folder');
      return;
    }
    let stat;
    try {
      // realpath: a symbolic link inside the folder must not lead out of it either.
      const realRoot = await fs.realpath(root);
      const real = await fs.realpath(file);
      if (real !== realRoot && !real.startsWith(realRoot + sep)) {
        refuse(res, 400, 'refused: path leaves the served folder');
        return;
      }
      stat = await fs.stat(real);
    } catch {
      refuse(res, 404, 'not found');
      return;
    }
    if (!stat.isFile()) {
      refuse(res, 404, 'not found');
      return;
    }
    res.writeHead(200, {
      'Content-Type': TYPES[extname(file).toLowerCase()] ?? 'application/octet-stream',
      'Content-Length': stat.size,
      ...SECURITY_HEADERS,
    });
    if (req.method === 'HEAD') res.end();
    else createReadStream(file).pipe(res);
  };

  const server = createServer((req, res) => {
    handle(req, res).catch((error: unknown) => refuse(res, 500, `server error: ${String(error)}`));
  });
  return new Promise((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const address = server.address();
      if (address && typeof address === 'object') port = address.port;
      resolvePromise({
        server,
        port,
        url: `http://127.0.0.1:${port}/`,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
