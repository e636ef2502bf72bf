/** The scatterbook command line: dispatch, usage, exit codes. */
import { relative } from 'node:path';
import { describeFault } from '../io/fault.js';
import { nearest, UsageError } from './args.js';
import { EXIT, type Command, type ExitCode } from './command.js';
import { buildCommand } from './build-command.js';
import { figuresCommand } from './figures-command.js';
import { readCommand } from './read-command.js';
import { schemaCommand } from './schema-command.js';
import { serveCommand } from './serve-command.js';
import type { Terminal } from './terminal.js';

export const COMMANDS: readonly Command[] = [buildCommand, serveCommand, readCommand, figuresCommand, schemaCommand];

export function usage(): string {
  const lines = ['scatterbook: checked RF component datasheets from Touchstone measurements', '', 'commands:'];
  for (const c of COMMANDS) lines.push(`  ${c.name.padEnd(10)}${c.summary}`);
  lines.push('', 'scatterbook COMMAND --help shows a command\'s options.', 'exit codes: 0 done, 1 bad input, 2 bad usage, 3 a limit failed (--strict), 4 internal fault');
  return lines.join('\n') + '\n';
}

function commandHelp(c: Command): string {
  const lines = [`usage: ${c.usage}`, '', c.summary];
  if (c.flags.length) {
    lines.push('', 'options:');
    for (const f of c.flags) lines.push(`  --${f.name}${f.value ? ' VALUE' : ''}`.padEnd(24) + f.help);
  }
  return lines.join('\n') + '\n';
}

export async function main(argv: readonly string[], t: Terminal): Promise<ExitCode> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === 'help') {
    (name ? t.stdout : t.stderr).write(usage());
    return name ? EXIT.ok : EXIT.usage;
  }
  if (name === '--version') {
    t.stdout.write(`${await version()}\n`);
    return EXIT.ok;
  }
  const cmd = COMMANDS.find((c) => c.name === name);
  if (!cmd) {
    const near = nearest(name, COMMANDS.map((c) => c.name));
    t.stderr.write(`error: unknown command "${name}"${near ? `; did you mean "${near}"?` : ''}\n\n${usage()}`);
    return EXIT.usage;
  }
  if (rest.includes('--help')) {
    t.stdout.write(commandHelp(cmd));
    return EXIT.ok;
  }
  try {
    return await cmd.run(rest, t);
  } catch (e) {
    if (e instanceof UsageError) {
      t.stderr.write(`error: ${e.message}\nusage: ${cmd.usage}\n`);
      return EXIT.usage;
    }
    const fault = describeFault(e, (x) => relative(t.cwd, x) || x);
    if (fault !== null) {
      t.stderr.write(`error: ${fault}\n`);
      return EXIT.badInput;
    }
    t.stderr.write(`internal error (a bug in scatterbook; please report it with the input that caused it):\n${(e as Error).stack ?? String(e)}\n`);
    return EXIT.internal;
  }
}

async function version(): Promise<string> {
  const { readFileSync } = await import('node:fs');
  const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
  return pkg.version;
}
