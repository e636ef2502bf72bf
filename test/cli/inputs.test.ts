/**
 * Ordinary mistakes in the files a user hands over get one message that
 * points the right way, through the real binary: what a data path really is
 * (a folder, a FIFO), what a file really holds (gzip, UTF-16, binary, CR line
 * ends, a byte-order mark), port names of ports the part lacks, oversized part
 * files, links and paths that would bring outside files into the site, text
 * that would drive the terminal, and a reader that closes the pipe early.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, existsSync, lstatSync, mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '../..');
const BIN = join(ROOT, 'bin/scatterbook.js');
let dir: string;
const PAD = '# GHz S RI R 50\n1 0.1 -0.02 0.9 0.1 0.9 0.1 0.05 0.01\n1.1 0.1 -0.02 0.9 0.1 0.9 0.1 0.05 0.01\n';

function run(args: string[], cwd = dir) {
  const started = Date.now();
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', timeout: 60_000, env: { ...process.env, NO_COLOR: undefined } });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr, seconds: (Date.now() - started) / 1000 };
}

/** A content folder with the demo attenuator; `edit` changes its part file. */
function content(name: string, edit: (yaml: string) => string = (y) => y): string {
  const c = join(dir, name);
  mkdirSync(join(c, 'parts'), { recursive: true });
  cpSync(join(ROOT, 'content/parts/vt-pad-10'), join(c, 'parts/vt-pad-10'), { recursive: true });
  const yaml = join(c, 'parts/vt-pad-10/part.yaml');
  writeFileSync(yaml, edit(readFileSync(yaml, 'utf8')));
  return c;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'scatterbook-inputs-'));
});

describe('what a data path really is', () => {
  it('a folder or a FIFO named as a measurement file is called what it is (and the FIFO never blocks)', () => {
    const c = content('paths');
    const data = join(c, 'parts/vt-pad-10/data');
    mkdirSync(join(data, 'folder.s2p'));
    execFileSync('mkfifo', [join(data, 'pipe.s2p')]);
    const yaml = join(c, 'parts/vt-pad-10/part.yaml');
    writeFileSync(
      yaml,
      readFileSync(yaml, 'utf8').replace('file: data/sn2001.s2p', 'file: data/folder.s2p').replace('file: data/sn2002.s2p', 'file: data/pipe.s2p'),
    );
    const r = run(['figures', yaml]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/part\.yaml:14:\d+: error: measurement file "data\/folder\.s2p" of unit SN2001 is a folder, not a file/);
    expect(r.stderr).toMatch(/part\.yaml:15:\d+: error: measurement file "data\/pipe\.s2p" of unit SN2002 is a named pipe \(FIFO\), not a file/);
    expect(r.seconds).toBeLessThan(30);
    const read = run(['read', join(data, 'pipe.s2p')]);
    expect(read.status).toBe(1);
    expect(read.stderr).toContain('error: cannot read the file: it is a named pipe (FIFO), not a file');
  });
});

describe('what a Touchstone file really holds', () => {
  const cases: Array<[string, Uint8Array | string, string]> = [
    ['gzip-compressed', gzipSync(PAD), 'the file is gzip-compressed, not text; unpack it first'],
    [
      'UTF-16 with a mark',
      Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(PAD, 'utf16le')]),
      'the file is UTF-16 text (it starts with a UTF-16 byte-order mark)',
    ],
    ['UTF-16 without a mark', Buffer.from(PAD, 'utf16le'), 'the file looks like UTF-16 text (every other byte is zero)'],
    ['binary', Uint8Array.from({ length: 512 }, (_, i) => (i * 37 + 11) % 256), 'the file holds binary data'],
  ];
  for (const [what, bytes, message] of cases) {
    it(`a ${what} file is named as such, not as "no option line"`, () => {
      writeFileSync(join(dir, 'x.s2p'), bytes);
      const r = run(['read', 'x.s2p']);
      expect(r.status).toBe(1);
      expect(r.stderr).toContain(`x.s2p: error: ${message}`);
      expect(r.stderr).not.toContain('option line');
    });
  }

  it('a UTF-8 byte-order mark is skipped, and lines ended by CR alone are read, with a warning', () => {
    writeFileSync(join(dir, 'bom.s2p'), Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(PAD)]));
    const bom = run(['read', 'bom.s2p', '--json']);
    expect(bom.stderr).toBe('');
    expect(JSON.parse(bom.stdout).frequencyHz).toEqual([1e9, 1.1e9]);
    writeFileSync(join(dir, 'mac.s2p'), PAD.replace(/\n/g, '\r'));
    const mac = run(['read', 'mac.s2p', '--json']);
    expect(mac.status).toBe(0);
    expect(mac.stderr).toBe('mac.s2p: warning: the lines end in CR alone (classic Mac OS line ends); they are read as line ends\n');
    expect(JSON.parse(mac.stdout).frequencyHz).toEqual([1e9, 1.1e9]);
  });

  it('error and warning labels survive a file name with spaces', () => {
    writeFileSync(join(dir, 'ring slot.s2p'), '# GHz S RI R 50\n1 0.1 0 0.9\n');
    const r = run(['read', 'ring slot.s2p']);
    expect(r.stderr).toMatch(/^ring slot\.s2p:2: error: /);
  });
});

describe('part files', () => {
  it('a port name for port 3 of a 2-port part is an error at its key', () => {
    const c = content('ports', (y) => y.replace('ports: {1: IN, 2: OUT}', 'ports: {1: IN, 2: OUT, 3: AUX}'));
    const r = run(['figures', join(c, 'parts/vt-pad-10/part.yaml')]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/part\.yaml:11:24: error: ports names port 3, but the measured files have 2 ports/);
  });

  it('a 63 MB part file is refused at once, unread', () => {
    const c = content('huge');
    const yaml = join(c, 'parts/vt-pad-10/part.yaml');
    writeFileSync(yaml, `${readFileSync(yaml, 'utf8')}notes: "${'x'.repeat(63 * 1024 * 1024)}"\n`);
    const r = run(['figures', yaml]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/part\.yaml: error: the part file is \d+ bytes; files above 1048576 bytes \(1 MiB\) are refused unread/);
    expect(r.seconds).toBeLessThan(10);
  });

  it('control characters in part strings cannot drive the terminal: ESC[8m cannot hide a FAIL', () => {
    const c = content('escape', (y) => y.replace('part: VT-PAD-10', 'part: "X: PASS\\e[8m"').replace('label: Attenuation,', 'label: "Att\\e[2K\\rPASS",'));
    const r = run(['figures', join(c, 'parts/vt-pad-10/part.yaml')]);
    expect(r.status).toBe(0);
    expect(r.stdout).not.toContain('\x1b');
    expect(r.stdout).not.toMatch(/\r/);
    expect(r.stdout).toContain('X: PASS\\x1b[8m');
    const bad = content('escape-bad', (y) => y.replace('class: attenuator', 'class: "att\\e[8m"'));
    const b = run(['build', bad, '--out', join(dir, 'escape-site'), '--no-pdf', '--no-cache']);
    expect(b.status).toBe(1);
    expect(b.stderr).not.toContain('\x1b');
    expect(b.stderr).toContain('"att\\x1b[8m" is not one of');
  });
});

describe('nothing outside the content folder reaches the site', () => {
  it('a link in assets/ to a file outside the content folder is an error naming it; nothing is built', () => {
    const c = content('links');
    mkdirSync(join(c, 'assets'));
    symlinkSync('/etc/passwd', join(c, 'assets/passwd.txt'));
    const r = run(['build', c, '--out', join(dir, 'links-site'), '--no-pdf', '--no-cache']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('links/assets/passwd.txt: error: the link points outside the content folder (to /etc/passwd)');
    expect(existsSync(join(dir, 'links-site'))).toBe(false);
  });

  it('a link to a file inside the content folder is copied as a regular file', () => {
    const c = content('inner-links');
    mkdirSync(join(c, 'assets'));
    writeFileSync(join(c, 'logo-source.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
    symlinkSync(join(c, 'logo-source.svg'), join(c, 'assets/logo.svg'));
    writeFileSync(join(c, 'site.yaml'), 'vendor: Test\nlogo: assets/logo.svg\n');
    expect(run(['build', c, '--out', join(dir, 'inner-site'), '--no-pdf', '--no-cache']).status).toBe(0);
    const copied = join(dir, 'inner-site/assets/logo.svg');
    expect(lstatSync(copied).isFile()).toBe(true);
    expect(readFileSync(copied, 'utf8')).toBe('<svg xmlns="http://www.w3.org/2000/svg"/>');
  });

  it('logo and stylesheet outside the content folder, remote, absolute or missing: positioned errors in site.yaml', () => {
    const c = content('logos');
    writeFileSync(join(c, 'site.yaml'), 'vendor: Test\nlogo: https://example.invalid/logo.png\nstylesheet: ../../outside.css\n');
    const a = run(['build', c, '--out', join(dir, 'logos-site'), '--no-pdf', '--no-cache']);
    expect(a.status).toBe(1);
    expect(a.stderr).toContain('site.yaml:2:7: error: logo "https://example.invalid/logo.png" is a remote address');
    expect(a.stderr).toContain('site.yaml:3:13: error: stylesheet "../../outside.css" must lie in the content folder\'s assets/');
    writeFileSync(join(c, 'site.yaml'), 'vendor: Test\nlogo: /etc/logo.png\nstylesheet: assets/missing.css\n');
    const b = run(['build', c, '--out', join(dir, 'logos-site'), '--no-pdf', '--no-cache']);
    expect(b.stderr).toContain('site.yaml:2:7: error: logo "/etc/logo.png" is an absolute path');
    expect(b.stderr).toContain('site.yaml:3:13: error: stylesheet "assets/missing.css" does not exist in the content folder');
    expect(existsSync(join(dir, 'logos-site'))).toBe(false);
  });
});

describe('a reader that closes the pipe early', () => {
  it('read --json | head ends quietly: no stack trace', () => {
    writeFileSync(join(dir, 'long.s2p'), `# GHz S RI R 50\n${Array.from({ length: 20000 }, (_, k) => `${1 + k * 1e-4} 0.1 0 0.9 0 0.9 0 0.1 0`).join('\n')}\n`);
    const r = spawnSync('sh', ['-c', `"${process.execPath}" "${BIN}" read long.s2p --json | head -c 100 > /dev/null; echo "status \${PIPESTATUS:-done}"`], {
      cwd: dir,
      encoding: 'utf8',
    });
    expect(r.stderr).toBe('');
  });
});
