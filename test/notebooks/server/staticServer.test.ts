import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SECURITY_HEADERS, safeFilePath, startStaticServer, type RunningServer } from '../../../notebooks/server/staticServer.node.js';

interface Reply {
  status: number;
  type: string;
  body: string;
}

/** A raw request: the path is sent as written (no URL normalisation), the Host header as given. */
function get(port: number, path: string, host: string | null, method = 'GET'): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const headers: Record<string, string> = host === null ? {} : { Host: host };
    const req = request({ host: '127.0.0.1', port, path, method, headers, setHost: false }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (chunk: string) => (body += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, type: String(res.headers['content-type'] ?? ''), body }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('startStaticServer', () => {
  let root: string;
  let server: RunningServer;
  let host: string;

  beforeAll(async () => {
    root = mkdtempSync(join(tmpdir(), 'alight-serve-'));
    mkdirSync(join(root, 'page'));
    mkdirSync(join(root, 'demo', 'flight-a'), { recursive: true });
    writeFileSync(join(root, 'page', 'app.js'), 'console.log("page");\n');
    writeFileSync(join(root, 'demo', 'flight-a', 'camera.json'), '{}\n');
    writeFileSync(join(root, 'demo', 'flight-a', 'boxes.csv'), 'time\n');
    writeFileSync(join(root, 'demo', 'truck.scenario.json'), '{}\n');
    writeFileSync(join(root, 'secret.txt'), 'not for the browser\n');
    symlinkSync(join(root, 'secret.txt'), join(root, 'page', 'leak.txt'));
    server = await startStaticServer({ pageDir: join(root, 'page'), demoDir: join(root, 'demo'), port: 0 });
    host = `127.0.0.1:${server.port}`;
  });

  afterAll(async () => {
    await server.close();
    rmSync(root, { recursive: true, force: true });
  });

  it('sends a Content-Security-Policy that allows scripts from itself only, without eval', async () => {
    const reply = await fetch(`http://${host}/`);
    const csp = reply.headers.get('content-security-policy') ?? '';
    const scripts = csp.split(';').map((d) => d.trim()).find((d) => d.startsWith('script-src'));
    expect(scripts).toBe("script-src 'self'");
    expect(csp).not.toContain('unsafe-eval');
    expect(SECURITY_HEADERS['Content-Security-Policy']).toBe(csp);
  });

  it('serves the host page and the built files to its own loopback address', async () => {
    const page = await get(server.port, '/', host);
    expect(page.status).toBe(200);
    expect(page.type).toBe('text/html; charset=utf-8');
    expect(page.body).toContain('<script type="module" src="/app.js"></script>');
    const app = await get(server.port, '/app.js', `localhost:${server.port}`);
    expect(app).toEqual({ status: 200, type: 'text/javascript; charset=utf-8', body: 'console.log("page");\n' });
  });

  it('lists and serves the demo scenarios and logs', async () => {
    const list = await get(server.port, '/data-demo/logs.json', host);
    expect(JSON.parse(list.body)).toEqual([{ name: 'flight-a', files: ['boxes.csv', 'camera.json'] }]);
    expect((await get(server.port, '/data-demo/flight-a/boxes.csv', host)).body).toBe('time\n');
    expect(JSON.parse((await get(server.port, '/data-demo/scenarios.json', host)).body)).toEqual(['truck.scenario.json']);
  });

  it('refuses requests whose Host is not its loopback address and port', async () => {
    for (const foreign of ['evil.example', `evil.example:${server.port}`, `127.0.0.1:${server.port + 1}`, `192.168.1.5:${server.port}`]) {
      const reply = await get(server.port, '/', foreign);
      expect(reply.status, foreign).toBe(403);
      expect(reply.body, foreign).toContain('is not this server');
    }
    // Without any Host, Node's HTTP parser itself answers 400 (HTTP/1.1 requires the header).
    const bare = await get(server.port, '/', null);
    expect(bare.status).toBe(400);
    expect(bare.body).not.toContain('/app.js');
  });

  it('refuses paths that leave the served folders, however they are spelled', async () => {
    for (const path of ['/../secret.txt', '/%2e%2e/secret.txt', '/%2E%2E%2Fsecret.txt', '/..%5csecret.txt', '/data-demo/../secret.txt', '/data-demo/%2e%2e/%2e%2e/secret.txt', '/app.js%00.txt', '/%E0%A4%A']) {
      const reply = await get(server.port, path, host);
      expect(reply.status, path).toBe(400);
      expect(reply.body, path).not.toContain('not for the browser');
    }
  });

  it('does not follow a symbolic link out of the served folder', async () => {
    const reply = await get(server.port, '/leak.txt', host);
    expect(reply.status).toBe(400);
    expect(reply.body).not.toContain('not for the browser');
  });

  it('answers 404 for missing files and 405 for writes', async () => {
    expect((await get(server.port, '/nothing.js', host)).status).toBe(404);
    expect((await get(server.port, '/app.js', host, 'POST')).status).toBe(405);
    expect((await get(server.port, '/app.js', host, 'DELETE')).status).toBe(405);
  });
});

describe('safeFilePath', () => {
  it('keeps paths inside the root and refuses the rest', () => {
    expect(safeFilePath('/srv/page', '/app.js')).toBe('/srv/page/app.js');
    expect(safeFilePath('/srv/page', '/a%20b/c.js')).toBe('/srv/page/a b/c.js');
    expect(safeFilePath('/srv/page', '/../x')).toBeNull();
    expect(safeFilePath('/srv/page', '/a/./b')).toBeNull();
    expect(safeFilePath('/srv/page', '/a%5c..%5cb')).toBeNull();
  });
});
