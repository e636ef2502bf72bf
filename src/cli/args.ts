/**
 * A small argument parser: each command declares its flags; anything else is
 * a usage error (exit 2) that names the nearest known flag.
 */
export interface FlagSpec {
  readonly name: string;
  /** Takes a value (`--out DIR` or `--out=DIR`). */
  readonly value?: boolean;
  readonly help: string;
}

export interface ParsedArgs {
  readonly positionals: string[];
  /** The last value of each flag given (true for a flag without value). */
  readonly flags: Map<string, string | true>;
  /** Every value of each flag given with one, in order (for flags that may repeat, such as --limit). */
  readonly values: Map<string, string[]>;
}

export class UsageError extends Error {}

export { nearest } from '../format/suggest.js';
import { nearest } from '../format/suggest.js';

export function parseArgs(argv: readonly string[], specs: readonly FlagSpec[]): ParsedArgs {
  const byName = new Map(specs.map((s) => [s.name, s]));
  const positionals: string[] = [];
  const flags = new Map<string, string | true>();
  const values = new Map<string, string[]>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--') {
      positionals.push(...argv.slice(i + 1));
      break;
    }
    if (!a.startsWith('--') || a === '-') {
      if (a.startsWith('-') && a !== '-') throw new UsageError(`unknown option ${a}; options are spelled out in full, e.g. --json`);
      positionals.push(a);
      continue;
    }
    const eq = a.indexOf('=');
    const name = eq >= 0 ? a.slice(2, eq) : a.slice(2);
    const spec = byName.get(name);
    if (!spec) {
      const near = nearest(name, byName.keys());
      throw new UsageError(`unknown option --${name}${near ? `; did you mean --${near}?` : ''}`);
    }
    if (spec.value) {
      const v = eq >= 0 ? a.slice(eq + 1) : argv[++i];
      if (v === undefined || v === '') throw new UsageError(`--${name} needs a value`);
      flags.set(name, v);
      values.set(name, [...(values.get(name) ?? []), v]);
    } else {
      if (eq >= 0) throw new UsageError(`--${name} takes no value`);
      flags.set(name, true);
    }
  }
  return { positionals, flags, values };
}
