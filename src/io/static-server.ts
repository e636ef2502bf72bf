/**
 * A small static file server for previewing a built site: files of the site
 * folder only (links out of it are never followed), malformed paths answered
 * with 400 while it goes on serving, and a live-reload channel (server-sent
 * events) that a script added to every HTML page listens on.
 */
import { createReadStream, realpathSync, statSync } from 'node:fs';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { extname, join } from 'node:path';
import { within } from './output-folder.js';

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.jpg': 'image/jpeg',
  '.jpeg': 'image/jpeg',
  '.gif': 'image/gif',
  '.webp': 'image/webp',
  '.woff2': 'font/woff2',
  '.pdf': 'application/pdf',
  '.txt': 'text/plain; charset=utf-8',
  '.csv': 'text/csv; charset=utf-8',
};

/** The path under the site a request names, or a status to answer with. Pure: no file access. */
export function requestPath(url: string | undefined): { path: string } | { status: 400 | 404; why: string } {
  const raw = (url ?? '/').split('?')[0].split('#')[0];
  let decoded: string;
  try {
    decoded = decodeURIComponent(raw);
  } catch {
    return { status: 400, why: 'the path is not valid percent-encoding' };
  }
  if (!decoded.startsWith('/') || decoded.includes('\0') || decoded.includes('\\')) return { status: 400, why: 'the path is malformed' };
  const segments = decoded.split('/').filter((s) => s !== '' && s !== '.');
  if (segments.includes('..')) return { status: 404, why: 'outside the site' };
  return { path: segments.join('/') + (decoded.endsWith('/') && segments.length ? '/' : '') };
}

export const RELOAD_PATH = '/.scatterbook/reload';
const RELOAD_SCRIPT = `<script>new EventSource(${JSON.stringify(RELOAD_PATH)}).onmessage = () => location.reload();</script>`;

export interface PreviewServer {
  readonly server: Server;
  /** Tells every open page to reload. */
  reload(): void;
  close(): Promise<void>;
}

export function previewServer(root: string): PreviewServer {
  const clients = new Set<ServerResponse>();
  const answer = (res: ServerResponse, status: number, text: string) => {
    res.writeHead(status, { 'content-type': 'text/plain; charset=utf-8' });
    res.end(`${text}\n`);
  };
  const handle = (req: IncomingMessage, res: ServerResponse) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return answer(res, 405, 'only GET and HEAD');
    if (req.url === RELOAD_PATH) {
      res.writeHead(200, { 'content-type': 'text/event-stream', 'cache-control': 'no-store' });
      res.write(': connected\n\n');
      clients.add(res);
      req.on('close', () => clients.delete(res));
      return;
    }
    const p = requestPath(req.url);
    if ('status' in p) return answer(res, p.status, p.status === 400 ? `bad request: ${p.why}` : 'not found');
    let file: string;
    let real: string;
    try {
      const site = realpathSync(root);
      file = join(site, p.path);
      if (statSync(file).isDirectory()) file = join(file, 'index.html');
      real = realpathSync(file);
      if (!within(site, real) || !statSync(real).isFile()) return answer(res, 404, 'not found');
    } catch {
      return answer(res, 404, 'not found');
    }
    const type = TYPES[extname(real).toLowerCase()] ?? 'application/octet-stream';
    res.writeHead(200, { 'content-type': type, 'cache-control': 'no-store', 'x-content-type-options': 'nosniff' });
    if (req.method === 'HEAD') return res.end();
    if (type.startsWith('text/html')) {
      const chunks: Buffer[] = [];
      createReadStream(real)
        .on('data', (c) => chunks.push(c as Buffer))
        .on('error', () => res.destroy())
        .on('end', () => {
          const html = Buffer.concat(chunks).toString('utf8');
          res.end(html.includes('</body>') ? html.replace('</body>', `${RELOAD_SCRIPT}</body>`) : html + RELOAD_SCRIPT);
        });
      return;
    }
    createReadStream(real)
      .on('error', () => res.destroy())
      .pipe(res);
  };
  const server = createServer((req, res) => {
    try {
      handle(req, res);
    } catch {
      if (!res.headersSent) answer(res, 500, 'internal error');
      else res.destroy();
    }
  });
  server.on('clientError', (_, socket) => socket.destroy());
  return {
    server,
    reload() {
      for (const c of clients) c.write('data: reload\n\n');
    },
    close() {
      for (const c of clients) c.end();
      return new Promise((ok) => server.close(() => ok()));
    },
  };
}
