/**
 * Touchstone text → TouchstoneRecord (values as written), for versions 1.x,
 * 2.0 and 2.1 (IBIS Open Forum).
 *
 * The parser is a line-driven state machine fed with byte chunks, so that a
 * large file streams through a fixed-size buffer. Numbers go straight from
 * bytes into Float64Array storage (see number.ts). It counts values rather
 * than trusting line breaks: a point is 1 + 2·E numbers (E matrix entries),
 * wrapped over as many lines as the writer liked, but a point always starts
 * on a new line and ends at the end of one.
 *
 * It stops at the first error; there is never a partial record.
 */
import { StopParsing, fail, type TouchstoneError, type TouchstoneWarning } from './diagnostics.js';
import { parseKeyword, type HeaderState } from './keywords.js';
import { latin1, scanEnd, scanNumber } from './number.js';
import { parseOptionLine } from './options.js';
import { layoutFor, type Layout } from './layout.js';
import { FREQUENCY_EXPONENT, type OptionLine, type TouchstoneRecord, type Version } from './types.js';

export interface ParseOptions {
  /** File name: gives the port count of a version 1 file (.s2p → 2) and names the file in messages. */
  readonly fileName?: string;
  /** Port count for a version 1 text with no usable extension. */
  readonly ports?: number;
  /** Total size in bytes, when known: lets storage be sized once. */
  readonly sizeHint?: number;
  /**
   * Keep where each network value's text is in the input (record.tokens):
   * for writers that copy numbers as written rather than format them again.
   */
  readonly keepTokens?: boolean;
}

export interface ParseResult {
  readonly record: TouchstoneRecord | null;
  readonly errors: readonly TouchstoneError[];
  readonly warnings: readonly TouchstoneWarning[];
}

/** Port count from a version 1 extension (.s2p, .S12P, .y3p …), or null. */
export function portsFromFileName(name: string): number | null {
  const m = /\.[a-z](\d+)p$/i.exec(name);
  if (!m) return null;
  const n = Number(m[1]);
  return n >= 1 ? n : null;
}

const MAX_COMMENTS = 200;

/**
 * What the first bytes of a file say it is, when that is not a Touchstone
 * text: a message, 'bom' for a UTF-8 byte-order mark to skip, 'cr-only' for
 * lines ended by CR alone, or null for ordinary text.
 */
export function sniff(b: Uint8Array): string | 'bom' | 'cr-only' | null {
  if (b.length >= 2 && b[0] === 0x1f && b[1] === 0x8b) return 'the file is gzip-compressed, not text; unpack it first (gunzip) and read the .sNp file inside';
  if (b.length >= 4 && b[0] === 0x50 && b[1] === 0x4b && b[2] === 3 && b[3] === 4)
    return 'the file is a ZIP archive, not text; unpack it first and read the .sNp file inside';
  if (b.length >= 2 && ((b[0] === 0xff && b[1] === 0xfe) || (b[0] === 0xfe && b[1] === 0xff)))
    return 'the file is UTF-16 text (it starts with a UTF-16 byte-order mark); save it as UTF-8 or ASCII';
  const head = b.subarray(0, Math.min(b.length, 4096));
  // UTF-16 without a mark: every other byte of ASCII text is zero
  let zeros = 0;
  for (let i = 0; i < head.length; i++) if (head[i] === 0) zeros++;
  if (head.length >= 8 && zeros >= head.length / 3) return 'the file looks like UTF-16 text (every other byte is zero); save it as UTF-8 or ASCII';
  let controls = 0;
  for (let i = 0; i < head.length; i++) {
    const c = head[i];
    if (c < 32 && c !== 9 && c !== 10 && c !== 12 && c !== 13 && c !== 0) controls++;
  }
  if (controls > 0 && controls >= head.length / 100)
    return `the file holds binary data (${controls} control bytes in its first ${head.length}); a Touchstone file is plain text`;
  if (b.length >= 3 && b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf) return 'bom';
  if (b.indexOf(10) < 0 && b.indexOf(13) >= 0) return 'cr-only';
  return null;
}
const decoder = new TextDecoder('utf-8');

type Phase = 'start' | 'v1' | 'header' | 'network' | 'between' | 'noise' | 'information' | 'end';

/** A growable Float64Array. */
class Column {
  data: Float64Array;
  constructor(capacity: number) {
    this.data = new Float64Array(Math.max(capacity, 1));
  }
  grow(needed: number): void {
    const next = new Float64Array(Math.max(needed, this.data.length + 1));
    next.set(this.data);
    this.data = next;
  }
  /**
   * The first `used` values. Storage that is at most a quarter too large is
   * handed over as a view (no copy, so no second array at the peak); more
   * slack is trimmed by a copy.
   */
  take(used: number): Float64Array {
    if (used === this.data.length) return this.data;
    return this.data.length - used <= this.data.length / 4 ? this.data.subarray(0, used) : this.data.slice(0, used);
  }
}

export class TouchstoneParser {
  private readonly opts: ParseOptions;
  private carry: Uint8Array | null = null;
  private line = 0;
  private bytesSeen = 0;
  private error: TouchstoneError | null = null;
  private readonly warnings: TouchstoneWarning[] = [];
  private phase: Phase = 'start';
  private crOnly = false;
  private version: Version = '1.1';
  private readonly header: HeaderState;
  private options: OptionLine | null = null;
  private readonly comments: string[] = [];
  private readonly information: string[] = [];
  private sawImpedanceComment = false;
  /** Where the current line starts in the current buffer (for columns). */
  private lineStart = 0;

  // network data
  private ports = 0;
  private layout: Layout | null = null;
  private freqExp = 9;
  private recordSize = 0; // numbers per point, frequency included
  private stride = 0; // values per point in full-matrix storage
  private freq: Column | null = null;
  private vals: Column | null = null;
  /** With keepTokens: per value, its text's offset in the input × 64 + its length (0 when longer than 63 bytes). */
  private toks: Column | null = null;
  private count = 0;
  private pos = 0; // numbers read of the current point
  private pointLine = 0;
  private lastFreq = -Infinity;
  private lastFreqLine = 0;
  private firstPointBytes = 0;
  private firstPointStart = 0;
  private magnitudeCheck = false;
  /** Storage has been sized from the file size once. */
  private sized = false;

  // noise data
  private noise: Column[] | null = null;
  private noiseCount = 0;
  private noisePos = 0;
  private noiseLastFreq = -Infinity;
  private noiseLine = 0;

  constructor(options: ParseOptions = {}) {
    this.opts = options;
    this.header = {
      version: null,
      ports: null,
      twoPortOrder: null,
      frequencies: null,
      noiseFrequencies: null,
      reference: null,
      referenceLine: 0,
      matrixFormat: null,
      mixedModeOrder: null,
      pendingReference: false,
    };
  }

  /** Feeds the next chunk of bytes. The chunk is not kept: the caller may reuse it. */
  push(input: Uint8Array): void {
    let chunk = input;
    const start = this.bytesSeen;
    this.bytesSeen += chunk.length;
    if (this.error || this.phase === 'end') return;
    let from = 0;
    if (start === 0) {
      const found = sniff(chunk);
      if (found === 'bom') from = 3;
      else if (found === 'cr-only') {
        this.crOnly = true;
        this.warnings.push({ code: 'cr-line-ends', line: 0, message: 'the lines end in CR alone (classic Mac OS line ends); they are read as line ends' });
      } else if (found) {
        this.error = { code: 'not-text', line: 0, message: found };
        return;
      }
    }
    if (this.crOnly) {
      chunk = chunk.slice();
      for (let i = 0; i < chunk.length; i++) if (chunk[i] === 13) chunk[i] = 10;
    }
    if (this.carry) {
      // finish the line that the previous chunk cut, in a small buffer of its own
      const nl = chunk.indexOf(10);
      const upto = nl < 0 ? chunk.length : nl + 1;
      const joined = new Uint8Array(this.carry.length + upto);
      joined.set(this.carry);
      joined.set(chunk.subarray(0, upto), this.carry.length);
      const joinedBase = start - this.carry.length;
      this.carry = null;
      if (nl < 0) {
        this.carry = joined;
        return;
      }
      this.run(joined, 0, joined.length, joinedBase);
      from = upto;
    }
    const lastNl = chunk.lastIndexOf(10);
    if (lastNl >= from) this.run(chunk, from, lastNl + 1, start);
    const tail = Math.max(from, lastNl + 1);
    if (tail < chunk.length && !this.error) this.carry = chunk.slice(tail);
  }

  /** Ends the input and returns the record or the first error. */
  finish(): ParseResult {
    if (!this.error && this.carry) {
      const c = this.carry;
      this.carry = null;
      this.run(c, 0, c.length, this.bytesSeen - c.length);
    }
    if (!this.error) {
      try {
        return { record: this.complete(), errors: [], warnings: this.warnings };
      } catch (e) {
        if (!(e instanceof StopParsing)) throw e;
        this.error = e.diagnostic;
      }
    }
    return { record: null, errors: [this.error as TouchstoneError], warnings: this.warnings };
  }

  private run(buf: Uint8Array, from: number, to: number, base: number): void {
    try {
      const nul = buf.indexOf(0, from);
      const limit = nul >= 0 && nul < to ? nul : to;
      let s = from;
      while (s < limit && this.phase !== 'end') {
        let e = buf.indexOf(10, s);
        if (e < 0 || e > to) e = to;
        this.line++;
        this.processLine(buf, s, Math.min(e, limit), base);
        s = e + 1;
      }
      if (nul >= 0 && nul < to && this.phase !== 'end') {
        fail('not-text', this.line, 'the file holds binary data (a NUL byte); a Touchstone file is plain text');
      }
    } catch (e) {
      if (!(e instanceof StopParsing)) throw e;
      this.error = e.diagnostic;
    }
  }

  private processLine(buf: Uint8Array, s: number, e: number, base: number): void {
    this.lineStart = s;
    let p = s;
    while (p < e && isBlank(buf[p])) p++;
    if (p >= e) return;
    const c = buf[p];
    if (this.phase === 'information') {
      const text = this.text(buf, p, e);
      if (/^\[\s*end\s+information\s*\]/i.test(text)) this.phase = 'header';
      else this.information.push(text);
      return;
    }
    if (c === 33) {
      this.comment(buf, p + 1, e);
      return;
    }
    if (this.phase === 'end') return;
    if (this.phase === 'start') this.begin(buf, p, e);
    if (c === 35) {
      this.optionLine(buf, p, e);
      return;
    }
    if (c === 91) {
      this.keyword(buf, p, e);
      return;
    }
    if (this.header.pendingReference) {
      this.referenceContinuation(buf, p, e);
      return;
    }
    this.data(buf, p, e, base);
  }

  private text(buf: Uint8Array, from: number, to: number): string {
    return decoder.decode(buf.subarray(from, to)).trim();
  }

  private comment(buf: Uint8Array, from: number, to: number): void {
    const header = this.count === 0 && this.phase !== 'noise' && this.phase !== 'end';
    if (!header && this.sawImpedanceComment) return;
    const text = this.text(buf, from, to);
    if (header && this.comments.length < MAX_COMMENTS) this.comments.push(text.slice(0, 500));
    if (!this.sawImpedanceComment && /port\s*impedance/i.test(text)) {
      this.sawImpedanceComment = true;
      this.warnings.push({
        code: 'comment-impedance',
        line: this.line,
        message:
          'a comment mentions port impedances (as some simulators write); comments are not Touchstone data, so the references come from the option line or [Reference]',
      });
    }
  }

  /** The first line that is not blank or a comment decides the version. */
  private begin(buf: Uint8Array, p: number, e: number): void {
    const text = this.text(buf, p, e).replace(/!.*$/, '');
    if (/^\[\s*version\s*\]/i.test(text)) {
      this.phase = 'header';
      return;
    }
    this.phase = 'v1';
    const fromName = this.opts.fileName ? portsFromFileName(this.opts.fileName) : null;
    const n = this.opts.ports ?? fromName;
    if (!n) {
      fail(
        'port-count',
        0,
        this.opts.fileName
          ? `cannot tell the port count: a version 1 file gives it in its extension (.s2p for 2 ports, .s4p for 4), and "${this.opts.fileName}" has none; rename it, or start the file with [Version] 2.0 and [Number of Ports]`
          : 'cannot tell the port count of a version 1 text without a file name (.s2p for 2 ports); pass the port count',
      );
    }
    this.ports = n;
    if (/^\.ts$/i.test(this.opts.fileName?.slice(-3) ?? '')) {
      fail('version', this.line, 'a .ts file is Touchstone version 2 and must start with [Version] 2.0 or 2.1');
    }
  }

  private optionLine(buf: Uint8Array, p: number, e: number): void {
    if (this.options) {
      if (this.phase !== 'network' && this.phase !== 'noise') {
        this.warnings.push({
          code: 'later-option-line',
          line: this.line,
          message: `only the first option line (line ${this.options.line}) counts; this one is ignored`,
        });
      }
      return;
    }
    if (this.phase === 'header' && this.header.version === null) {
      fail('keyword-order', this.line, 'in a version 2 file the option line comes after [Version]');
    }
    let q = p + 1;
    while (q < e && buf[q] !== 33) q++;
    this.options = parseOptionLine(latin1(buf, p + 1, q), this.line, p - this.lineStart + 2);
  }

  private keyword(buf: Uint8Array, p: number, e: number): void {
    let q = p;
    while (q < e && buf[q] !== 33) q++;
    const text = this.text(buf, p, q);
    if (this.phase === 'v1') {
      fail('unknown-keyword', this.line, `keyword ${text.split(']')[0]}] in a version 1 file; a file with keywords must start with [Version] 2.0 or 2.1`);
    }
    const action = parseKeyword(text, this.line, this.header, this.phase);
    switch (action) {
      case 'information':
        this.phase = 'information';
        return;
      case 'network-data':
        this.startNetwork();
        return;
      case 'noise-data':
        this.closeNetwork();
        this.startNoise();
        return;
      case 'end':
        if (this.phase === 'network') this.closeNetwork();
        if (this.phase === 'noise') this.closeNoise();
        if (this.phase === 'header') fail('missing-keyword', this.line, '[End] before [Network Data]; a version 2 file must hold [Network Data]');
        this.phase = 'end';
        return;
      case 'header':
        if (this.phase !== 'header') fail('keyword-order', this.line, `${text.split(']')[0]}] belongs before [Network Data]`);
        return;
    }
  }

  private referenceContinuation(buf: Uint8Array, p: number, e: number): void {
    let q = p;
    const ref = this.header.reference as number[];
    while (q < e) {
      while (q < e && isBlank(buf[q])) q++;
      if (q >= e || buf[q] === 33) break;
      const v = scanNumber(buf, q, e);
      if (scanEnd < 0)
        fail(
          'keyword-value',
          this.line,
          `"${latin1(buf, q, -scanEnd - 1)}" in [Reference] is not a number; expected one reference resistance in ohms per port`,
          q - this.lineStart + 1,
        );
      if (!(v > 0) || !Number.isFinite(v)) fail('keyword-value', this.line, `[Reference] value ${v} must be a positive number of ohms`, q - this.lineStart + 1);
      ref.push(v);
      if (ref.length > (this.header.ports as number)) {
        fail('keyword-value', this.line, `[Reference] holds more than ${this.header.ports} values; expected one per port`);
      }
      q = scanEnd;
    }
    if (ref.length === this.header.ports) this.header.pendingReference = false;
  }

  private setUpStorage(ports: number, frequencies: number | null): void {
    if (!this.options) fail('missing-option-line', this.line, 'no option line ("# GHz S MA R 50") before the data');
    const opt = this.options;
    if ((opt.parameter === 'H' || opt.parameter === 'G') && ports !== 2) {
      fail('parameter-ports', opt.line, `${opt.parameter}-parameters are defined for 2-ports only; this file has ${ports} ports`);
    }
    if (opt.resistance.length > 1 && this.version !== '2.1') {
      fail('option-value', opt.line, `per-port R values on the option line need [Version] 2.1${this.version === '1.1' ? '' : '; in 2.0 use [Reference]'}`);
    }
    if (opt.resistance.length > 1 && opt.resistance.length !== ports) {
      fail('option-value', opt.line, `the option line gives ${opt.resistance.length} R values for ${ports} ports; expected one, or one per port`);
    }
    if ((opt.parameter === 'H' || opt.parameter === 'G') && this.header.matrixFormat && this.header.matrixFormat !== 'full') {
      fail(
        'keyword-value',
        this.line,
        `[Matrix Format] ${this.header.matrixFormat} cannot hold ${opt.parameter}-parameters: their off-diagonal entries differ in sign even for a reciprocal network; expected Full`,
      );
    }
    this.ports = ports;
    const twoPortOrder = this.version === '1.1' ? '21_12' : this.header.twoPortOrder;
    this.layout = layoutFor(ports, this.header.matrixFormat ?? 'full', twoPortOrder ?? '12_21');
    this.recordSize = 1 + 2 * this.layout.place.length;
    this.stride = 2 * ports * ports;
    this.freqExp = FREQUENCY_EXPONENT[opt.frequencyUnit];
    this.magnitudeCheck = opt.format === 'MA';
    const cap = frequencies ?? 64;
    this.freq = new Column(cap);
    this.vals = new Column(cap * this.stride);
    if (this.opts.keepTokens) this.toks = new Column(cap * this.stride);
  }

  private startNetwork(): void {
    const h = this.header;
    this.version = h.version as Version;
    if (h.ports === null) fail('missing-keyword', this.line, '[Network Data] before [Number of Ports]; a version 2 file must declare [Number of Ports]');
    if (h.ports === 2 && h.twoPortOrder === null) {
      // required by the standard, yet its own Example 20 goes without: read in version 1's order, which the omission implies
      h.twoPortOrder = '21_12';
      this.warnings.push({
        code: 'missing-two-port-order',
        line: this.line,
        message:
          'a version 2 file with 2 ports must declare [Two-Port Data Order] before [Network Data]; read as 21_12 (N11 N21 N12 N22), the order of version 1',
      });
    }
    if (h.frequencies === null) fail('missing-keyword', this.line, '[Network Data] before [Number of Frequencies]; a version 2 file must declare it');
    if (h.pendingReference)
      fail('keyword-value', this.line, `[Reference] holds ${(h.reference as number[]).length} values before [Network Data]; expected ${h.ports}, one per port`);
    if (this.opts.fileName) {
      const fromName = portsFromFileName(this.opts.fileName);
      if (fromName !== null && fromName !== h.ports) {
        this.warnings.push({
          code: 'extension-mismatch',
          line: 0,
          message: `the extension says ${fromName} ports but [Number of Ports] says ${h.ports}; the keyword wins`,
        });
      }
    }
    this.setUpStorage(h.ports, h.frequencies);
    this.phase = 'network';
  }

  private closeNetwork(): void {
    if (this.phase !== 'network') return;
    if (this.pos !== 0) this.incompletePoint();
    const want = this.header.frequencies as number;
    if (this.count !== want) {
      fail('frequency-count', this.line, `[Number of Frequencies] declares ${want} points, but the network data hold ${this.count}`);
    }
    this.phase = 'between';
  }

  private startNoise(): void {
    if (this.ports !== 2) fail('noise-data', this.line, `noise data are defined for 2-ports only; this file has ${this.ports} ports`);
    if (this.header.noiseFrequencies === null) fail('missing-keyword', this.line, '[Noise Data] needs [Number of Noise Frequencies] in the header');
    this.noise = Array.from({ length: 5 }, () => new Column(this.header.noiseFrequencies as number));
    this.phase = 'noise';
  }

  private closeNoise(): void {
    if (this.noisePos !== 0) {
      fail(
        'value-count',
        this.noiseLine,
        `the noise point at line ${this.noiseLine} has ${this.noisePos} of its 5 values (frequency, NFmin dB, |Γopt|, ∠Γopt, Rn)`,
      );
    }
    if (this.version !== '1.1' && this.noiseCount !== this.header.noiseFrequencies) {
      fail(
        'noise-count',
        this.line,
        `[Number of Noise Frequencies] declares ${this.header.noiseFrequencies} points, but the noise data hold ${this.noiseCount}`,
      );
    }
  }

  private data(buf: Uint8Array, p: number, e: number, base: number): void {
    switch (this.phase) {
      case 'v1':
        if (!this.layout) this.setUpStorage(this.ports, null);
        this.phase = 'network';
        this.version = '1.1';
        this.networkLine(buf, p, e, base);
        return;
      case 'network':
        this.networkLine(buf, p, e, base);
        return;
      case 'noise':
        this.noiseLineData(buf, p, e, this.lineStart);
        return;
      case 'header':
        fail('keyword-order', this.line, 'data before [Network Data]; in a version 2 file the network data follow the [Network Data] keyword');
      // fallthrough is unreachable: fail throws
      case 'between':
        fail('keyword-order', this.line, 'data after the network data; noise data must follow [Noise Data]');
    }
  }

  /** The hot loop: numbers of network data straight into storage. */
  private networkLine(buf: Uint8Array, p: number, e: number, base: number): void {
    const lineStart = this.lineStart;
    const layout = this.layout as Layout;
    const place = layout.place;
    const mirror = layout.mirror;
    const size = this.recordSize;
    let vals = (this.vals as Column).data;
    let toks = this.toks ? this.toks.data : null;
    let pos = this.pos;
    let at = this.count * this.stride;
    let ended = false;
    while (true) {
      while (p < e && isBlank(buf[p])) p++;
      if (p >= e || buf[p] === 33) break;
      if (ended) {
        this.pos = pos;
        fail(
          'value-count',
          this.line,
          `more values on this line than one point holds: ${this.describePoint()}; each point starts on a new line`,
          p - lineStart + 1,
        );
      }
      if (pos === 0) {
        const f = scanNumber(buf, p, e, this.freqExp);
        if (scanEnd < 0) this.badNumber(buf, p, -scanEnd - 1, lineStart);
        if (!(f <= this.lastFreq) || this.count === 0) {
          // a new network point
        } else {
          if (this.version === '1.1' && this.ports === 2 && countNumbers(buf, p, e) === 5) {
            this.closeV1Network();
            this.phase = 'noise';
            this.noiseLineData(buf, p, e, lineStart);
            return;
          }
          if (f === this.lastFreq) {
            fail(
              'duplicate-frequency',
              this.line,
              `frequency ${fmtHz(f)} appears twice, at lines ${this.lastFreqLine} and ${this.line}; each frequency must be given once`,
              p - lineStart + 1,
            );
          }
          fail(
            'frequency-order',
            this.line,
            `frequency ${fmtHz(f)} is below the previous one (${fmtHz(this.lastFreq)}, line ${this.lastFreqLine}); network frequencies must increase`,
            p - lineStart + 1,
          );
        }
        if (!(f >= 0) || !Number.isFinite(f))
          fail('number-range', this.line, `frequency ${latin1(buf, p, scanEnd)} must be a finite number ≥ 0`, p - lineStart + 1);
        const freq = this.freq as Column;
        if (this.version !== '1.1' && this.count >= (this.header.frequencies as number)) {
          fail('frequency-count', this.line, `more points than [Number of Frequencies] declares (${this.header.frequencies})`);
        }
        if (this.count >= freq.data.length) this.growStorage(base + p);
        vals = (this.vals as Column).data;
        if (this.toks) toks = this.toks.data;
        freq.data[this.count] = f;
        if (this.count === 0) this.firstPointStart = base + p;
        this.lastFreq = f;
        this.lastFreqLine = this.line;
        this.pointLine = this.line;
        at = this.count * this.stride;
        pos = 1;
        p = scanEnd;
        continue;
      }
      const v = scanNumber(buf, p, e);
      if (scanEnd < 0) this.badNumber(buf, p, -scanEnd - 1, lineStart);
      const r = pos - 1;
      const pair = r >> 1;
      const part = r & 1;
      if (part === 0 && this.magnitudeCheck && v < 0) {
        fail(
          'negative-magnitude',
          this.line,
          `magnitude ${latin1(buf, p, scanEnd)} is negative; in MA format the first number of each pair is a magnitude ≥ 0`,
          p - lineStart + 1,
        );
      }
      if (v !== v || v === Infinity || v === -Infinity)
        fail('number-range', this.line, `${latin1(buf, p, scanEnd)} is out of the range of a double`, p - lineStart + 1);
      vals[at + place[pair] + part] = v;
      const m = mirror[pair];
      if (m >= 0) vals[at + m + part] = v;
      if (toks) {
        const len = scanEnd - p;
        const t = len < 64 ? (base + p) * 64 + len : 0;
        toks[at + place[pair] + part] = t;
        if (m >= 0) toks[at + m + part] = t;
      }
      p = scanEnd;
      pos++;
      if (pos === size) {
        pos = 0;
        this.count++;
        ended = true;
        if (this.count === 1) this.firstPointBytes = base + e - this.firstPointStart + 1;
      }
    }
    this.pos = pos;
  }

  /**
   * Storage is full. Once the first point's size in bytes is known and the
   * file size is, storage is sized for the whole file with 5 % to spare;
   * otherwise (or if that was short) it grows by a quarter.
   */
  private growStorage(offset: number): void {
    const freq = this.freq as Column;
    const vals = this.vals as Column;
    let want = Math.ceil(freq.data.length * 1.25) + 1;
    const total = this.opts.sizeHint;
    if (total && this.firstPointBytes > 0 && !this.sized) {
      this.sized = true;
      want = Math.max(want, this.count + Math.ceil(((total - offset) / this.firstPointBytes) * 1.05) + 2);
    }
    freq.grow(want);
    vals.grow(want * this.stride);
    this.toks?.grow(want * this.stride);
  }

  private describePoint(): string {
    const n = this.ports;
    const pairs = (this.layout as Layout).place.length;
    const order =
      n === 2 && this.version === '1.1'
        ? ' in the order N11 N21 N12 N22'
        : n === 2 && this.header.twoPortOrder
          ? ` in the order of [Two-Port Data Order] ${this.header.twoPortOrder}`
          : '';
    return `a ${n}-port point holds ${this.recordSize} values (the frequency and ${pairs} pairs${order})`;
  }

  private incompletePoint(): never {
    const hint =
      this.ports === 2 && this.version === '1.1' && this.pos === 5
        ? '; if these are noise parameters, they must start at a frequency not above the last network frequency'
        : '';
    fail('value-count', this.pointLine, `the point that starts at line ${this.pointLine} has ${this.pos} values; ${this.describePoint()}${hint}`);
  }

  private closeV1Network(): void {
    if (this.pos !== 0) this.incompletePoint();
    this.noise = Array.from({ length: 5 }, () => new Column(64));
  }

  private badNumber(buf: Uint8Array, from: number, to: number, lineStart: number): never {
    let first = lineStart;
    while (first < from && isBlank(buf[first])) first++;
    const c = buf[from] | 32;
    if (first === from && c >= 97 && c <= 122) {
      // a line that starts with a word is prose (a note pasted in, a footer, the start of a page of text), not a bad value
      let end = from;
      while (end < buf.length && buf[end] !== 10 && buf[end] !== 13 && end - from < 60) end++;
      const text = latin1(buf, from, end).trim();
      const cut =
        this.pos > 0
          ? `; the point that starts at line ${this.pointLine} has ${this.pos} of its ${this.recordSize} values, so the data end here cut short`
          : '';
      fail(
        'bad-number',
        this.line,
        `this line is text, not data ("${text}${end - from >= 60 ? '…' : ''}"); a comment starts with "!"${cut}`,
        from - lineStart + 1,
      );
    }
    fail('bad-number', this.line, `"${latin1(buf, from, to)}" is not a number; expected a value such as 0.5, -12.25 or 1.5e-3`, from - lineStart + 1);
  }

  private noiseLineData(buf: Uint8Array, p: number, e: number, lineStart: number): void {
    const cols = this.noise as Column[];
    let ended = false;
    while (true) {
      while (p < e && isBlank(buf[p])) p++;
      if (p >= e || buf[p] === 33) break;
      if (ended)
        fail(
          'value-count',
          this.line,
          'more values on this line than one noise point holds (frequency, NFmin dB, |Γopt|, ∠Γopt, Rn); each point starts on a new line',
          p - lineStart + 1,
        );
      const k = this.noisePos;
      const v = scanNumber(buf, p, e, k === 0 ? this.freqExp : 0);
      if (scanEnd < 0) this.badNumber(buf, p, -scanEnd - 1, lineStart);
      if (!Number.isFinite(v)) fail('number-range', this.line, `${latin1(buf, p, scanEnd)} is out of the range of a double`, p - lineStart + 1);
      if (k === 0) {
        if (this.version !== '1.1' && this.noiseCount >= (this.header.noiseFrequencies as number)) {
          fail('noise-count', this.line, `more noise points than [Number of Noise Frequencies] declares (${this.header.noiseFrequencies})`);
        }
        if (!(v > this.noiseLastFreq))
          fail(
            'frequency-order',
            this.line,
            `noise frequency ${fmtHz(v)} does not increase (line ${this.noiseLine} had ${fmtHz(this.noiseLastFreq)})`,
            p - lineStart + 1,
          );
        this.noiseLastFreq = v;
        this.noiseLine = this.line;
        if (this.noiseCount >= cols[0].data.length) for (const col of cols) col.grow(this.noiseCount + 1);
      }
      if (k === 2 && v < 0) fail('negative-magnitude', this.line, `|Γopt| ${latin1(buf, p, scanEnd)} is negative; expected a magnitude ≥ 0`, p - lineStart + 1);
      cols[k].data[this.noiseCount] = v;
      p = scanEnd;
      this.noisePos = k + 1;
      if (this.noisePos === 5) {
        this.noisePos = 0;
        this.noiseCount++;
        ended = true;
      }
    }
  }

  private complete(): TouchstoneRecord {
    if (this.phase === 'start' || (this.phase === 'v1' && !this.layout)) {
      if (this.bytesSeen === 0) fail('no-data', 0, 'the file is empty (0 bytes); expected a Touchstone file ("# GHz S MA R 50" followed by the data)');
      if (!this.options)
        fail(
          'missing-option-line',
          0,
          `the file holds no option line and no data (it ends at line ${this.line}); expected a Touchstone file ("# GHz S MA R 50" followed by the data)`,
        );
      fail('no-data', 0, `the file holds no network data: it ends at line ${this.line}, and nothing after the option line (line ${this.options.line}) is data`);
    }
    if (this.phase === 'header' || this.phase === 'information') fail('missing-keyword', 0, 'the version 2 file has no [Network Data]');
    if (this.phase === 'network') {
      const declared = this.header.frequencies as number;
      if (this.version !== '1.1' && this.count + (this.pos > 0 ? 1 : 0) < declared) {
        fail(
          'frequency-count',
          0,
          `the file ends at line ${this.line}, without [End], after ${this.count} of the ${declared} points [Number of Frequencies] declares${this.pos ? ` and ${this.pos} of the ${this.recordSize} values of the next` : ''}: it looks cut short`,
        );
      }
      if (this.version === '1.1') {
        if (this.pos !== 0) this.incompletePoint();
      } else this.closeNetwork();
    }
    if (this.noise) this.closeNoise();
    if (this.count === 0) fail('no-data', 0, 'the file holds no network data points');
    if (this.version !== '1.1') {
      // the counts of [Number of Frequencies] (and of noise frequencies) held, so the data are whole without these
      if (this.header.noiseFrequencies !== null && !this.noise) {
        this.warnings.push({
          code: 'missing-noise-data',
          line: 0,
          message: `[Number of Noise Frequencies] declares ${this.header.noiseFrequencies} noise points, but the file has no [Noise Data]; read without noise parameters`,
        });
      }
      if (this.phase !== 'end')
        this.warnings.push({
          code: 'missing-end',
          line: 0,
          message: `the version 2 file ends at line ${this.line} without [End], which the standard requires; its data hold the ${this.count} points [Number of Frequencies] declares, so they are read`,
        });
    }
    const opt = this.options as OptionLine;
    const n = this.ports;
    const ref = this.header.reference ?? (opt.resistance.length === n ? opt.resistance : Array(n).fill(opt.resistance[0] ?? 50));
    const noise =
      this.noise && this.noiseCount > 0
        ? {
            freqHz: this.noise[0].take(this.noiseCount),
            nfMinDb: this.noise[1].take(this.noiseCount),
            gammaOptMag: this.noise[2].take(this.noiseCount),
            gammaOptDeg: this.noise[3].take(this.noiseCount),
            rn: this.noise[4].take(this.noiseCount),
          }
        : null;
    return {
      version: this.version,
      ports: n,
      options: opt,
      referenceOhms: ref,
      matrixFormat: this.header.matrixFormat ?? 'full',
      twoPortOrder: n === 2 ? (this.version === '1.1' ? '21_12' : this.header.twoPortOrder) : null,
      mixedModeOrder: this.header.mixedModeOrder,
      freqHz: (this.freq as Column).take(this.count),
      values: (this.vals as Column).take(this.count * this.stride),
      ...(this.toks ? { tokens: this.toks.take(this.count * this.stride) } : {}),
      noise,
      comments: this.comments,
      information: this.information,
    };
  }
}

function isBlank(c: number): boolean {
  return c === 32 || c === 9 || c === 13 || c === 11 || c === 12;
}

function countNumbers(buf: Uint8Array, p: number, e: number): number {
  let n = 0;
  while (p < e) {
    while (p < e && isBlank(buf[p])) p++;
    if (p >= e || buf[p] === 33) break;
    n++;
    while (p < e && !isBlank(buf[p]) && buf[p] !== 33) p++;
  }
  return n;
}

function fmtHz(f: number): string {
  if (f >= 1e9) return `${+(f / 1e9).toPrecision(12)} GHz`;
  if (f >= 1e6) return `${+(f / 1e6).toPrecision(12)} MHz`;
  if (f >= 1e3) return `${+(f / 1e3).toPrecision(12)} kHz`;
  return `${f} Hz`;
}

const encoder = new TextEncoder();

/** Parses a whole text or byte array at once. */
export function parseTouchstone(input: string | Uint8Array, options: ParseOptions = {}): ParseResult {
  const bytes = typeof input === 'string' ? encoder.encode(input) : input;
  const parser = new TouchstoneParser({ sizeHint: bytes.length, ...options });
  parser.push(bytes);
  return parser.finish();
}
