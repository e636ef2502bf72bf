#!/usr/bin/env node
// The scatterbook command. The TypeScript sources are compiled to dist/ by
// `npm ci` / `npm install` (the "prepare" script).
import { existsSync } from 'node:fs';

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
const { main } = await import(entry.href);
const code = await main(process.argv.slice(2), {
  stdout: process.stdout,
  stderr: process.stderr,
  env: process.env,
  cwd: process.cwd(),
});
// The command is over: end the process once its output is flushed, whatever
// a worker thread, a timer or a library may still hold open.
let pending = 2;
const done = () => {
  if (--pending === 0) process.exit(code);
};
process.stdout.write('', done);
process.stderr.write('', done);
