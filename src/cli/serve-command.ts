/**
 * `scatterbook serve [CONTENT_DIR] [--port N] [--out DIR]`: builds the site and
 * serves it on localhost, rebuilding and reloading the browser when a part
 * file, a measured file or a template in the content folder changes. Parts
 * with errors are listed on the index page instead of stopping the preview.
 */
import { join, relative, resolve } from 'node:path';
import Eleventy from '@11ty/eleventy';
import { PACKAGE_ROOT, PAGES_DIR } from '../site/plugin.js';
import { parseArgs, UsageError, type FlagSpec } from './args.js';
import { EXIT, type Command } from './command.js';

const FLAGS: FlagSpec[] = [
  { name: 'port', value: true, help: 'the port on localhost (default 8080)' },
  { name: 'out', value: true, help: 'the folder served (default _site)' },
];

export const serveCommand: Command = {
  name: 'serve',
  summary: 'preview the site on localhost, rebuilding when a part or data file changes',
  usage: 'scatterbook serve [CONTENT_DIR] [--port N] [--out DIR]',
  flags: FLAGS,
  async run(argv, t) {
    const args = parseArgs(argv, FLAGS);
    if (args.positionals.length > 1) throw new UsageError('serve takes at most one content folder');
    const portText = (args.flags.get('port') as string | undefined) ?? '8080';
    const port = Number(portText);
    if (!Number.isInteger(port) || port < 1 || port > 65535) throw new UsageError(`--port needs a port number 1–65535, got "${portText}"`);
    const content = resolve(t.cwd, args.positionals[0] ?? 'content');
    const out = resolve(t.cwd, (args.flags.get('out') as string | undefined) ?? '_site');
    process.env.SCATTERBOOK_CONTENT = content;
    process.env.SCATTERBOOK_OUT = out;
    process.env.SCATTERBOOK_CACHE = join(out, '..', '.scatterbook-cache');
    // loader: our config is ESM whatever the package.json of the folder serve runs in says
    const elev = new Eleventy(PAGES_DIR, out, { runMode: 'serve', quietMode: true, loader: 'esm', configPath: join(PACKAGE_ROOT, '.eleventy.js') });
    await elev.init();
    await elev.watch();
    await elev.serve(port);
    t.stdout.write(`serving ${relative(t.cwd, out) || '.'}/ at http://localhost:${port}/ — watching ${relative(t.cwd, content) || '.'}/ (Ctrl-C stops)\n`);
    await new Promise<void>((done) => process.once('SIGINT', () => done()));
    await elev.stopWatch();
    return EXIT.ok;
  },
};
