#!/usr/bin/env node
// The scatterbook command. The TypeScript sources are compiled to dist/ by
// `npm ci` / `npm install` (the "prepare" script).
import { existsSync } from 'node:fs';
import { Worker } from 'node:worker_threads';

const entry = new URL('../dist/cli/main.js', import.meta.url);
if (!existsSync(entry)) {
  process.stderr.write('scatterbook: dist/ is missing; run "npm run build:cli" (npm ci does it) first\n');
  process.exit(4);
}
// A reader that closes the pipe early (`| head`) ends the command quietly.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e) => {
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}

/** build runs in a worker thread with a capped heap (dist/cli/heap-worker.js): its memory stays bounded at any catalog size. */
const HEAP_MB = Number(process.env.SCATTERBOOK_HEAP_MB) >= 128 ? Number(process.env.SCATTERBOOK_HEAP_MB) : 768;

function inWorker(argv) {
  return new Promise((resolve) => {
    let code = null;
    const w = new Worker(new URL('../dist/cli/heap-worker.js', import.meta.url), {
      workerData: { argv, env: { ...process.env }, cwd: process.cwd(), stdoutTTY: Boolean(process.stdout.isTTY), stderrTTY: Boolean(process.stderr.isTTY) },
      resourceLimits: { maxOldGenerationSizeMb: HEAP_MB },
    });
    w.on('message', (m) => {
      if (m.fd === 1) process.stdout.write(m.chunk);
      else if (m.fd === 2) process.stderr.write(m.chunk);
      else if ('code' in m) code = m.code;
    });
    w.on('error', (e) => {
      if (e.code === 'ERR_WORKER_OUT_OF_MEMORY') {
        process.stderr.write(
          `error: the build needs more memory than its heap limit of ${HEAP_MB} MB; nothing was written (the old site is unchanged). Set SCATTERBOOK_HEAP_MB to more, or build in slices (build --shard K/N, then merge)\n`,
        );
        code = 1;
      } else {
        process.stderr.write(`internal error (a bug in scatterbook; please report it with the input that caused it):\n${e.stack ?? e}\n`);
        code = 4;
      }
    });
    w.on('exit', () => resolve(code ?? 4));
  });
}

const argv = process.argv.slice(2);
let code;
if (argv[0] === 'build' && !argv.includes('--help')) code = await inWorker(argv);
else {
  const { main } = await import(entry.href);
  code = await main(argv, { stdout: process.stdout, stderr: process.stderr, env: process.env, cwd: process.cwd() });
}
// The command is over: end the process once its output is flushed, whatever
// a worker thread, a timer or a library may still hold open.
let pending = 2;
const done = () => {
  if (--pending === 0) process.exit(code);
};
process.stdout.write('', done);
process.stderr.write('', done);
