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

type Pairs = ReadonlyArray<readonly [number, number]>;

/** The single-ended pairs of a Touchstone 2 [Mixed-Mode Order]: its differential descriptors (D2,3 → [2, 3]) in order. */
export function pairsOfOrder(order: readonly string[]): Array<[number, number]> {
  return order.flatMap((d) => {
    const m = /^D(\d+),(\d+)$/.exec(d);
    return m ? [[Number(m[1]), Number(m[2])] as [number, number]] : [];
  });
}

/**
 * Where a mixed-mode parameter's entry sits in a file written in mixed-mode
 * order: mixed-mode port m is the m-th pair (the part's, or the file's own D
 * descriptors in order), its differential row the descriptor "D" + pair, its
 * common row "C" + pair. Null where the file has no such descriptor.
 */
export function orderIndex(order: readonly string[], pairs: Pairs, mode: 'd' | 'c', port: number): number | null {
  const pair = pairs[port - 1];
  if (!pair) return null;
  const i = order.indexOf(`${mode.toUpperCase()}${pair[0]},${pair[1]}`);
  return i < 0 ? null : i + 1;
}

/**
 * The network an item is evaluated on, and the item as entries of it. A
 * unit whose file is in mixed-mode order (`order`) already holds the modes:
 * its entries are looked up by descriptor. Otherwise mixed-mode items are
 * evaluated on the mixed-mode network made with the part's pairs.
 */
export function itemOnNetwork(net: Network, pairs: Pairs | null, item: Item, order?: readonly string[] | null): { network: Network; item: Item } {
  if (order) {
    const own = pairs ?? pairsOfOrder(order);
    const params = item.params.map((p) => {
      const mode = p.mode ?? 'dd';
      return { to: orderIndex(order, own, mode[0] as 'd' | 'c', p.to) ?? 0, from: orderIndex(order, own, mode[1] as 'd' | 'c', p.from) ?? 0 };
    });
    return { network: net, item: { params, label: item.label } };
  }
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
