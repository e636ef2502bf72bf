/**
 * A comparison's two pieces of arithmetic against independent code:
 * - difference traces on two different grids against numpy's interp on the
 *   same values, on a common grid built by numpy's union1d (numpy is what
 *   Debian's python3-scikit-rf depends on);
 * - the renormalization of a file measured at 75 Ω (the demo's own, written
 *   with R 75) against scikit-rf's Network.renormalize (Debian's
 *   python3-scikit-rf 0.15.4), entry by entry.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { commonGrid, differenceTrace, medianTrace } from '../../src/evaluate/difference.js';
import { renormalize } from '../../src/network/convert.js';
import { readTouchstone } from '../../src/touchstone/read.js';
import { expectClose } from '../helpers.js';
import { PREREQUISITES, PYTHON } from '../support/prerequisites.js';

const ROOT = join(import.meta.dirname, '../..');
const SCRIPT = join(import.meta.dirname, 'skrf_compare.py');
const available = (PREREQUISITES.find((p) => p.name === 'scikit-rf') as (typeof PREREQUISITES)[number]).present();
if (!available && process.env.CI) throw new Error('scikit-rf is required in CI (apt-get install -y python3-scikit-rf)');

const network = (rel: string) => {
  const r = readTouchstone(readFileSync(join(ROOT, rel)), { fileName: rel });
  if (!r.value) throw new Error(`${rel}: ${JSON.stringify(r.errors)}`);
  return r.value.network;
};

/** Insertion loss of S21 in dB at every point: −20·log10|S21| (the definition). */
const loss = (net: ReturnType<typeof network>) =>
  Float64Array.from(net.freqHz, (_, k) => -20 * Math.log10(Math.hypot(net.s[2 * (k * 4 + 2)], net.s[2 * (k * 4 + 2) + 1])));

describe('difference traces (our own rules)', () => {
  it('the common grid: both grids inside the overlap and the band, its ends included, each point once', () => {
    const a = Float64Array.of(1, 2, 3, 4, 5),
      b = Float64Array.of(2.5, 3, 3.5, 6);
    expect(Array.from(commonGrid(a, b, 0, 10))).toEqual([2.5, 3, 3.5, 4, 5]);
    expect(Array.from(commonGrid(a, b, 2.7, 3.2))).toEqual([2.7, 3, 3.2]);
    expect(Array.from(commonGrid(a, Float64Array.of(7, 8), 0, 10))).toEqual([]);
  });

  it('a trace minus itself plus 0.5 dB is 0.5 dB flat; the median of three traces is the middle one where all reach, never extrapolated', () => {
    const f = Float64Array.of(1, 2, 3),
      v = Float64Array.of(1, 4, 2);
    const d = differenceTrace({ freqHz: f, values: v.map((x) => x + 0.5) }, { freqHz: f, values: v }, 0, 9);
    for (const x of d.values) expectClose(x, 0.5, 1e-15, 'flat difference');
    const m = medianTrace([
      { freqHz: f, values: v },
      { freqHz: f, values: v.map((x) => x + 1) },
      { freqHz: Float64Array.of(1, 2), values: Float64Array.of(0, 0) },
    ]);
    expect(Array.from(m.values)).toEqual([1, 4, 2.5]); // at 3 only two traces reach: the mean of the middle pair
  });
});

describe.skipIf(!available)('against numpy and scikit-rf', () => {
  it("insertion loss of the catalog filter (5 MHz grid) minus an Orrin unit (6.25 MHz grid) over 2.40–2.4835 GHz equals numpy.interp on numpy's common grid, to 1e-12 dB", () => {
    const a = network('content/comparisons/data/orrin-or-bp24/unit-a.s2p'),
      b = network('content/parts/vt-bpf-2450/data/sn1001.s2p');
    const ta = { freqHz: a.freqHz, values: loss(a) },
      tb = { freqHz: b.freqHz, values: loss(b) };
    const ours = differenceTrace(ta, tb, 2.4e9, 2.4835e9);
    const input = JSON.stringify({
      fa: Array.from(ta.freqHz),
      va: Array.from(ta.values),
      fb: Array.from(tb.freqHz),
      vb: Array.from(tb.values),
      from: 2.4e9,
      to: 2.4835e9,
    });
    const theirs = JSON.parse(execFileSync(PYTHON, [SCRIPT, 'interp'], { input, stdio: ['pipe', 'pipe', 'ignore'] }).toString()) as {
      grid: number[];
      diff: number[];
    };
    expect(Array.from(ours.freqHz)).toEqual(theirs.grid);
    expect(theirs.grid.length).toBeGreaterThan(20); // points of both grids
    theirs.diff.forEach((v, k) => expectClose(ours.values[k], v, 1e-12, `difference at ${theirs.grid[k]} Hz`));
  });

  it("the demo's 75 Ω file renormalized to 50 Ω: every S entry equals scikit-rf's renormalize to 1e-12", () => {
    const rel = 'content/comparisons/data/tallowmere-tc-2442f/sn0117.s2p';
    const out = execFileSync(PYTHON, [SCRIPT, 'renormalize', join(ROOT, rel)], { stdio: ['ignore', 'pipe', 'ignore'] })
      .toString()
      .trim()
      .split('\n')
      .at(-1) as string;
    const theirs = (JSON.parse(out) as { files: Array<{ z0: number[]; re: number[]; im: number[] }> }).files[0];
    const net = network(rel);
    expect(Array.from(net.z0)).toEqual([75, 75]);
    expect(theirs.z0).toEqual([75, 75]);
    const ours = renormalize(net, 50);
    expect(ours.s.length).toBe(2 * theirs.re.length);
    theirs.re.forEach((re, i) => {
      expectClose(ours.s[2 * i], re, 1e-12, `Re S entry ${i}`);
      expectClose(ours.s[2 * i + 1], theirs.im[i], 1e-12, `Im S entry ${i}`);
    });
  });
});
