/**
 * What a datasheet of each class shows first: its default plots and the
 * figures of its headline table. A part's `plots` replace the defaults;
 * its `extra-plots` add to them.
 */
import type { PartClass } from '../spec/part-schema.js';

export interface PlotDef {
  /** The trace-shaped figure whose per-point values are drawn. */
  readonly figure: string;
  /** Figures whose limits are drawn as forbidden regions (default: the figure itself). */
  readonly limitsFrom?: readonly string[];
  /** The parameters drawn; by default those of the matching limits, else these. */
  readonly on?: readonly string[];
  /** 'all': the whole measured range; 'limits': around the bands of the matching limits; or a band name. */
  readonly range: 'all' | 'limits' | { readonly band: string };
  readonly title?: string;
  /** Stability figures: the port pair. */
  readonly ports?: readonly [number, number];
}

const loss = ['insertion-loss', 'rejection'];

export const CLASS_PLOTS: Readonly<Record<PartClass, readonly PlotDef[]>> = {
  filter: [
    { figure: 'insertion-loss', limitsFrom: loss, on: ['S21'], range: 'all', title: 'Insertion loss and rejection' },
    { figure: 'insertion-loss', on: ['S21'], range: 'limits', title: 'Passband insertion loss' },
    { figure: 'return-loss', on: ['S11', 'S22'], range: 'limits' },
    { figure: 'group-delay', on: ['S21'], range: 'limits' },
  ],
  attenuator: [
    { figure: 'insertion-loss', on: ['S21'], range: 'all', title: 'Attenuation' },
    { figure: 'vswr', limitsFrom: ['vswr'], on: ['S11', 'S22'], range: 'all' },
  ],
  amplifier: [
    { figure: 'gain', on: ['S21'], range: 'all' },
    { figure: 'return-loss', on: ['S11', 'S22'], range: 'all' },
    { figure: 'isolation', on: ['S12'], range: 'all', title: 'Reverse isolation' },
    { figure: 'stability-k', range: 'all', ports: [1, 2] },
    { figure: 'stability-mu', range: 'all', ports: [1, 2] },
  ],
  divider: [
    { figure: 'insertion-loss', on: ['S21', 'S31'], range: 'all' },
    { figure: 'amplitude-balance', on: ['S21', 'S31'], range: 'all' },
    { figure: 'phase-balance', on: ['S21', 'S31'], range: 'all' },
    { figure: 'isolation', on: ['S32'], range: 'all' },
    { figure: 'vswr', on: ['S11', 'S22', 'S33'], range: 'all' },
  ],
  coupler: [
    { figure: 'coupling', on: ['S31'], range: 'all' },
    { figure: 'directivity', on: ['S31', 'S41'], range: 'all' },
    { figure: 'mainline-loss', on: ['S21'], range: 'all' },
    { figure: 'return-loss', on: ['S11', 'S22'], range: 'all' },
  ],
  hybrid: [
    { figure: 'insertion-loss', on: ['S21', 'S31'], range: 'all' },
    { figure: 'amplitude-balance', on: ['S21', 'S31'], range: 'all' },
    { figure: 'phase-balance', on: ['S21', 'S31'], range: 'all' },
    { figure: 'isolation', on: ['S41'], range: 'all' },
    { figure: 'return-loss', on: ['S11'], range: 'all' },
  ],
  circulator: [
    { figure: 'insertion-loss', on: ['S21'], range: 'all' },
    { figure: 'isolation', on: ['S12'], range: 'all' },
    { figure: 'vswr', on: ['S11', 'S22'], range: 'all' },
  ],
  isolator: [
    { figure: 'insertion-loss', on: ['S21'], range: 'all' },
    { figure: 'isolation', on: ['S12'], range: 'all' },
    { figure: 'vswr', on: ['S11', 'S22'], range: 'all' },
  ],
  cable: [
    { figure: 'insertion-loss', on: ['S21'], range: 'all' },
    { figure: 'vswr', on: ['S11', 'S22'], range: 'all' },
    { figure: 'group-delay', on: ['S21'], range: 'all', title: 'Electrical delay' },
  ],
  switch: [
    { figure: 'insertion-loss', on: ['S21'], range: 'all' },
    { figure: 'isolation', range: 'all' },
    { figure: 'return-loss', on: ['S11', 'S22'], range: 'all' },
  ],
  balun: [
    { figure: 'amplitude-balance', on: ['S21', 'S31'], range: 'all' },
    { figure: 'phase-balance', on: ['S21', 'S31'], range: 'all' },
    { figure: 'insertion-loss', on: ['S21', 'S31'], range: 'all' },
    { figure: 'return-loss', on: ['S11'], range: 'all' },
  ],
  generic: [],
};

/** Figures of the headline table, in order, by class. */
export const CLASS_HEADLINE: Readonly<Record<PartClass, readonly string[]>> = {
  filter: ['insertion-loss', 'return-loss', 'vswr', 'rejection', 'passband-ripple', 'group-delay-variation', 'group-delay'],
  attenuator: ['insertion-loss', 'vswr', 'return-loss', 'passband-ripple'],
  amplifier: ['gain', 'gain-flatness', 'return-loss', 'isolation', 'stability-k', 'stability-mu'],
  divider: ['insertion-loss', 'excess-loss', 'amplitude-balance', 'phase-balance', 'isolation', 'vswr'],
  coupler: ['coupling', 'coupling-flatness', 'directivity', 'mainline-loss', 'return-loss'],
  hybrid: ['insertion-loss', 'amplitude-balance', 'phase-balance', 'isolation', 'return-loss'],
  circulator: ['insertion-loss', 'isolation', 'vswr', 'return-loss'],
  isolator: ['insertion-loss', 'isolation', 'vswr', 'return-loss'],
  cable: ['insertion-loss', 'vswr', 'return-loss', 'group-delay'],
  switch: ['insertion-loss', 'isolation', 'return-loss', 'vswr'],
  balun: ['amplitude-balance', 'phase-balance', 'insertion-loss', 'return-loss'],
  generic: [],
};

/** Loss-like figures read downwards on plots (more loss lower), as the trade draws |S| in dB. */
export const DOWNWARD = new Set(['insertion-loss', 'mainline-loss', 'isolation', 'rejection', 'coupling', 'return-loss', 'excess-loss']);
