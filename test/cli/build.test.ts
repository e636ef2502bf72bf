/**
 * `scatterbook build` through the binary: a broken part stops the build with
 * every error named and the old site untouched; --keep-going publishes the
 * good parts and lists the others; spec text is escaped; templates can be
 * overridden from the content folder's _includes/.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, symlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;

function run(args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** A content folder with two good demo parts. */
function content(name: string): string {
  const c = join(dir, name);
  mkdirSync(join(c, 'parts'), { recursive: true });
  for (const slug of ['vt-pad-10', 'vt-cbl-150']) cpSync(join(ROOT, 'content/parts', slug), join(c, 'parts', slug), { recursive: true });
  return c;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-build-'));
});

describe('scatterbook build', () => {
  it('builds the site: an index and a page per part, and says where to open it', () => {
    content('ok');
    const r = run(['build', 'ok', '--out', 'site-ok', '--no-cache', '--no-pdf']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^built 2 parts into site-ok\/ in [\d.]+ s; open site-ok\/index\.html\n$/);
    expect(r.stderr).toMatch(/^warning: VT-PAD-10 fails Attenuation/); // its damaged unit (see below)
    expect(readdirSync(join(dir, 'site-ok/parts')).sort()).toEqual(['vt-cbl-150', 'vt-pad-10']);
    expect(existsSync(join(dir, 'site-ok/assets/scatterbook.css'))).toBe(true);
  });

  it('a broken part: every error with file and line, exit 1, and the previous site left as it was', () => {
    const c = content('broken');
    expect(run(['build', 'broken', '--out', 'site-b', '--no-cache', '--no-pdf']).status).toBe(0);
    const before = readFileSync(join(dir, 'site-b/index.html'), 'utf8');
    const yaml = join(c, 'parts/vt-cbl-150/part.yaml');
    writeFileSync(yaml, readFileSync(yaml, 'utf8').replace('band: full, max: 5.2 dB', 'band: ful, max: 5.2').replace('class: cable', 'class: cabel'));
    const r = run(['build', 'broken', '--out', 'site-b', '--no-cache', '--no-pdf']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('broken/parts/vt-cbl-150/part.yaml:5:8: error: class "cabel" is not one of');
    expect(r.stderr).toMatch(/broken\/parts\/vt-cbl-150\/part\.yaml:\d+:\d+: error: band "ful" is not defined; did you mean "full"\?/);
    expect(r.stderr).toContain('nothing was written (site-b is unchanged); --keep-going publishes the parts that build');
    expect(readFileSync(join(dir, 'site-b/index.html'), 'utf8')).toBe(before);
    expect(readdirSync(dir).filter((n) => n.includes('building'))).toEqual([]); // no staging folder left behind
  });

  it('--keep-going publishes the good parts and lists the failed ones', () => {
    const r = run(['build', 'broken', '--out', 'site-k', '--no-cache', '--no-pdf', '--keep-going']);
    expect(r.status).toBe(1);
    expect(r.stdout).toContain('built 1 part, 1 left out with errors');
    const index = readFileSync(join(dir, 'site-k/index.html'), 'utf8');
    expect(index).toContain('Parts not published');
    expect(index).toContain('vt-cbl-150/part.yaml');
    expect(existsSync(join(dir, 'site-k/parts/vt-pad-10/index.html'))).toBe(true);
    expect(existsSync(join(dir, 'site-k/parts/vt-cbl-150'))).toBe(false);
  });

  it('escapes everything taken from a spec: <script> and "><img onerror=…> in title and notes render as text', () => {
    const c = content('evil');
    const yaml = join(c, 'parts/vt-pad-10/part.yaml');
    const evil = '<script>alert(1)</script> "><img src=x onerror=alert(2)>';
    writeFileSync(
      yaml,
      readFileSync(yaml, 'utf8')
        .replace(/^title: .*$/m, `title: '${evil}'`)
        .replace(/^description: .*$/m, `description: '${evil}'\nnotes: |\n  Plain **bold** text.\n\n  ${evil}\n\n  [link](javascript:alert(3))`),
    );
    expect(run(['build', 'evil', '--out', 'site-e', '--no-cache', '--no-pdf']).status).toBe(0);
    const page = readFileSync(join(dir, 'site-e/parts/vt-pad-10/index.html'), 'utf8');
    expect(page).not.toContain('<script>alert(1)</script>');
    expect(page).not.toContain('<img src=x');
    expect(page).not.toMatch(/href="javascript:/i); // markdown-it refuses the link and leaves it as text
    expect(page).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(page).toContain('<strong>bold</strong>'); // Markdown still renders
    const index = readFileSync(join(dir, 'site-e/index.html'), 'utf8');
    expect(index).not.toContain('<img src=x');
  });

  it("a vendor overrides a template by a file of the same name in the content folder's _includes/", () => {
    const c = content('custom');
    mkdirSync(join(c, '_includes'));
    writeFileSync(
      join(c, '_includes/ports.njk'),
      '<section class="ports"><h2 id="ports-title">Connections</h2><p class="vendor-ports">{{ part.ports.length }} connections</p></section>\n',
    );
    expect(run(['build', 'custom', '--out', 'site-c', '--no-cache', '--no-pdf']).status).toBe(0);
    const page = readFileSync(join(dir, 'site-c/parts/vt-pad-10/index.html'), 'utf8');
    expect(page).toContain('<p class="vendor-ports">2 connections</p>');
    expect(page).toContain('id="headline-title"'); // the other templates are still ours
  });

  it('unchanged parts come from the cache; a changed measurement file or part file is recomputed', () => {
    const c = content('cached');
    const args = ['build', 'cached', '--out', 'site-cache', '--no-pdf', '--cache', 'cache-dir'];
    expect(run(args).stdout).toMatch(/^built 2 parts into/);
    expect(run(args).stdout).toContain('(2 unchanged, from the cache)');
    const data = join(c, 'parts/vt-pad-10/data/sn2001.s2p');
    writeFileSync(data, `${readFileSync(data, 'utf8')}! a comment at the end changes size and time\n`);
    expect(run(args).stdout).toContain('(1 unchanged, from the cache)');
    const yaml = join(c, 'parts/vt-cbl-150/part.yaml');
    writeFileSync(yaml, readFileSync(yaml, 'utf8').replace('max: 5.2 dB', 'max: 5.3 dB'));
    const r = run(args);
    expect(r.stdout).toContain('(1 unchanged, from the cache)');
    expect(readFileSync(join(dir, 'site-cache/parts/vt-cbl-150/report.html'), 'utf8')).toContain('≤ 5.30\u00a0dB');
    // the plots' SVG sit beside the entries; a page from the cache is the page built anew, and one whose SVG is gone is built again
    const page = readFileSync(join(dir, 'site-cache/parts/vt-pad-10/index.html'), 'utf8');
    expect(run([...args.slice(0, 3), 'site-cache2', ...args.slice(4)]).stdout).toContain('(2 unchanged, from the cache)');
    expect(readFileSync(join(dir, 'site-cache2/parts/vt-pad-10/index.html'), 'utf8')).toBe(page);
    const svgs = readdirSync(join(dir, 'cache-dir')).filter((f) => f.endsWith('.svg'));
    expect(svgs.length).toBeGreaterThan(0);
    for (const f of svgs) rmSync(join(dir, 'cache-dir', f));
    const again = run(args);
    expect(again.stdout).not.toContain('from the cache');
    expect(readFileSync(join(dir, 'site-cache/parts/vt-pad-10/index.html'), 'utf8')).toBe(page);
  });

  it('the cache never serves a stale page: an edit in place with the same size and time, site settings, template overrides', () => {
    const c = content('stale');
    const data = join(c, 'parts/vt-pad-10/data/sn2002.s2p');
    utimesSync(data, 1_700_000_000, 1_700_000_000); // a whole second, which utimes sets exactly
    const args = ['build', 'stale', '--out', 'site-stale', '--no-pdf', '--cache', 'cache-stale'];
    expect(run(args).status).toBe(0);
    expect(run(args).stdout).toContain('(2 unchanged, from the cache)');
    // one digit of a data file changed, same length, modification time put back
    const before = statSync(data);
    const text = readFileSync(data, 'utf8');
    const at = text.search(/\d\n\d/); // the last digit of the first data line: a value, not a frequency
    writeFileSync(data, text.slice(0, at) + (text[at] === '9' ? '8' : '9') + text.slice(at + 1));
    utimesSync(data, 1_700_000_000, 1_700_000_000);
    expect(statSync(data).size).toBe(before.size);
    expect(statSync(data).mtimeMs).toBe(before.mtimeMs);
    expect(run(args).stdout).toContain('(1 unchanged, from the cache)');
    const page = readFileSync(join(dir, 'site-stale/parts/vt-pad-10/report.html'), 'utf8');
    expect(page).toContain(createHash('sha256').update(readFileSync(data)).digest('hex'));
    writeFileSync(join(c, 'site.yaml'), 'vendor: Another Name\n');
    expect(run(args).stdout).not.toContain('from the cache');
    // the pages kept for copying are keyed the same way: none of them is served either
    for (const f of ['parts/vt-pad-10/index.html', 'parts/vt-pad-10/report.html'])
      expect(readFileSync(join(dir, 'site-stale', f), 'utf8')).toContain('Another Name');
    mkdirSync(join(c, '_includes'));
    writeFileSync(join(c, '_includes/ports.njk'), '<section class="ports"><h2 id="ports-title">Ports of the override</h2></section>\n');
    expect(run(args).stdout).not.toContain('from the cache');
    expect(readFileSync(join(dir, 'site-stale/parts/vt-pad-10/index.html'), 'utf8')).toContain('Ports of the override');
  });

  it("a rebuild copies the unchanged parts' pages kept from the last build, and they equal a fresh render byte for byte", () => {
    content('kept');
    const cached = ['build', 'kept', '--no-pdf', '--cache', 'cache-kept'];
    expect(run([...cached, '--out', 'site-kept-1']).status).toBe(0);
    expect(readdirSync(join(dir, 'cache-kept/pages')).filter((n) => /^vt-(pad-10|cbl-150)-[0-9a-f]{32}$/.test(n))).toHaveLength(2);
    expect(run([...cached, '--out', 'site-kept-2']).stdout).toContain('(2 unchanged, from the cache)');
    expect(run(['build', 'kept', '--no-pdf', '--no-cache', '--out', 'site-kept-fresh']).status).toBe(0);
    const files = (root: string): string[] =>
      readdirSync(root, { recursive: true, withFileTypes: true })
        .filter((e) => e.isFile())
        .map((e) => join(e.parentPath, e.name).slice(root.length))
        .sort();
    const fresh = join(dir, 'site-kept-fresh');
    const copied = join(dir, 'site-kept-2');
    expect(files(copied)).toEqual(files(fresh));
    for (const f of files(fresh)) expect(readFileSync(join(copied, f)).equals(readFileSync(join(fresh, f))), f).toBe(true);
  });

  it('a different build of scatterbook with the same version number misses the cache', () => {
    // a copy of the installed tool: the same version, then one compiled file changed
    const tool = join(dir, 'tool');
    for (const p of ['bin', 'dist', 'src/site', 'package.json', '.eleventy.js']) cpSync(join(ROOT, p), join(tool, p), { recursive: true });
    symlinkSync(join(ROOT, 'node_modules'), join(tool, 'node_modules'));
    content('tooled');
    const build = () =>
      spawnSync(process.execPath, [join(tool, 'bin/scatterbook.js'), 'build', 'tooled', '--out', 'site-tool', '--no-pdf', '--cache', 'cache-tool'], {
        cwd: dir,
        encoding: 'utf8',
      }).stdout;
    expect(build()).toMatch(/^built 2 parts/);
    expect(build()).toContain('(2 unchanged, from the cache)');
    const figures = join(tool, 'dist/evaluate/evaluate.js');
    writeFileSync(figures, `${readFileSync(figures, 'utf8')}\n// a rebuilt scatterbook\n`);
    expect(build()).not.toContain('from the cache');
  });

  it('two documents per part; declared specifications marked; measurement metadata on the report; site.yaml can keep reports and data files out', () => {
    const c = content('docs');
    const yaml = join(c, 'parts/vt-pad-10/part.yaml');
    writeFileSync(
      yaml,
      readFileSync(yaml, 'utf8')
        .replace(
          '  - {unit: SN2001, file: data/sn2001.s2p, conditions: {temperature: 25 °C, stage: initial}}',
          '  - {unit: SN2001, file: data/sn2001.s2p, conditions: {temperature: 25 °C, stage: initial}, instrument: 4-port analyser, calibration: SOLT 2026-09-30, date: 2026-10-01, operator: Q. Tester}',
        )
        .replace(
          'ratings:',
          'features: [Flat attenuation, Stainless-steel body]\ndeclared:\n  - {parameter: Power handling, max: 2, unit: W, conditions: "CW, 25 °C"}\nordering:\n  - {code: VT-PAD-10-SMA, description: SMA male to SMA female}\nratings:',
        ),
    );
    expect(run(['build', 'docs', '--out', 'site-docs', '--no-cache', '--no-pdf']).status).toBe(0);
    const sheet = readFileSync(join(dir, 'site-docs/parts/vt-pad-10/index.html'), 'utf8');
    expect(sheet).toContain('<li>Flat attenuation</li>');
    expect(sheet).toMatch(/<tr class="spec-row declared">\s*<th scope="row">Power handling<sup class="mark">\*<\/sup>/);
    expect(sheet).toContain('Values marked * are declared by the vendor');
    expect(sheet).toContain('VT-PAD-10-SMA');
    expect(sheet).toContain('href="../../parts/vt-pad-10/data/sn2001.s2p"');
    expect(sheet).not.toContain('id="compliance-title"');
    expect(readFileSync(join(dir, 'site-docs/parts/vt-pad-10/data/sn2001.s2p'), 'utf8')).toBe(readFileSync(join(c, 'parts/vt-pad-10/data/sn2001.s2p'), 'utf8'));
    const report = readFileSync(join(dir, 'site-docs/parts/vt-pad-10/report.html'), 'utf8');
    expect(report).toContain('id="compliance-title"');
    expect(report).toContain('SOLT 2026-09-30');
    expect(report).toContain('Q. Tester');
    expect((report.match(/<tr class="unit" data-unit="SN2003">/g) ?? []).length).toBe(4); // every limit has the unit's row
    writeFileSync(join(c, 'site.yaml'), 'vendor: Test\nreports: false\npublish-data: false\n');
    expect(run(['build', 'docs', '--out', 'site-docs', '--no-cache', '--no-pdf']).status).toBe(0);
    expect(existsSync(join(dir, 'site-docs/parts/vt-pad-10/report.html'))).toBe(false);
    expect(existsSync(join(dir, 'site-docs/parts/vt-pad-10/data'))).toBe(false);
    expect(readFileSync(join(dir, 'site-docs/parts/vt-pad-10/index.html'), 'utf8')).not.toContain('Test report');
  });

  it('a published part that fails a limit: a warning per failing limit on stderr; --strict exits 3 (the site is still written)', () => {
    content('gate');
    const r = run(['build', 'gate', '--out', 'site-gate', '--no-cache', '--no-pdf']);
    expect(r.status).toBe(0);
    // the demo attenuator's unit SN2003 has a chipped resistor: its attenuation leaves 10 dB ± 0.5 dB
    expect(r.stderr).toMatch(
      /^warning: VT-PAD-10 fails Attenuation on S21 over full: worst 10\.65 dB \(SN2003 at [\d.]+ MHz\) against 10\.00 dB ± 0\.50 dB\n$/,
    );
    const strict = run(['build', 'gate', '--out', 'site-gate', '--no-cache', '--no-pdf', '--strict']);
    expect(strict.status).toBe(3);
    expect(existsSync(join(dir, 'site-gate/parts/vt-pad-10/index.html'))).toBe(true);
  });

  it('an empty content folder is an error, and bad usage exits 2', () => {
    mkdirSync(join(dir, 'empty'));
    const r = run(['build', 'empty', '--out', 'site-x']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('no parts found: expected empty/parts/<slug>/part.yaml');
    expect(run(['build', 'a', 'b']).status).toBe(2);
    expect(run(['build', '--outt', 'x']).stderr).toContain('did you mean --out?');
  });
});
