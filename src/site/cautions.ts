/**
 * The usual cautions of each class, in plain words, printed before a part's
 * own. They defer to local codes and the user's qualification; sources: the
 * common practice of component datasheets (ESD classes per ANSI/ESDA/JEDEC
 * JS-001 and JS-002; RF exposure per IEEE C95.1-2019 and ICNIRP 2020).
 */
import type { PartClass } from '../spec/part-schema.js';

const POWER = 'Do not exceed the maximum ratings: RF input power above them, or DC applied to RF ports that are not rated for it, can damage the part permanently.';
const ESD =
  'Electrostatic-discharge sensitive: handle with grounded wrist straps on a grounded work surface; the part\'s HBM and CDM class (ANSI/ESDA/JEDEC JS-001, JS-002) is stated by the vendor where it is known.';
const BIAS = 'Apply bias in the stated sequence and only with the RF ports terminated; remove RF drive before removing bias.';
const HOT = 'At high power the body gets hot: mount it on a heat sink of adequate rating and let it cool before handling.';
const EXPOSURE =
  'RF exposure: terminate every output in a rated load before applying power, and never look into or stand near an open energised connector or waveguide. Exposure limits are set by IEEE C95.1-2019, ICNIRP (2020) and local regulation.';
const FERRITE = 'Ferrite parts contain permanent magnets: keep them away from magnetic media, steel tools and other ferrite parts, whose fields detune them.';
const CABLE = 'Do not bend the cable tighter than its minimum bend radius or twist the connectors against each other; tighten connectors with a calibrated torque wrench.';

export const CLASS_CAUTIONS: Readonly<Record<PartClass, readonly string[]>> = {
  filter: [POWER],
  attenuator: [POWER, HOT],
  amplifier: [POWER, ESD, BIAS, HOT],
  divider: [POWER],
  coupler: [POWER, EXPOSURE],
  hybrid: [POWER],
  circulator: [POWER, FERRITE, EXPOSURE],
  isolator: [POWER, FERRITE],
  cable: [CABLE],
  switch: [POWER, ESD],
  balun: [POWER],
  generic: [POWER],
};

export const CLOSING_CAUTION =
  'The data are measurements of the units listed and are typical of the part; local codes and regulations and the application\'s own qualification govern its use.';

/** Class defaults first, then the part's own, without repeats. */
export function cautionsFor(partClass: PartClass, own: readonly string[]): string[] {
  return [...new Set([...CLASS_CAUTIONS[partClass], ...own, CLOSING_CAUTION])];
}
