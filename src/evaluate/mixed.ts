/**
 * Items of mixed-mode parameters (Sdd21, …) are evaluated on the unit's
 * mixed-mode network (network/mixedmode.ts, with the part's port pairs),
 * where they are ordinary entries: mixed-mode port m's differential mode is
 * port m, its common mode port M + m. Single-ended items use the network as
 * measured.
 */
import type { Item } from '../figures/types.js';
import { toMixedMode } from '../network/mixedmode.js';
import type { Network } from '../network/network.js';

export function isMixed(item: Item): boolean {
  return item.params.some((p) => p.mode !== undefined);
}

const cache = new WeakMap<Network, Network>();

/** The network an item is evaluated on, and the item as entries of it. */
export function itemOnNetwork(net: Network, pairs: ReadonlyArray<readonly [number, number]> | null, item: Item): { network: Network; item: Item } {
  if (!isMixed(item) || !pairs) return { network: net, item };
  let mm = cache.get(net);
  if (!mm) {
    mm = toMixedMode(net, pairs);
    cache.set(net, mm);
  }
  const m = pairs.length;
  const params = item.params.map((p) => {
    const mode = p.mode ?? 'dd';
    return { to: (mode[0] === 'd' ? 0 : m) + p.to, from: (mode[1] === 'd' ? 0 : m) + p.from };
  });
  return { network: mm, item: { params, label: item.label } };
}
