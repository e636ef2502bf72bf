/**
 * `scatterbook build` runs here, in a worker thread whose heap is capped
 * (bin/scatterbook.js starts it): what a build holds is small — about 41 KB a
 * part —, but without a cap V8 lets the heap grow with the garbage of reading
 * files and rendering pages, to gigabytes on a machine with memory to spare.
 * The terminal is the main thread's, relayed: every write goes there in order,
 * with the main thread's TTY flags, so colour and progress behave as without
 * the worker. The worker ends with the command's exit code.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { main } from './main.js';
import type { Output } from './terminal.js';

interface Start {
  readonly argv: readonly string[];
  readonly env: Record<string, string | undefined>;
  readonly cwd: string;
  readonly stdoutTTY: boolean;
  readonly stderrTTY: boolean;
}

const start = workerData as Start;
const relay = (fd: 1 | 2, isTTY: boolean): Output => ({ isTTY, write: (chunk) => parentPort?.postMessage({ fd, chunk }) });
const code = await main(start.argv, { stdout: relay(1, start.stdoutTTY), stderr: relay(2, start.stderrTTY), env: start.env, cwd: start.cwd });
parentPort?.postMessage({ code });
