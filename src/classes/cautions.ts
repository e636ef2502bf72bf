/**
 * The cautions a datasheet prints: the class's usual ones (from the class
 * registry), then the part's own, then the closing line that defers to local
 * codes and the application's qualification.
 */
import { classOf, CLOSING_CAUTION } from '../classes/registry.js';

/** Class defaults first, then the part's own, without repeats. */
export function cautionsFor(partClass: string, own: readonly string[]): string[] {
  return [...new Set([...classOf(partClass).cautions, ...own, CLOSING_CAUTION])];
}
