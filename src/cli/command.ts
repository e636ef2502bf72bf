/** The shape of a CLI command, and the exit codes every command shares. */
import type { FlagSpec } from './args.js';
import type { Terminal } from './terminal.js';

/**
 * Exit codes (documented in the README):
 *   0 done; 1 bad input (a file or spec with errors); 2 bad usage;
 *   3 a limit failed under --strict; 4 an internal fault (a bug: please report).
 */
export const EXIT = { ok: 0, badInput: 1, usage: 2, limitFailed: 3, internal: 4 } as const;
export type ExitCode = (typeof EXIT)[keyof typeof EXIT];

export interface Command {
  readonly name: string;
  readonly usage: string;
  readonly flags: readonly FlagSpec[];
  run(argv: readonly string[], t: Terminal): ExitCode | Promise<ExitCode>;
}
