/**
 * Proof that a change of structure changed no output: builds the demo site
 * (HTML, exports and manifest; no PDFs, whose Chromium-assigned ids vary) and
 * collects every --json output (`read --json` of every Touchstone file of the
 * demo and of the test data, `figures --json` of every part, `compare --json`
 * of every comparison) from this working tree and from a commit (default
 * HEAD), each compiled by itself, and compares them byte for byte.
 *
 *   npm run check:same-outputs            # the working tree against HEAD
 *   npm run check:same-outputs -- main~3  # against another commit
 *
 * Exit 0 when everything is equal, 1 with the differing files listed.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';

const ROOT = join(import.meta.dirname, '../..');
const ref = process.argv[2] ?? 'HEAD';

function files(dir: string, keep: (name: string) => boolean): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...files(p, keep));
    else if (keep(name)) out.push(p);
  }
  return out;
}

/** Every output of the tree at `tool` (compiled there), into `out`. Paths are run from the tool's folder, relative. */
function snapshot(tool: string, out: string): void {
  execFileSync('npx', ['tsc', '-p', 'tsconfig.build.json'], { cwd: tool, stdio: 'inherit' });
  const bin = join(tool, 'bin/scatterbook.js');
  const run = (args: string[]) => spawnSync(process.execPath, [bin, ...args], { cwd: tool, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
  const site = run(['build', 'content', '--out', join(out, 'site'), '--no-pdf', '--no-cache']);
  writeFileSync(join(out, 'build.status'), `${site.status}\n${site.stderr}`);
  mkdirSync(join(out, 'json'), { recursive: true });
  const save = (name: string, args: string[]) => {
    const r = run(args);
    writeFileSync(join(out, 'json', name.replace(/[/ ]/g, '_')), `${r.status}\n${r.stdout}\n${r.stderr}`);
  };
  for (const f of [...files(join(tool, 'content'), (n) => /\.(s\d+p|ts)$/i.test(n)), ...files(join(tool, 'test/data'), (n) => /\.(s\d+p|ts)$/i.test(n))]) {
    save(`read-${relative(tool, f)}`, ['read', relative(tool, f), '--json']);
  }
  for (const slug of readdirSync(join(tool, 'content/parts')).sort()) save(`figures-${slug}`, ['figures', `content/parts/${slug}/part.yaml`, '--json']);
  for (const f of readdirSync(join(tool, 'content/comparisons')).filter((n) => n.endsWith('.yaml')))
    save(`compare-${f}`, ['compare', `content/comparisons/${f}`, '--json']);
}

const work = mkdtempSync(join(tmpdir(), 'scatterbook-same-'));
const old = join(work, 'ref');
execFileSync('git', ['worktree', 'add', '--detach', old, ref], { cwd: ROOT, stdio: 'ignore' });
try {
  symlinkSync(join(ROOT, 'node_modules'), join(old, 'node_modules'));
  snapshot(old, join(work, 'before'));
  snapshot(ROOT, join(work, 'after'));
  const before = files(join(work, 'before'), () => true).map((f) => relative(join(work, 'before'), f));
  const after = files(join(work, 'after'), () => true).map((f) => relative(join(work, 'after'), f));
  // the site's marker and manifest name the tool's build (a hash of its code), which a change of structure changes by design
  const toolBound = (f: string) => /(^|\/)(\.scatterbook-site|manifest\.json|figures\.json|figures\.csv)$/.test(f) && f.startsWith('site/');
  const differ = [...new Set([...before, ...after])].sort().filter((f) => {
    const a = join(work, 'before', f),
      b = join(work, 'after', f);
    if (!existsSync(a) || !existsSync(b)) return true;
    const ta = readFileSync(a, 'utf8'),
      tb = readFileSync(b, 'utf8');
    if (ta === tb) return false;
    if (!toolBound(f)) return true;
    // equal once the tool's build id is taken out
    const id = /"(tool|build|toolBuild)":\s*\{[^}]*\}|[0-9a-f]{64}/g;
    return ta.replace(id, '') !== tb.replace(id, '');
  });
  console.log(
    `${before.length} outputs of ${ref} against ${after.length} of the working tree: ${differ.length ? `${differ.length} differ` : 'all equal, byte for byte'}`,
  );
  for (const f of differ) console.log(`  differs: ${f}`);
  process.exitCode = differ.length ? 1 : 0;
} finally {
  execFileSync('git', ['worktree', 'remove', '--force', old], { cwd: ROOT, stdio: 'ignore' });
  rmSync(work, { recursive: true, force: true });
}
