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
  readonly flags: Map<string, string | true>;
}

export class UsageError extends Error {}

export function editDistance(a: string, b: string): number {
  const d = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array(b.length).fill(0)] as number[]);
  for (let j = 1; j <= b.length; j++) d[0][j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
  }
  return d[a.length][b.length];
}

/** The candidate closest to `word`, if it is close enough to be a likely typo. */
export function nearest(word: string, candidates: Iterable<string>): string | null {
  let best: string | null = null;
  let bestD = Infinity;
  for (const c of candidates) {
    const d = editDistance(word.toLowerCase(), c.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  return best !== null && bestD <= Math.max(2, Math.floor(word.length / 3)) ? best : null;
}

export function parseArgs(argv: readonly string[], specs: readonly FlagSpec[]): ParsedArgs {
  const byName = new Map(specs.map((s) => [s.name, s]));
  const positionals: string[] = [];
  const flags = new Map<string, string | true>();
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
    } else {
      if (eq >= 0) throw new UsageError(`--${name} takes no value`);
      flags.set(name, true);
    }
  }
  return { positionals, flags };
}
