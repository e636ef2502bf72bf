/**
 * Faults of the machine are the user's to fix, not bugs: a read-only output
 * folder, a full disk, a --cache that is a file, a browser path or binary
 * that is broken. Each ends in exit 1 within a bounded time with one message
 * naming the path and the cause, and the old site is left as it was.
 * (The read-only and full-disk cases mount a small tmpfs, which needs root;
 * CI runs as root, so there they always run.)
 */
import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, type TestContext } from 'vitest';
import { haveBrowser } from '../support/browser.js';
import { snapshot } from '../support/snapshot.js';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;
const mounts: string[] = [];

function run(args: string[]) {
  const started = Date.now();
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8', timeout: 90_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr, seconds: (Date.now() - started) / 1000 };
}

function mount(ctx: TestContext, name: string, options: string): string {
  const at = join(dir, name);
  mkdirSync(at, { recursive: true });
  const m = spawnSync('mount', ['-t', 'tmpfs', '-o', options, 'tmpfs', at], { encoding: 'utf8' });
  if (m.status !== 0) {
    if (process.env.CI) throw new Error(`mount failed in CI: ${m.stderr}`);
    ctx.skip();
  }
  mounts.push(at);
  return at;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-faults-'));
  mkdirSync(join(dir, 'content/parts'), { recursive: true });
  cpSync(join(ROOT, 'content/parts/vt-pad-10'), join(dir, 'content/parts/vt-pad-10'), { recursive: true });
});

afterAll(() => {
  for (const m of mounts.reverse()) spawnSync('umount', [m]);
});

describe('environment faults end in exit 1 with the path and the cause, the old site intact', () => {
  it('a read-only output folder', (ctx) => {
    const vol = mount(ctx, 'ro', 'size=16m');
    expect(run(['build', 'content', '--out', 'ro/site', '--no-pdf', '--no-cache']).status).toBe(0);
    const before = snapshot(vol);
    expect(spawnSync('mount', ['-o', 'remount,ro', vol]).status).toBe(0);
    const r = run(['build', 'content', '--out', 'ro/site', '--no-pdf', '--no-cache']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(
      /^error: ro\/\.site\.(?:building|pages)-[^:]+: the file system is read-only \(EROFS in mkdir\); nothing was published \(ro\/site is unchanged\)\n$/,
    );
    expect(snapshot(vol)).toEqual(before);
  });

  it('a full disk', (ctx) => {
    const vol = mount(ctx, 'full', 'size=2m');
    expect(run(['build', 'content', '--out', 'full/site', '--no-pdf', '--no-cache']).status).toBe(0);
    // fill the rest but for a few blocks: the next site cannot fit
    spawnSync('sh', [
      '-c',
      `dd if=/dev/zero of=${join(vol, 'filler')} bs=4k 2>/dev/null; rm -f ${join(vol, 'filler')}; dd if=/dev/zero of=${join(vol, 'filler')} bs=4k count=$(( $(df -k --output=avail ${vol} | tail -1) / 4 - 8 )) 2>/dev/null`,
    ]);
    const before = snapshot(vol);
    const r = run(['build', 'content', '--out', 'full/site', '--no-pdf', '--no-cache']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(
      /^error: (full\/\.site\.building-\S+|writing the new site for full\/site): no space left on the device \(ENOSPC in \w+\); nothing was published \(full\/site is unchanged\)\n$/,
    );
    expect(snapshot(vol)).toEqual(before); // the staging folder is gone again
    expect(readdirSync(vol).filter((n) => n.includes('building'))).toEqual([]);
  });

  it('a --cache that is a file', () => {
    writeFileSync(join(dir, 'cache-file'), 'x');
    const r = run(['build', 'content', '--out', 'site-c', '--no-pdf', '--cache', 'cache-file']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('error: --cache cache-file: is a file, not a folder; name a folder (it is created when missing) or pass --no-cache\n');
  });

  it('a --browser that does not exist, is a folder, exits at once, or never answers', () => {
    expect(run(['build', 'content', '--out', 'site-b', '--no-cache']).status).toBe(0);
    const before = snapshot(join(dir, 'site-b'));
    const missing = run(['build', 'content', '--out', 'site-b', '--no-cache', '--browser', '/nonexistent/chrome']);
    expect(missing.status).toBe(1);
    expect(missing.stderr).toContain('error: --browser /nonexistent/chrome: no such file');
    const folder = run(['build', 'content', '--out', 'site-b', '--no-cache', '--browser', dir]);
    expect(folder.status).toBe(1);
    expect(folder.stderr).toContain(`--browser ${dir}: is a folder, not a browser`);
    const exits = join(dir, 'exits.sh');
    writeFileSync(exits, '#!/bin/sh\nexit 3\n');
    chmodSync(exits, 0o755);
    const bad = run(['build', 'content', '--out', 'site-b', '--no-cache', '--browser', exits]);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toContain(`error: the browser ${exits} could not start: it exited before it answered`);
    const hangs = join(dir, 'hangs.sh');
    writeFileSync(hangs, '#!/bin/sh\nsleep 300\n');
    chmodSync(hangs, 0o755);
    const hung = run(['build', 'content', '--out', 'site-b', '--no-cache', '--browser', hangs]);
    expect(hung.status).toBe(1);
    expect(hung.stderr).toContain(`error: the browser ${hangs} did not answer within 20 s`);
    expect(hung.seconds).toBeLessThan(60);
    expect(snapshot(join(dir, 'site-b'))).toEqual(before);
  }, 120_000);
});

/** Process ids below `pid` (its children, theirs, …), read from /proc. */
function descendants(pid: number): number[] {
  const parent = new Map<number, number>();
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = readFileSync(`/proc/${name}/stat`, 'utf8');
      parent.set(Number(name), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch {
      // ended meanwhile
    }
  }
  const out: number[] = [];
  const walk = (p: number) => {
    for (const [c, pp] of parent) if (pp === p) out.push(c), walk(c);
  };
  walk(pid);
  return out;
}

/** Running (not a zombie waiting to be reaped). */
function running(pid: number): boolean {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    return stat.slice(stat.lastIndexOf(')') + 2)[0] !== 'Z';
  } catch {
    return false;
  }
}

describe('a build killed while its browser prints', () => {
  it.skipIf(!haveBrowser)(
    'leaves no browser running, the old site intact, and the next build succeeds and clears the staging folder',
    async () => {
      expect(run(['build', 'content', '--out', 'site-k', '--no-cache', '--no-pdf']).status).toBe(0);
      const before = snapshot(join(dir, 'site-k'));
      mkdirSync(join(dir, 'big/parts'), { recursive: true });
      cpSync(join(ROOT, 'content/parts'), join(dir, 'big/parts'), { recursive: true });
      const child = spawn(process.execPath, [BIN, 'build', 'big', '--out', 'site-k', '--no-cache', '--pdf'], { cwd: dir, stdio: 'ignore' });
      let browsers: number[] = [];
      const end = Date.now() + 60_000;
      while (Date.now() < end && browsers.length === 0) {
        await new Promise((r) => setTimeout(r, 100));
        browsers = descendants(child.pid as number).filter((p) => {
          try {
            return /chrom/i.test(readFileSync(`/proc/${p}/cmdline`, 'utf8').split('\0')[0] ?? '');
          } catch {
            return false; // it ended meanwhile
          }
        });
      }
      expect(browsers.length).toBeGreaterThan(0);
      const all = descendants(child.pid as number);
      child.kill('SIGKILL');
      const gone = Date.now() + 30_000; // generous: a loaded CI machine reaps slowly
      while (Date.now() < gone && all.some(running)) await new Promise((r) => setTimeout(r, 200));
      expect(all.filter(running)).toEqual([]);
      expect(snapshot(join(dir, 'site-k'))).toEqual(before);
      expect(readdirSync(dir).some((n) => n.startsWith('.site-k.building-'))).toBe(true);
      expect(run(['build', 'content', '--out', 'site-k', '--no-cache', '--no-pdf']).status).toBe(0);
      expect(readdirSync(dir).filter((n) => n.startsWith('.site-k.'))).toEqual([]);
    },
    120_000,
  );
});
