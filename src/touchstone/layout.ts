/**
 * Where each value pair of a point goes in full-matrix storage.
 *
 * `place[k]` is the offset (in doubles, within one point's 2·N² values) of the
 * k-th pair as the file writes it; `mirror[k]` is the offset of the mirrored
 * entry for Lower/Upper files, or −1.
 *
 * Orders (Touchstone 1.1 and 2.0):
 *   2-port, version 1, or [Two-Port Data Order] 21_12: N11 N21 N12 N22
 *   2-port, 12_21: N11 N12 N21 N22
 *   otherwise row by row (row = receiving port): N11 N12 … N1N N21 …
 *   Lower: row i holds Ni1 … Nii;  Upper: row i holds Nii … NiN.
 */
import type { MatrixFormat, TwoPortOrder } from './types.js';

export interface Layout {
  readonly place: Int32Array;
  readonly mirror: Int32Array;
}

/** The (row, column) pairs in file order, 0-based. */
export function entryOrder(ports: number, format: MatrixFormat, twoPortOrder: TwoPortOrder): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  if (ports === 2 && format === 'full' && twoPortOrder === '21_12')
    return [
      [0, 0],
      [1, 0],
      [0, 1],
      [1, 1],
    ];
  for (let i = 0; i < ports; i++) {
    const from = format === 'upper' ? i : 0;
    const to = format === 'lower' ? i : ports - 1;
    for (let j = from; j <= to; j++) out.push([i, j]);
  }
  return out;
}

export function layoutFor(ports: number, format: MatrixFormat, twoPortOrder: TwoPortOrder): Layout {
  const order = entryOrder(ports, format, twoPortOrder);
  const place = new Int32Array(order.length);
  const mirror = new Int32Array(order.length).fill(-1);
  order.forEach(([i, j], k) => {
    place[k] = 2 * (i * ports + j);
    if (format !== 'full' && i !== j) mirror[k] = 2 * (j * ports + i);
  });
  return { place, mirror };
}
