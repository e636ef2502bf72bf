/**
 * `scatterbook serve`: serves the built site on localhost and rebuilds it when
 * a part file changes (the page served then shows the change).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '../..');
let child: ChildProcess | null = null;

afterAll(() => {
  child?.kill('SIGINT'); // serve stops on Ctrl-C
});

async function freePort(): Promise<number> {
  return new Promise((ok) => {
    const s = createServer();
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => ok(port));
    });
  });
}

/** A GET with the path sent exactly as given (fetch would normalize it). */
function rawGet(port: number, path: string): Promise<{ status: number; body: string }> {
  return new Promise((ok, fail) => {
    const req = request({ host: '127.0.0.1', port, path, method: 'GET' }, (res) => {
      let body = '';
      res.on('data', (d) => (body += d));
      res.on('end', () => ok({ status: res.statusCode ?? 0, body }));
    });
    req.on('error', fail);
    req.end();
  });
}

async function until<T>(what: () => Promise<T | null>, ms: number): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await what().catch(() => null);
    if (v !== null) return v;
    if (Date.now() > end) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe('scatterbook serve', () => {
  it('serves the site and rebuilds it when a part file changes', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'scatterbook-serve-'));
    mkdirSync(join(dir, 'content/parts'), { recursive: true });
    cpSync(join(ROOT, 'content/parts/vt-pad-10'), join(dir, 'content/parts/vt-pad-10'), { recursive: true });
    const port = await freePort();
    child = spawn(process.execPath, [join(ROOT, 'bin/scatterbook.js'), 'serve', 'content', '--port', String(port), '--out', 'site'], {
      cwd: dir,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const url = `http://127.0.0.1:${port}/parts/vt-pad-10/index.html`;
    const first = await until(async () => {
      const r = await fetch(url);
      return r.ok ? r.text() : null;
    }, 60_000);
    expect(first).toContain('Fixed attenuator, 10\u00a0dB');
    const yaml = join(dir, 'content/parts/vt-pad-10/part.yaml');
    writeFileSync(
      yaml,
      readFileSync(yaml, 'utf8').replace('title: Fixed attenuator, 10 dB, DC–18 GHz', 'title: Fixed attenuator, 10 dB, edited while serving'),
    );
    const second = await until(async () => {
      const t = await (await fetch(url)).text();
      return t.includes('edited while serving') ? t : null;
    }, 60_000);
    expect(second).toContain('edited while serving');

    // it listens on the loopback address only (read from the kernel's socket table: no traffic leaves the machine)
    const hex = port.toString(16).toUpperCase().padStart(4, '0');
    const listening = readFileSync('/proc/net/tcp', 'utf8')
      .split('\n')
      .filter((l) => l.includes(`:${hex} `) && l.trim().split(/\s+/)[3] === '0A');
    expect(listening.map((l) => l.trim().split(/\s+/)[1])).toEqual([`0100007F:${hex}`]);

    // malformed and escaping paths: 400 or 404, never a file outside the site, and it goes on serving
    for (const [path, status] of [
      ['/%', 400],
      ['/%zz', 400],
      ['/..%2f..%2fetc%2fpasswd', 404],
      ['/../../etc/passwd', 404],
      ['/%2e%2e/%2e%2e/etc/passwd', 404],
      ['/a%00b', 400],
      ['/parts/..%5c..%5cpackage.json', 400],
    ] as const) {
      const r = await rawGet(port, path);
      expect(r.status, path).toBe(status);
      expect(r.body).not.toContain('root:');
    }
    expect((await fetch(url)).status).toBe(200);
  }, 150_000);
});
