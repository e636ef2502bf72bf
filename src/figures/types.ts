/**
 * What a figure is: its unit, which parameters it takes, which way is worse,
 * and how it is computed from one measured network.
 */
import type { Network } from '../network/network.js';
import type { SParameter } from '../part-file/parameter.js';
import type { NoiseParameters } from '../touchstone/normalize.js';

/** Units of figure values: dB, degrees, seconds, hertz, or none. */
export type FigureUnit = 'dB' | 'deg' | 's' | 'Hz' | '';

/**
 * What `on` holds: `each` — one or more parameters, each evaluated on its own;
 * `pair` — exactly two parameters combined into one value (balances, directivity);
 * `port-pair` — no `on`, a pair of ports (stability); `expression` — the
 * parameters named in a custom figure's expression.
 */
export type Operands = 'each' | 'pair' | 'port-pair' | 'expression';

/** Which way a value is worse when there is no limit to measure the margin. */
export type Worse = 'higher' | 'lower' | 'nominal';

/**
 * `trace`: a value at every point, evaluated over the band;
 * `span`: the peak-to-peak of a trace over the band, one value per unit;
 * `scalar`: one value per unit computed from the whole response (bandwidth).
 */
export type Shape = 'trace' | 'span' | 'scalar';

/** One evaluated operand: a parameter, a pair, the four of a port pair, or an expression's. */
export interface Item {
  readonly params: readonly SParameter[];
  /** How results name it: "S21", "S21/S31", "S11/S21/S12/S22". */
  readonly label: string;
}

export interface PartContext {
  readonly partClass: string;
  /** Dividers: N outputs. */
  readonly ways: number | null;
  /** Hybrids and baluns: the intended phase split, degrees. */
  readonly phaseSplitDeg: number | null;
}

export interface FigureContext {
  readonly network: Network;
  readonly part: PartContext;
  /** Group delay: ± points of the difference. */
  readonly aperture: number;
  /** Bandwidth: dB below the best insertion loss. */
  readonly levelDb: number;
  /** The nominal of the limit (or the figure's default), where it has one. */
  readonly nominal: number | null;
  readonly band: { readonly fromHz: number; readonly toHz: number };
  /** The unit's noise parameters, for the noise figures (null when its file has none). */
  readonly noise?: NoiseParameters | null;
}

export interface FigureDef {
  readonly id: string;
  readonly title: string;
  readonly unit: FigureUnit;
  readonly operands: Operands;
  readonly shape: Shape;
  readonly worse: Worse;
  /** Where perPoint's values sit: the network's frequencies (default), or the noise parameters' (noise figures). */
  readonly grid?: 'network' | 'noise';
  /** The parameters a limit covers when it gives no `on` (the noise figures: S21, the two-port's path). */
  readonly defaultOn?: readonly string[];
  /** One-line definition, shown in documentation and on pages. */
  readonly definition: string;
  /** The nominal a tolerance is taken around when the limit gives none. */
  defaultNominal?(ctx: { part: PartContext; band: { fromHz: number; toHz: number } }): number | undefined;
  /** Where perPoint gives NaN, the reason in words (for the error that reports it). */
  readonly undefinedWhere?: string;
  /** The reason at one frequency where perPoint gave NaN, when it depends on the data there (replaces undefinedWhere in the error). */
  whyUndefined?(ctx: FigureContext, item: Item, hz: number): string;
  /** trace and span: the value at every measured point (NaN where it has none). */
  perPoint?(ctx: FigureContext, item: Item): Float64Array;
  /** scalar: the value for one unit. Throws FigureUndefined where it cannot be computed. */
  scalar?(ctx: FigureContext, item: Item): number;
  /** Options the figure takes beyond on/band/limit. */
  readonly accepts?: readonly ('aperture' | 'level')[];
}

/** A figure has no value for this data (e.g. K where S12·S21 = 0); the message says why. */
export class FigureUndefined extends Error {
  constructor(
    message: string,
    readonly atHz: number | null = null,
  ) {
    super(message);
  }
}
