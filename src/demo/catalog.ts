/**
 * The demo catalog's measured data: each part's model, its units (serial,
 * seed, conditions) and how its files are written. Everything here is
 * invented: the vendor "Veltrane Microwave" and its parts are fictional, and
 * the "measurements" come from circuit models plus a seeded analyser noise
 * floor — see models/.
 */
import type { Network } from '../network/network.js';
import { writeTouchstone, type WriteOptions } from '../touchstone/write.js';
import { addMeasurementNoise } from './measurement.js';
import { piPad } from './models/attenuator.js';
import { gainBlock } from './models/amplifier.js';
import { bandpass } from './models/bandpass.js';
import { isolator } from './models/isolator.js';
import { branchLine, cable, coupledLine, wilkinson } from './models/lines.js';
import { seeded, type Random } from './random.js';

export interface DemoUnit {
  readonly serial: string;
  readonly file: string;
  readonly seed: number;
  readonly temperatureC?: number;
  /** A fault built into this unit (the demo's failing unit). */
  readonly defect?: number;
  /** A qualification stage after the first: its number (1, 2, …) and the series resistor's drift it caused. */
  readonly stage?: { readonly index: number; readonly drift: number };
}

/** The same serials measured again after each stress of a qualification: files sn2001_tc.s2p, sn2001_shock.s2p, … */
function stages(units: readonly DemoUnit[], serials: readonly string[], after: ReadonlyArray<{ suffix: string; drift: number }>): DemoUnit[] {
  return after.flatMap((a, i) =>
    units
      .filter((u) => serials.includes(u.serial))
      .map((u) => ({ ...u, file: u.file.replace(/\.s2p$/, `_${a.suffix}.s2p`), stage: { index: i + 1, drift: a.drift } })),
  );
}

const PAD_UNITS = units('SN', 2001, 4, 10_000, 2, [{}, {}, { defect: 0.15 }, {}]);

export interface DemoPart {
  readonly slug: string;
  readonly ports: number;
  readonly units: readonly DemoUnit[];
  readonly write: WriteOptions;
  /** The unit as built (component spread from `rnd`), before the analyser sees it. */
  model(rnd: Random, unit: DemoUnit): Network;
  /** The analyser's noise floor, dB relative to full scale. */
  readonly noiseFloorDb: number;
}

export function grid(fromHz: number, toHz: number, points: number): Float64Array {
  return Float64Array.from({ length: points }, (_, k) => fromHz + ((toHz - fromHz) * k) / (points - 1));
}

function units(prefix: string, first: number, count: number, seed: number, ports: number, extra: Partial<DemoUnit>[] = []): DemoUnit[] {
  return Array.from({ length: count }, (_, i) => {
    const serial = `${prefix}${String(first + i).padStart(4, '0')}`;
    return { serial, file: `data/${serial.toLowerCase()}.s${ports}p`, seed: seed + i, ...extra[i] };
  });
}

/** Each serial measured at each temperature: files named sn3001_m40c.s2p, sn3001_25c.s2p, … */
function corners(prefix: string, first: number, count: number, seed: number, temps: readonly number[]): DemoUnit[] {
  const out: DemoUnit[] = [];
  for (let i = 0; i < count; i++) {
    const serial = `${prefix}${String(first + i).padStart(4, '0')}`;
    for (const t of temps) out.push({ serial, file: `data/${serial.toLowerCase()}_${t < 0 ? 'm' : ''}${Math.abs(t)}c.s2p`, seed: seed + i, temperatureC: t });
  }
  return out;
}

const loss = (a: number, b: number) => ({ a, b });

export const DEMO_PARTS: readonly DemoPart[] = [
  {
    slug: 'vt-bpf-2450',
    ports: 2,
    units: units('SN', 1001, 4, 24_500, 2),
    write: { format: 'DB', frequencyUnit: 'GHz', significantDigits: 8 },
    noiseFloorDb: -85,
    model: (rnd) => bandpass({ order: 5, rippleDb: 0.05, lowHz: 2.39e9, highHz: 2.51e9, q: 900, tolerance: 0.0015 }, grid(1.0e9, 4.0e9, 601), rnd),
  },
  {
    slug: 'vt-pad-10',
    ports: 2,
    // SN2003 was built with a damaged series resistor (+15 %): it fails the attenuation limit, and is left out
    // of the qualification, in which the other three are measured after thermal cycling and after shock
    units: [
      ...PAD_UNITS,
      ...stages(
        PAD_UNITS,
        ['SN2001', 'SN2002', 'SN2004'],
        [
          { suffix: 'tc', drift: 0.005 },
          { suffix: 'shock', drift: 0.012 },
        ],
      ),
    ],
    write: { format: 'MA', frequencyUnit: 'MHz', significantDigits: 9 },
    noiseFloorDb: -90,
    model: (rnd, u) =>
      piPad(
        { attenuationDb: 10, tolerance: 0.004, shuntL: 0.12e-9, seriesC: 0.015e-12, padC: 0.03e-12, seriesError: u.defect ?? u.stage?.drift },
        grid(0.01e9, 18e9, 361),
        rnd,
      ),
  },
  {
    slug: 'vt-amp-0560',
    ports: 2,
    units: corners('SN', 3001, 3, 5_600, [-40, 25, 85]),
    write: { format: 'RI', frequencyUnit: 'GHz', significantDigits: 9 },
    noiseFloorDb: -80,
    model: (rnd, u) =>
      gainBlock(
        { gm: 0.12, cgs: 0.35e-12, cgd: 0.03e-12, cds: 0.1e-12, rds: 400, tau: 4e-12, rf: 300, rg: 2, ld: 0.25e-9, tolerance: 0.01, gmTempco: -0.0025 },
        grid(0.05e9, 6e9, 239),
        rnd,
        u.temperatureC ?? 25,
      ),
  },
  {
    slug: 'vt-pd2-2000',
    ports: 3,
    units: units('SN', 4001, 4, 2_000, 3),
    write: { format: 'DB', frequencyUnit: 'GHz', significantDigits: 8 },
    noiseFloorDb: -85,
    model: (rnd) => wilkinson(2e9, 3.4, loss(0.25, 0.03), { impedance: 0.01, length: 0.004, resistor: 0.01 }, grid(1e9, 3e9, 401), rnd),
  },
  {
    slug: 'vt-dc20-2000',
    ports: 4,
    units: units('SN', 5001, 3, 20_200, 4),
    write: { format: 'MA', frequencyUnit: 'GHz', significantDigits: 8 },
    noiseFloorDb: -90,
    model: (rnd) =>
      coupledLine(2e9, 20, { erEven: 6.5, erOdd: 6.35, zScale: 1.07 }, loss(0.3, 0.03), { impedance: 0.01, length: 0.003 }, grid(1e9, 3e9, 401), rnd),
  },
  {
    slug: 'vt-hyb90-2450',
    ports: 4,
    units: units('SN', 6001, 4, 9_024, 4),
    write: { format: 'RI', frequencyUnit: 'GHz', significantDigits: 9 },
    noiseFloorDb: -85,
    model: (rnd) => branchLine(2.45e9, 3.4, loss(0.25, 0.03), { impedance: 0.008, length: 0.003 }, grid(1.8e9, 3.1e9, 261), rnd),
  },
  {
    slug: 'vt-iso-3000',
    ports: 2,
    units: units('SN', 7001, 5, 3_000, 2),
    write: { format: 'DB', frequencyUnit: 'GHz', significantDigits: 8 },
    noiseFloorDb: -85,
    model: (rnd) => isolator({ f0: 3e9, q: 0.7, loss: 0.03, loadReflection: 0.05, spread: 0.004 }, grid(2e9, 4e9, 401), rnd),
  },
  {
    slug: 'vt-cbl-150',
    ports: 2,
    units: units('SN', 8001, 3, 1_500, 2),
    write: { format: 'DB', frequencyUnit: 'GHz', significantDigits: 8 },
    noiseFloorDb: -90,
    model: (rnd) => cable(1.5, 50, 1.45, loss(0.05, 0.008), { l: 0.12e-9, c: 0.06e-12 }, grid(0.01e9, 18e9, 3597), rnd),
  },
];

/** The files of one part: path (relative to the part folder) → text. */
export function partFiles(part: DemoPart): Map<string, string> {
  return new Map(
    part.units.map((u) => {
      const rnd = seeded(u.seed);
      // the same serial at another temperature is the same hardware: the build stream depends on the seed only
      const built = part.model(rnd.fork('build'), u);
      const measured = addMeasurementNoise(
        built,
        part.noiseFloorDb,
        seeded(u.seed * 1000 + (u.temperatureC ?? 0) + 7 + 17 * (u.stage?.index ?? 0)).fork('analyser'),
      );
      return [u.file, writeUnit(measured, part, u)];
    }),
  );
}

function writeUnit(net: Network, part: DemoPart, unit: DemoUnit): string {
  const where = (unit.temperatureC === undefined ? '' : ` at ${unit.temperatureC} °C`) + (unit.stage ? `, after qualification stage ${unit.stage.index}` : '');
  return writeTouchstone(net, {
    ...part.write,
    comments: [
      `Veltrane Microwave demo data (fictional), ${part.slug.toUpperCase()} unit ${unit.serial}${where}`,
      'Generated by scatterbook src/demo from a circuit model; not a measurement',
    ],
  });
}
