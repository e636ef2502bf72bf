/**
 * Noise figures against scikit-rf (Debian's python3-scikit-rf), which computes
 * them by another route (the ABCD noise correlation matrix, then
 * Network.nf(z) in admittance form), on the noise-parameter files scikit-rf
 * ships; and one value by hand from the two-port noise equation
 * F = Fmin + 4·(Rn/Z0)·|Γopt|²/|1 + Γopt|² at Γs = 0 (Pozar, Microwave
 * Engineering, ch. 12, from memory).
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { noiseFigureAtZ0 } from '../../src/figures/noise.js';
import { readTouchstone } from '../../src/touchstone/read.js';
import { expectClose, partYaml, resultsOf } from '../helpers.js';
import { PREREQUISITES, PYTHON } from '../support/prerequisites.js';

const FILES = ['ntwk4_n.s2p', 'thru.s2p'].map((f) => join('/usr/lib/python3/dist-packages/skrf/tests', f));
const available = (PREREQUISITES.find((p) => p.name === 'scikit-rf') as (typeof PREREQUISITES)[number]).present();
if (!available && process.env.CI) throw new Error('scikit-rf is required in CI (apt-get install -y python3-scikit-rf)');

const read = (path: string) => {
  const r = readTouchstone(readFileSync(path), { fileName: path });
  if (!r.value?.noise) throw new Error(`${path}: no noise parameters read`);
  return r.value;
};

describe('the noise figure by the two-port noise equation', () => {
  it('by hand: NFmin 2.2 dB, Γopt 0.4∠120°, rn 25 → F = 1.6596 + 100·0.16/0.76 = 22.71, NF 13.563 dB', () => {
    const noise = {
      freqHz: Float64Array.of(75e9),
      nfMinDb: Float64Array.of(2.2),
      gammaOpt: Float64Array.of(0.4 * Math.cos((120 * Math.PI) / 180), 0.4 * Math.sin((120 * Math.PI) / 180)),
      rnOhms: Float64Array.of(25 * 50),
    };
    expectClose(noiseFigureAtZ0(noise, 50)[0], 10 * Math.log10(Math.pow(10, 0.22) + (100 * 0.16) / 0.76), 1e-12, 'NF');
    expectClose(noiseFigureAtZ0(noise, 50)[0], 13.5626, 1e-4, 'NF, to the digits worked out by hand');
  });

  it('Γopt = −1 has no noise figure (|1 + Γopt| = 0): NaN, never a division by zero passed on', () => {
    const noise = { freqHz: Float64Array.of(1e9), nfMinDb: Float64Array.of(1), gammaOpt: Float64Array.of(-1, 0), rnOhms: Float64Array.of(10) };
    expect(noiseFigureAtZ0(noise, 50)[0]).toBeNaN();
  });
});

describe.skipIf(!available)('against scikit-rf', () => {
  // scikit-rf prints a note about matplotlib on stdout first: the JSON is the last line
  const ref = available
    ? (JSON.parse(
        execFileSync(PYTHON, [join(import.meta.dirname, 'skrf_noise.py'), ...FILES], { stdio: ['ignore', 'pipe', 'ignore'] })
          .toString()
          .trim()
          .split('\n')
          .at(-1) as string,
      ) as { version: string; files: Array<{ file: string; f: number[]; nfmin_db: number[]; nf_db: number[] }> })
    : null;

  it.each(FILES)('%s: NF at Z0 and NFmin at every noise frequency, to 1e-9 dB', (path) => {
    const theirs = ref?.files.find((x) => x.file === path);
    if (!theirs) throw new Error(`no reference for ${path}`);
    const data = read(path);
    const noise = data.noise as NonNullable<typeof data.noise>;
    expect(Array.from(noise.freqHz)).toEqual(theirs.f);
    const nf = noiseFigureAtZ0(noise, data.network.z0[0]);
    theirs.nf_db.forEach((v, k) => expectClose(nf[k], v, 1e-9, `${path} NF at ${theirs.f[k]} Hz`));
    theirs.nfmin_db.forEach((v, k) => expectClose(noise.nfMinDb[k], v, 1e-9, `${path} NFmin at ${theirs.f[k]} Hz`));
  });

  it('as a figure of a part: worst NF over the band, on the noise frequencies', () => {
    const data = read(FILES[1]);
    const theirs = ref?.files.find((x) => x.file === FILES[1]) as { f: number[]; nf_db: number[] };
    const yaml = partYaml({
      cls: 'amplifier',
      units: ['U1'],
      bands: '  b: {from: 70 GHz, to: 75 GHz}',
      limits: '  - {figure: noise-figure, band: b, max: 20 dB}\n  - {figure: minimum-noise-figure, band: b, max: 3 dB}',
    });
    const r = resultsOf(yaml.replace('file: U1.s4p', 'file: thru.s2p'), { U1: data.network }, { U1: data.noise });
    expectClose(r.results[0].worst, Math.max(theirs.nf_db[0], theirs.nf_db[1]), 1e-9, 'worst NF over 70–75 GHz');
    expect(r.results[0].on).toEqual(['S21']);
    expectClose(r.results[1].worst, 2.7, 1e-12, 'worst NFmin');
  });
});
