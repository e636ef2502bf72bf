/** The scatterbook command line: dispatch, usage, exit codes. */
import { relative } from 'node:path';
import { describeFault } from '../io/fault.js';
import { nearest, UsageError } from './args.js';
import { EXIT, type Command, type ExitCode } from './command.js';
import type { Terminal } from './terminal.js';

/**
 * The commands, each loaded only when it runs: `read` and `figures` never load
 * Eleventy, the browser driver or the plot stack, and `--help` loads nothing.
 */
export const COMMANDS: ReadonlyArray<{ readonly name: string; readonly summary: string; readonly load: () => Promise<Command> }> = [
  {
    name: 'build',
    summary: 'build the datasheet site and PDFs of a content folder (default content/) into _site/',
    load: async () => (await import('./build-command.js')).buildCommand,
  },
  {
    name: 'serve',
    summary: 'preview the site on this machine, rebuilding when anything in the content folder changes',
    load: async () => (await import('./serve-command.js')).serveCommand,
  },
  {
    name: 'read',
    summary: 'show what a Touchstone file holds (ports, points, references, passivity, reciprocity)',
    load: async () => (await import('./read-command.js')).readCommand,
  },
  {
    name: 'figures',
    summary: "compute a part's figures over its measured units and check them against its limits",
    load: async () => (await import('./figures-command.js')).figuresCommand,
  },
  {
    name: 'compare',
    summary: 'compare candidate parts side by side: a comparison file, or Touchstone files over a band',
    load: async () => (await import('./compare-command.js')).compareCommand,
  },
  { name: 'merge', summary: 'join the outputs of build --shard K/N into one site', load: async () => (await import('./merge-command.js')).mergeCommand },
  {
    name: 'release',
    summary: "freeze a part's current revision: its documents under released/<revision>/ and a release record",
    load: async () => (await import('./release-command.js')).releaseCommand,
  },
  {
    name: 'verify',
    summary: 'check a built site against its manifest.json (and its inputs and figures, given the content folder)',
    load: async () => (await import('./verify-command.js')).verifyCommand,
  },
  {
    name: 'schema',
    summary: 'print the JSON Schema of part files or comparison files (for editors)',
    load: async () => (await import('./schema-command.js')).schemaCommand,
  },
];

export function usage(): string {
  const lines = ['scatterbook: checked RF component datasheets from Touchstone measurements', '', 'commands:'];
  for (const c of COMMANDS) lines.push(`  ${c.name.padEnd(10)}${c.summary}`);
  lines.push(
    '',
    "scatterbook COMMAND --help shows a command's options.",
    'exit codes: 0 done, 1 bad input, 2 bad usage, 3 a limit failed (--strict), 4 internal fault',
  );
  return lines.join('\n') + '\n';
}

function commandHelp(c: Command, summary: string): string {
  const lines = [`usage: ${c.usage}`, '', summary];
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
  const entry = COMMANDS.find((c) => c.name === name);
  if (!entry) {
    const near = nearest(
      name,
      COMMANDS.map((c) => c.name),
    );
    t.stderr.write(`error: unknown command "${name}"${near ? `; did you mean "${near}"?` : ''}\n\n${usage()}`);
    return EXIT.usage;
  }
  const cmd = await entry.load();
  if (rest.includes('--help')) {
    t.stdout.write(commandHelp(cmd, entry.summary));
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
