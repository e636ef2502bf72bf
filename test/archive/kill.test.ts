/**
 * A build killed at any moment leaves the previous site — its manifest
 * included — and the content folder's release records as they were, and the
 * next build succeeds. Killed for real (SIGKILL) at several moments of a
 * build with PDFs; and the one window a kill cannot be timed into — between
 * the two renames of the swap, beside the target or inside a mount point —
 * set up by hand and undone by the next build (io/swap.ts).
 */
import { spawn, spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, renameSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { removeDeadBuilds } from '../../src/io/swap.js';
import { haveBrowser } from '../support/browser.js';
import { snapshot } from '../support/snapshot.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;
const run = (args: string[]) => spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8' });

/** The pid of a process that has ended. */
function deadPid(): number {
  const p = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' });
  return Number(p.stdout);
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-kill-'));
  cpSync(join(ROOT, 'content'), join(dir, 'content'), { recursive: true });
  const r = run(['build', 'content', '--out', 'site', '--no-pdf', '--no-cache']);
  if (r.status !== 0) throw new Error(r.stderr);
}, 120_000);

describe('killed between the two renames of the swap', () => {
  it('beside the target: the old site renamed aside and the new one not yet in place; the next build puts the old one back first', () => {
    const before = snapshot(join(dir, 'site'));
    const pid = deadPid();
    renameSync(join(dir, 'site'), join(dir, `.site.old-${pid}-1-x`));
    mkdirSync(join(dir, `.site.building-${pid}-1-y`));
    writeFileSync(join(dir, `.site.building-${pid}-1-y/index.html`), 'half a site');
    expect(existsSync(join(dir, 'site'))).toBe(false);
    removeDeadBuilds(join(dir, 'site'));
    expect(snapshot(join(dir, 'site'))).toEqual(before);
    expect(readdirSync(dir).filter((n) => n.startsWith('.site.'))).toEqual([]);
  });

  it('inside a mount point: the old entries half moved into the old folder, new ones half placed; the old entries come back whole', () => {
    const target = join(dir, 'volume');
    cpSync(join(dir, 'site'), target, { recursive: true });
    const before = snapshot(target);
    const pid = deadPid();
    const old = join(target, `.scatterbook-old-${pid}-1-x`);
    mkdirSync(old);
    const names = readdirSync(target).filter((n) => !n.startsWith('.scatterbook-old'));
    for (const n of names) renameSync(join(target, n), join(old, n));
    writeFileSync(join(target, 'index.html'), 'a new page, placed before the kill');
    removeDeadBuilds(target);
    expect(snapshot(target)).toEqual(before);
  });
});

describe.skipIf(!haveBrowser)('SIGKILL during a build with PDFs', () => {
  const moments: Array<[string, () => boolean]> = [
    ['while it reads the parts', () => true],
    ['once its staging folder exists', () => readdirSync(dir).some((n) => n.startsWith('.site.building-'))],
    [
      'while the browser prints',
      () =>
        readdirSync(dir)
          .filter((n) => n.startsWith('.site.building-'))
          .some((n) => existsSync(join(dir, n, 'parts/vt-amp-0560')) && readdirSync(join(dir, n, 'parts/vt-amp-0560')).some((f) => f.endsWith('.pdf'))),
    ],
    [
      'as it prints its last PDF (the comparison)',
      () =>
        readdirSync(dir)
          .filter((n) => n.startsWith('.site.building-'))
          .some(
            (n) =>
              existsSync(join(dir, n, 'comparisons/ism-filter-shortlist')) &&
              readdirSync(join(dir, n, 'comparisons/ism-filter-shortlist')).some((f) => f.endsWith('.pdf')),
          ),
    ],
  ];
  it.each(moments)(
    '%s: the old site, its manifest and the release records stay byte for byte; the next build succeeds',
    async (_, ready) => {
      const site = snapshot(join(dir, 'site'));
      const content = snapshot(join(dir, 'content'));
      expect(site['manifest.json']).toBeDefined();
      const child = spawn(process.execPath, [BIN, 'build', 'content', '--out', 'site', '--no-cache', '--pdf'], { cwd: dir, stdio: 'ignore' });
      const exited = new Promise((r) => child.on('exit', r));
      const end = Date.now() + 120_000;
      while (Date.now() < end && !ready() && child.exitCode === null) await new Promise((r) => setTimeout(r, 20));
      expect(child.exitCode, 'the build ended before the moment came').toBe(null);
      child.kill('SIGKILL');
      await exited;
      if (!existsSync(join(dir, 'site'))) removeDeadBuilds(join(dir, 'site')); // killed inside the swap's rename window: what the next build does first
      expect(snapshot(join(dir, 'site'))).toEqual(site);
      expect(snapshot(join(dir, 'content'))).toEqual(content);
      const next = run(['build', 'content', '--out', 'site', '--no-cache', '--no-pdf']);
      expect(next.status, next.stderr).toBe(0);
      expect(readdirSync(dir).filter((n) => n.startsWith('.site.'))).toEqual([]);
      expect(run(['verify', 'site', 'content']).status).toBe(0);
    },
    180_000,
  );
});
