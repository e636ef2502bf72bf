/**
 * `scatterbook verify SITE_DIR [CONTENT_DIR]`: a built site against its
 * manifest.json; with the content folder, its inputs and figures too. Exit 0
 * when everything holds, 1 when anything differs (each difference named).
 */
import { resolve } from 'node:path';
import { verifySite } from '../archive/verify.js';
import { printable } from '../format/escape.js';
import { parseArgs, UsageError } from './args.js';
import { EXIT, type Command } from './command.js';
import { painter } from './terminal.js';

export const verifyCommand: Command = {
  name: 'verify',
  usage: 'scatterbook verify SITE_DIR [CONTENT_DIR]',
  flags: [],
  async run(argv, t) {
    const args = parseArgs(argv, []);
    if (args.positionals.length < 1 || args.positionals.length > 2)
      throw new UsageError('verify takes a built site folder and, optionally, its content folder');
    const [site, content] = args.positionals;
    const r = await verifySite(resolve(t.cwd, site), content ? resolve(t.cwd, content) : null);
    const p = painter(t.stderr, t.env);
    if (r.unreadable) {
      t.stderr.write(`${p.red('error:')} ${printable(site)}: ${r.unreadable}\n`);
      return EXIT.badInput;
    }
    for (const d of r.differences) t.stderr.write(`${p.red('differs:')} ${printable(d)}\n`);
    const what = `${r.outputs} output file${r.outputs === 1 ? '' : 's'}${content ? `, ${r.inputs} input file${r.inputs === 1 ? '' : 's'} and ${r.figures} figure${r.figures === 1 ? '' : 's'}` : ''}`;
    t.stdout.write(
      r.differences.length
        ? `checked ${what}: ${r.differences.length} difference${r.differences.length === 1 ? '' : 's'}\n`
        : `checked ${what}: all as the manifest says\n`,
    );
    return r.differences.length ? EXIT.badInput : EXIT.ok;
  },
};
