/**
 * What each component class means, in one record per class: its name on the
 * index, whether its data should be passive and reciprocal, the defaults its
 * figures use (the ways of a split, the intended phase split), its default
 * plots and headline figures, and its usual cautions. Every consumer reads
 * this registry, so a class is added in one place; a test walks it and checks
 * that every record is complete. Pure data: it imports nothing.
 *
 * Cautions follow the common practice of component datasheets (ESD classes
 * per ANSI/ESDA/JEDEC JS-001 and JS-002; RF exposure per IEEE C95.1-2019 and
 * ICNIRP 2020) and defer to local codes and the user's qualification.
 */

export interface PlotDef {
  /** The trace-shaped figure whose per-point values are drawn, or 'smith' for a Smith chart of reflection parameters. */
  readonly figure: string;
  /** Figures whose limits are drawn as forbidden regions (default: the figure itself). */
  readonly limitsFrom?: readonly string[];
  /** The parameters drawn; by default those of the matching limits, else these. */
  readonly on?: readonly string[];
  /** 'all': the whole measured range; 'limits': around the bands of the matching limits; or a band name. */
  readonly range: 'all' | 'limits' | { readonly band: string };
  readonly title?: string;
  /** The y axis's title, when the figure's name is not what the trade calls the quantity here (Attenuation, Electrical delay). */
  readonly axis?: string;
  /** Stability figures: the port pair. */
  readonly ports?: readonly [number, number];
}

export interface ClassDef {
  readonly id: string;
  /** The heading of the class's parts on the index. */
  readonly title: string;
  /** Its data should be passive (largest singular value ≤ 1): every class but amplifiers. */
  readonly passive: boolean;
  /** Its data should be reciprocal (Sij = Sji): not ferrite parts, not amplifiers. */
  readonly reciprocal: boolean;
  /** The N of excess loss, −20·log10|X| − 10·log10 N, for a part of `ports` ports (when the part gives no `ways`). */
  readonly ways: (ports: number) => number;
  /** The nominal of phase balance, degrees (when the part gives no `phase-split`). */
  readonly phaseSplitDeg: number;
  readonly plots: readonly PlotDef[];
  /** Figures of the headline table, in order. */
  readonly headline: readonly string[];
  /** The figures of the class's main transmission limits: the first limit on one of them gives the default operating band. */
  readonly transmission: readonly string[];
  readonly cautions: readonly string[];
}

const loss = ['insertion-loss', 'rejection'];

const POWER =
  'Do not exceed the maximum ratings: RF input power above them, or DC applied to RF ports that are not rated for it, can damage the part permanently.';
const ESD =
  "Electrostatic-discharge sensitive: handle with grounded wrist straps on a grounded work surface; the part's HBM and CDM class (ANSI/ESDA/JEDEC JS-001, JS-002) is stated by the vendor where it is known.";
const BIAS = 'Apply bias in the stated sequence and only with the RF ports terminated; remove RF drive before removing bias.';
const HOT = 'At high power the body gets hot: mount it on a heat sink of adequate rating and let it cool before handling.';
const EXPOSURE =
  'RF exposure: terminate every output in a rated load before applying power, and never look into or stand near an open energised connector or waveguide. Exposure limits are set by IEEE C95.1-2019, ICNIRP (2020) and local regulation.';
const FERRITE = 'Ferrite parts contain permanent magnets: keep them away from magnetic media, steel tools and other ferrite parts, whose fields detune them.';
const CABLE =
  'Do not bend the cable tighter than its minimum bend radius or twist the connectors against each other; tighten connectors with a calibrated torque wrench.';

const RECORDS = [
  {
    id: 'filter',
    title: 'Filters',
    passive: true,
    reciprocal: true,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'insertion-loss', limitsFrom: loss, on: ['S21'], range: 'all', title: 'Insertion loss and rejection' },
      { figure: 'insertion-loss', on: ['S21'], range: 'limits', title: 'Passband insertion loss' },
      { figure: 'return-loss', on: ['S11', 'S22'], range: 'limits' },
      { figure: 'group-delay', on: ['S21'], range: 'limits' },
    ],
    headline: ['insertion-loss', 'return-loss', 'vswr', 'rejection', 'passband-ripple', 'group-delay-variation', 'group-delay'],
    transmission: ['insertion-loss'],
    cautions: [POWER],
  },
  {
    id: 'attenuator',
    title: 'Attenuators',
    passive: true,
    reciprocal: true,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'insertion-loss', on: ['S21'], range: 'all', title: 'Attenuation', axis: 'Attenuation' },
      { figure: 'vswr', limitsFrom: ['vswr'], on: ['S11', 'S22'], range: 'all' },
    ],
    headline: ['insertion-loss', 'vswr', 'return-loss', 'passband-ripple'],
    transmission: ['insertion-loss'],
    cautions: [POWER, HOT],
  },
  {
    id: 'amplifier',
    title: 'Amplifiers',
    passive: false,
    reciprocal: false,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'gain', on: ['S21'], range: 'all' },
      { figure: 'return-loss', on: ['S11', 'S22'], range: 'all' },
      { figure: 'isolation', on: ['S12'], range: 'all', title: 'Reverse isolation' },
      { figure: 'stability-k', range: 'all', ports: [1, 2] },
      { figure: 'stability-mu', range: 'all', ports: [1, 2] },
      { figure: 'noise-figure', on: ['S21'], range: 'all' },
      { figure: 'smith', on: ['S11', 'S22'], range: 'all', title: 'Input and output match (Smith chart)' },
    ],
    headline: ['gain', 'gain-flatness', 'noise-figure', 'minimum-noise-figure', 'return-loss', 'isolation', 'stability-k', 'stability-mu'],
    transmission: ['gain'],
    cautions: [POWER, ESD, BIAS, HOT],
  },
  {
    id: 'divider',
    title: 'Power dividers',
    passive: true,
    reciprocal: true,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'insertion-loss', on: ['S21', 'S31'], range: 'all' },
      { figure: 'amplitude-balance', on: ['S21', 'S31'], range: 'all' },
      { figure: 'phase-balance', on: ['S21', 'S31'], range: 'all' },
      { figure: 'isolation', on: ['S32'], range: 'all' },
      { figure: 'vswr', on: ['S11', 'S22', 'S33'], range: 'all' },
    ],
    headline: ['insertion-loss', 'excess-loss', 'amplitude-balance', 'phase-balance', 'isolation', 'vswr'],
    transmission: ['insertion-loss', 'excess-loss'],
    cautions: [POWER],
  },
  {
    id: 'coupler',
    title: 'Directional couplers',
    passive: true,
    reciprocal: true,
    ways: () => 2,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'coupling', on: ['S31'], range: 'all' },
      { figure: 'directivity', on: ['S31', 'S41'], range: 'all' },
      { figure: 'mainline-loss', on: ['S21'], range: 'all' },
      { figure: 'return-loss', on: ['S11', 'S22'], range: 'all' },
    ],
    headline: ['coupling', 'coupling-flatness', 'directivity', 'mainline-loss', 'return-loss'],
    transmission: ['coupling', 'mainline-loss'],
    cautions: [POWER, EXPOSURE],
  },
  {
    id: 'hybrid',
    title: 'Hybrids',
    passive: true,
    reciprocal: true,
    ways: () => 2,
    phaseSplitDeg: 90,
    plots: [
      { figure: 'insertion-loss', on: ['S21', 'S31'], range: 'all' },
      { figure: 'amplitude-balance', on: ['S21', 'S31'], range: 'all' },
      { figure: 'phase-balance', on: ['S21', 'S31'], range: 'all' },
      { figure: 'isolation', on: ['S41'], range: 'all' },
      { figure: 'return-loss', on: ['S11'], range: 'all' },
    ],
    headline: ['insertion-loss', 'amplitude-balance', 'phase-balance', 'isolation', 'return-loss'],
    transmission: ['insertion-loss', 'amplitude-balance'],
    cautions: [POWER],
  },
  {
    id: 'circulator',
    title: 'Circulators',
    passive: true,
    reciprocal: false,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'insertion-loss', on: ['S21'], range: 'all' },
      { figure: 'isolation', on: ['S12'], range: 'all' },
      { figure: 'vswr', on: ['S11', 'S22'], range: 'all' },
    ],
    headline: ['insertion-loss', 'isolation', 'vswr', 'return-loss'],
    transmission: ['insertion-loss'],
    cautions: [POWER, FERRITE, EXPOSURE],
  },
  {
    id: 'isolator',
    title: 'Isolators',
    passive: true,
    reciprocal: false,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'insertion-loss', on: ['S21'], range: 'all' },
      { figure: 'isolation', on: ['S12'], range: 'all' },
      { figure: 'vswr', on: ['S11', 'S22'], range: 'all' },
    ],
    headline: ['insertion-loss', 'isolation', 'vswr', 'return-loss'],
    transmission: ['insertion-loss'],
    cautions: [POWER, FERRITE],
  },
  {
    id: 'cable',
    title: 'Cable assemblies',
    passive: true,
    reciprocal: true,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'insertion-loss', on: ['S21'], range: 'all' },
      { figure: 'vswr', on: ['S11', 'S22'], range: 'all' },
      { figure: 'group-delay', on: ['S21'], range: 'all', title: 'Electrical delay', axis: 'Electrical delay' },
    ],
    headline: ['insertion-loss', 'vswr', 'return-loss', 'group-delay'],
    transmission: ['insertion-loss'],
    cautions: [CABLE],
  },
  {
    id: 'switch',
    title: 'Switches',
    passive: true,
    reciprocal: true,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [
      { figure: 'insertion-loss', on: ['S21'], range: 'all' },
      { figure: 'isolation', range: 'all' },
      { figure: 'return-loss', on: ['S11', 'S22'], range: 'all' },
    ],
    headline: ['insertion-loss', 'isolation', 'return-loss', 'vswr'],
    transmission: ['insertion-loss'],
    cautions: [POWER, ESD],
  },
  {
    id: 'balun',
    title: 'Baluns',
    passive: true,
    reciprocal: true,
    ways: () => 2,
    phaseSplitDeg: 180,
    plots: [
      { figure: 'amplitude-balance', on: ['S21', 'S31'], range: 'all' },
      { figure: 'phase-balance', on: ['S21', 'S31'], range: 'all' },
      { figure: 'insertion-loss', on: ['S21', 'S31'], range: 'all' },
      { figure: 'return-loss', on: ['S11'], range: 'all' },
    ],
    headline: ['amplitude-balance', 'phase-balance', 'insertion-loss', 'return-loss'],
    transmission: ['amplitude-balance', 'insertion-loss'],
    cautions: [POWER],
  },
  {
    id: 'generic',
    title: 'Other components',
    passive: true,
    reciprocal: true,
    ways: (ports) => ports - 1,
    phaseSplitDeg: 0,
    plots: [],
    headline: [],
    transmission: [],
    cautions: [POWER],
  },
] as const satisfies readonly ClassDef[];

export type PartClass = (typeof RECORDS)[number]['id'];

/** The class names, in the registry's order (also the index's default order). */
export const CLASSES: readonly PartClass[] = RECORDS.map((r) => r.id);

const BY_ID: ReadonlyMap<string, ClassDef> = new Map(RECORDS.map((r) => [r.id, r as ClassDef]));

/** The record of a class (an unknown name falls back to generic: the part file's schema refuses unknown classes first). */
export function classOf(id: string): ClassDef {
  return BY_ID.get(id) ?? (BY_ID.get('generic') as ClassDef);
}

/** Loss-like figures read downwards on plots (more loss lower), as the trade draws |S| in dB. */
export const DOWNWARD = new Set(['insertion-loss', 'mainline-loss', 'isolation', 'rejection', 'coupling', 'return-loss', 'excess-loss']);

export const CLOSING_CAUTION =
  'Local safety codes, RF-exposure regulations and licensed practice govern installation and operation; where they are stricter than these cautions, they apply.';
