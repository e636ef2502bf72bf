/** The Touchstone record as written: units, parameter and format as the file gave them. */

export type Version = '1.1' | '2.0' | '2.1';
export type Parameter = 'S' | 'Y' | 'Z' | 'H' | 'G';
export type DataFormat = 'DB' | 'MA' | 'RI';
export type FrequencyUnit = 'Hz' | 'kHz' | 'MHz' | 'GHz';
export type MatrixFormat = 'full' | 'lower' | 'upper';
export type TwoPortOrder = '12_21' | '21_12';

export const FREQUENCY_EXPONENT: Record<FrequencyUnit, number> = { Hz: 0, kHz: 3, MHz: 6, GHz: 9 };

export interface OptionLine {
  readonly frequencyUnit: FrequencyUnit;
  readonly parameter: Parameter;
  readonly format: DataFormat;
  /** R values as given: none (default 50), one, or one per port (2.1). */
  readonly resistance: readonly number[];
  readonly line: number;
}

export interface NoiseRecord {
  readonly freqHz: Float64Array;
  readonly nfMinDb: Float64Array;
  readonly gammaOptMag: Float64Array;
  readonly gammaOptDeg: Float64Array;
  /** Rn as written: normalized to R in version 1, ohms in version 2. */
  readonly rn: Float64Array;
}

export interface TouchstoneRecord {
  readonly version: Version;
  readonly ports: number;
  readonly options: OptionLine;
  /** Per-port single-ended reference resistance in ohms ([Reference] over R over 50). */
  readonly referenceOhms: readonly number[];
  readonly matrixFormat: MatrixFormat;
  readonly twoPortOrder: TwoPortOrder | null;
  /** [Mixed-Mode Order] descriptors as written (e.g. "D2,3"), or null. */
  readonly mixedModeOrder: readonly string[] | null;
  readonly freqHz: Float64Array;
  /**
   * The values of each point as pairs in the file's format, placed at their
   * full-matrix positions (row = receiving port), with the mirrored half filled
   * in for Lower/Upper files: same layout as Network.s.
   */
  readonly values: Float64Array;
  /** With the parser's keepTokens: where each value's text is in the input (offset × 64 + length; 0 when not kept), same layout as values. */
  readonly tokens?: Float64Array;
  readonly noise: NoiseRecord | null;
  /** Comment lines before the data (without the "!"), for provenance. */
  readonly comments: readonly string[];
  /** Lines of a [Begin Information] block, as written. */
  readonly information: readonly string[];
}
