/**
 * `scatterbook serve [CONTENT_DIR] [--port N] [--host ADDRESS] [--out DIR]`:
 * builds the site (as `build --keep-going --no-pdf` would: parts with errors
 * are listed on the index instead of stopping the preview), serves it on this
 * machine only (127.0.0.1 unless --host says otherwise), and rebuilds it and
 * reloads the open pages when anything in the content folder changes.
 */
import { watch } from 'node:fs';
import { relative, resolve } from 'node:path';
import { previewServer } from '../io/static-server.js';
import { parseArgs, UsageError, type FlagSpec } from './args.js';
import { buildOptionsOf, runBuild, BUILD_FLAGS } from './build-command.js';
import { EXIT, type Command } from './command.js';
import { painter } from './terminal.js';

const FLAGS: FlagSpec[] = [
  { name: 'port', value: true, help: 'the port (default 8080)' },
  { name: 'host', value: true, help: 'the address to listen on (default 127.0.0.1: this machine only)' },
  ...BUILD_FLAGS.filter((f) => ['out', 'no-cache', 'cache'].includes(f.name)),
];

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1']);

export const serveCommand: Command = {
  name: 'serve',
  usage: 'scatterbook serve [CONTENT_DIR] [--port N] [--host ADDRESS] [--out DIR] [--no-cache] [--cache DIR]',
  flags: FLAGS,
  async run(argv, t) {
    const args = parseArgs(argv, FLAGS);
    const portText = (args.flags.get('port') as string | undefined) ?? '8080';
    const port = Number(portText);
    if (!Number.isInteger(port) || port < 1 || port > 65535) throw new UsageError(`--port needs a port number 1–65535, got "${portText}"`);
    const host = (args.flags.get('host') as string | undefined) ?? '127.0.0.1';
    const p = painter(t.stderr, t.env);
    const o = { ...buildOptionsOf(args, t), keepGoing: true, pdf: 'off' as const };
    const first = await runBuild(o, t);
    if (first.parts === 0 && first.code !== 0) return EXIT.badInput;
    if (!LOOPBACK.has(host))
      t.stderr.write(`${p.yellow('warning:')} --host ${host}: the preview is reachable from other machines on that network, without any access control\n`);
    const preview = previewServer(o.out);
    try {
      await new Promise<void>((ok, fail) => {
        preview.server.once('error', fail);
        preview.server.listen(port, host, () => ok());
      });
    } catch (e) {
      t.stderr.write(
        `${p.red('error:')} cannot listen on ${host}:${port}: ${(e as NodeJS.ErrnoException).code === 'EADDRINUSE' ? 'the port is in use (--port N picks another)' : (e as Error).message}\n`,
      );
      return EXIT.badInput;
    }
    const shownHost = host.includes(':') ? `[${host}]` : host;
    t.stdout.write(
      `serving ${relative(t.cwd, o.out) || '.'}/ at http://${shownHost}:${port}/ — watching ${relative(t.cwd, o.content) || '.'}/ (Ctrl-C stops)\n`,
    );

    // rebuild on change, one build at a time, changes during a build starting one more
    let timer: NodeJS.Timeout | undefined;
    let building = false;
    let again = false;
    const rebuild = async () => {
      if (building) {
        again = true;
        return;
      }
      building = true;
      try {
        await runBuild(o, t);
        preview.reload();
      } catch (e) {
        t.stderr.write(`${p.red('error:')} the rebuild failed: ${(e as Error).message}; still serving the previous site\n`);
      } finally {
        building = false;
        if (again) {
          again = false;
          void rebuild();
        }
      }
    };
    const watcher = watch(resolve(o.content), { recursive: true }, () => {
      clearTimeout(timer);
      timer = setTimeout(() => void rebuild(), 150);
    });
    await new Promise<void>((done) => {
      process.once('SIGINT', () => done());
      process.once('SIGTERM', () => done());
    });
    watcher.close();
    clearTimeout(timer);
    await preview.close();
    return EXIT.ok;
  },
};
