#!/usr/bin/env node
// The scatterbook command. The TypeScript sources are compiled to dist/ by
// `npm ci` / `npm install` (the "prepare" script).
import { existsSync } from 'node:fs';

const entry = new URL('../dist/cli/main.js', import.meta.url);
if (!existsSync(entry)) {
  process.stderr.write('scatterbook: dist/ is missing; run "npm run build:cli" (npm ci does it) first\n');
  process.exit(4);
}
const { main } = await import(entry.href);
const code = await main(process.argv.slice(2), {
  stdout: process.stdout,
  stderr: process.stderr,
  env: process.env,
  cwd: process.cwd(),
});
process.exitCode = code;
