/**
 * Printing datasheet pages to PDF in a real Chromium-family browser, headless
 * (the only browser code in scatterbook). One browser for the whole build, a
 * small pool of pages, every PDF written atomically. Pages may load only
 * files inside the build folder: every other request (the network, other
 * files) is refused and reported, and the page still prints.
 */
import { mkdtempSync, realpathSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { availableParallelism, tmpdir } from 'node:os';
import { join, relative, isAbsolute } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import puppeteer, { type Browser, type Page } from 'puppeteer-core';
import { writeFileAtomic } from '../io/atomic.js';
import { EnvironmentFault } from '../io/fault.js';
import type { FoundBrowser } from './discover.js';
import { setPdfMetadata, type PdfMetadata } from './metadata.js';

export interface PrintJob {
  /** The HTML page inside the build folder. */
  readonly html: string;
  /** Where its PDF goes. */
  readonly pdf: string;
  readonly metadata: PdfMetadata;
  readonly header: { readonly left: string; readonly right: string };
  readonly footer: string;
}

export interface PrintOptions {
  readonly paper: 'A4' | 'Letter';
  /**
   * Where the site is published (site.yaml base-url). Links inside the PDF
   * point there; when it is not an absolute http(s) address, links between
   * pages are dropped from the PDF (a local file path would only leak the
   * build machine's folders and change with every build).
   */
  readonly publicBase: string;
  /** Pages printed at once (default: from the core count, 2 to 4). */
  readonly pages?: number;
  readonly onDone?: (done: number, total: number) => void;
}

export interface PrintReport {
  readonly printed: number;
  /** Requests refused, with the page that made them. */
  readonly refused: ReadonlyArray<{ readonly page: string; readonly url: string }>;
  readonly browserVersion: string;
  readonly launchMs: number;
  readonly printMs: number;
}

/** The flags that keep a headless browser offline and quiet, with a fresh profile. */
export function launchArgs(profile: string): string[] {
  const args = [
    '--disable-gpu',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    '--no-first-run',
    '--disable-quic',
    '--disable-default-apps',
    '--mute-audio',
    `--user-data-dir=${profile}`,
  ];
  // the sandbox cannot start as root; everywhere else it stays on
  if (process.getuid?.() === 0) args.push('--no-sandbox');
  return args;
}

/**
 * All of the browser's network traffic, loopback included, goes to a proxy
 * that answers nothing. Request interception refuses what a page asks for,
 * but WebSocket connections pass it; through this proxy they reach nothing.
 */
export function proxyArgs(port: number): string[] {
  return [`--proxy-server=http://127.0.0.1:${port}`, '--proxy-bypass-list=<-loopback>'];
}

/** A local server that closes every connection at once: the browser's only way out. */
function deadEnd(): Promise<{ port: number; close(): void }> {
  return new Promise((ok, fail) => {
    const server = createServer((socket) => socket.destroy());
    server.on('error', fail);
    server.listen(0, '127.0.0.1', () => {
      server.unref();
      ok({ port: (server.address() as { port: number }).port, close: () => server.close() });
    });
  });
}

/** How long a browser may take to start and answer before the build gives up on it. */
export const LAUNCH_TIMEOUT_MS = 20_000;

/**
 * Starts the browser over a pipe rather than a port, so that it ends when
 * scatterbook does, however scatterbook ends (Chromium quits when its end of
 * the pipe closes). A browser that cannot start, or does not answer within
 * LAUNCH_TIMEOUT_MS, is an EnvironmentFault naming its path.
 */
async function launch(found: FoundBrowser, profile: string, proxyPort: number): Promise<Browser> {
  const abort = new AbortController();
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => {
      abort.abort();
      reject(
        new EnvironmentFault(
          `the browser ${found.path} did not answer within ${LAUNCH_TIMEOUT_MS / 1000} s; is it a Chromium-family browser? (--browser or SCATTERBOOK_BROWSER names another)`,
        ),
      );
    }, LAUNCH_TIMEOUT_MS);
  });
  try {
    return await Promise.race([
      puppeteer.launch({
        executablePath: found.path,
        headless: true,
        pipe: true,
        args: [...found.args, ...launchArgs(profile), ...proxyArgs(proxyPort)],
        timeout: LAUNCH_TIMEOUT_MS,
        protocolTimeout: 180_000,
        signal: abort.signal,
      }),
      timeout,
    ]);
  } catch (e) {
    if (e instanceof EnvironmentFault) throw e;
    const text = String((e as Error).message ?? e);
    const first = /Target closed|Connection closed/.test(text) ? 'it exited before it answered' : (text.split('\n').find((l) => l.trim()) ?? 'it exited');
    throw new EnvironmentFault(
      `the browser ${found.path} could not start: ${first.trim()}; --browser or SCATTERBOOK_BROWSER names another, --no-pdf builds without PDFs`,
    );
  } finally {
    clearTimeout(timer);
  }
}

function insideFolder(root: string, url: string): boolean {
  if (url.startsWith('data:') || url === 'about:blank') return true;
  if (!url.startsWith('file:')) return false;
  let path: string;
  try {
    path = realpathSync(fileURLToPath(url.split('#')[0].split('?')[0]));
  } catch {
    return false; // a file that does not exist is refused like any other
  }
  const rel = relative(root, path);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/** Page-side: file: links become links to the published site, or plain text when it has no absolute address. */
function linkRewrite(rootUrl: string, publicBase: string): string {
  const absolute = publicBase.startsWith('http://') || publicBase.startsWith('https://');
  const base = publicBase.endsWith('/') ? publicBase : `${publicBase}/`;
  return `(() => {
    const root = ${JSON.stringify(rootUrl)}, base = ${JSON.stringify(base)}, absolute = ${absolute};
    for (const a of Array.from(document.querySelectorAll('a[href]'))) {
      const url = a.href;
      if (!url.startsWith('file:')) continue;
      if (absolute && url.startsWith(root)) a.setAttribute('href', base + url.slice(root.length));
      else a.removeAttribute('href');
    }
  })()`;
}

async function printOne(page: Page, job: PrintJob, options: PrintOptions, rootUrl: string): Promise<void> {
  await page.goto(pathToFileURL(job.html).href, { waitUntil: 'load', timeout: 60_000 });
  await page.evaluate(linkRewrite(rootUrl, options.publicBase));
  // wait for the fonts (a function body as text: this module compiles without the DOM library)
  await page.evaluate('document.fonts.ready.then(() => undefined)');
  const bytes = await page.pdf({
    format: options.paper,
    printBackground: true,
    displayHeaderFooter: false, // the running header and footer are drawn afterwards, in the page's typeface (running.ts)
    margin: { top: '18mm', bottom: '16mm', left: '15mm', right: '15mm' },
    outline: true,
    tagged: true,
    timeout: 60_000,
  });
  writeFileAtomic(job.pdf, await setPdfMetadata(bytes, job.metadata, { header: job.header, footer: job.footer }));
}

export async function printAll(found: FoundBrowser, root: string, jobs: readonly PrintJob[], options: PrintOptions): Promise<PrintReport> {
  const realRoot = realpathSync(root);
  const rootUrl = pathToFileURL(root).href.replace(/\/?$/, '/');
  const profile = mkdtempSync(join(tmpdir(), 'scatterbook-browser-'));
  const t0 = performance.now();
  let browser: Browser | null = null;
  let sink: { port: number; close(): void } | null = null;
  const refused: Array<{ page: string; url: string }> = [];
  try {
    sink = await deadEnd();
    browser = await launch(found, profile, sink.port);
    const version = await browser.version();
    const t1 = performance.now();
    const size = Math.max(1, Math.min(jobs.length, options.pages ?? Math.min(4, Math.max(2, availableParallelism()))));
    let next = 0,
      done = 0;
    const worker = async () => {
      const page = await (browser as Browser).newPage();
      await page.setRequestInterception(true);
      let current = '';
      page.on('request', (req) => {
        const url = req.url();
        if (insideFolder(realRoot, url)) void req.continue();
        else {
          refused.push({ page: current, url });
          void req.abort('blockedbyclient');
        }
      });
      // WebSockets pass request interception: the dead-end proxy stops them, this reports them
      const cdp = await page.createCDPSession();
      cdp.on('Network.webSocketCreated', (e: { url: string }) => refused.push({ page: current, url: e.url }));
      await cdp.send('Network.enable');
      while (next < jobs.length) {
        const job = jobs[next++];
        current = relative(root, job.html);
        await printOne(page, job, options, rootUrl);
        done++;
        options.onDone?.(done, jobs.length);
      }
      await page.close();
    };
    await Promise.all(Array.from({ length: size }, worker));
    return { printed: done, refused, browserVersion: version, launchMs: t1 - t0, printMs: performance.now() - t1 };
  } finally {
    await browser?.close();
    sink?.close();
    rmSync(profile, { recursive: true, force: true });
  }
}
