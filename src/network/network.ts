/**
 * The N-port network: frequencies in Hz, a real reference impedance per port
 * and the scattering matrix at every frequency, all in typed arrays.
 *
 * Layout of `s`: frequency-major, then row (receiving port), then column
 * (driving port), then re/im. S(i+1)(j+1) at frequency k is
 * `s[2 * ((k * n + i) * n + j)]` (re) and the next slot (im).
 *
 * A Network is treated as immutable: every operation returns a new one.
 */
export interface Network {
  readonly ports: number;
  readonly freqHz: Float64Array;
  /** Reference impedance per port, ohms (real, > 0). */
  readonly z0: Float64Array;
  readonly s: Float64Array;
}

/** One complex trace: the real and imaginary parts at every frequency. */
export interface ComplexTrace {
  readonly re: Float64Array;
  readonly im: Float64Array;
}

export class NetworkShapeError extends Error {}

/** Builds a network after checking that its arrays agree in shape. */
export function makeNetwork(freqHz: Float64Array, z0: Float64Array | number, s: Float64Array, ports?: number): Network {
  const n = ports ?? (typeof z0 === 'number' ? NaN : z0.length);
  if (!Number.isInteger(n) || n < 1) throw new NetworkShapeError(`port count must be a positive integer, got ${n}`);
  const z = typeof z0 === 'number' ? new Float64Array(n).fill(z0) : z0;
  if (z.length !== n) throw new NetworkShapeError(`expected ${n} reference impedances, got ${z.length}`);
  for (const r of z) {
    if (!(r > 0) || !Number.isFinite(r)) throw new NetworkShapeError(`reference impedances must be positive and finite, got ${r}`);
  }
  if (s.length !== freqHz.length * n * n * 2) {
    throw new NetworkShapeError(`S data holds ${s.length} values; ${freqHz.length} frequencies × ${n}² ports need ${freqHz.length * n * n * 2}`);
  }
  return Object.freeze({ ports: n, freqHz, z0: z, s });
}

/**
 * The trace of one entry, S(to)(from) in the trade's notation: `to` is the
 * receiving port and `from` the driving port, both 1-based. S21 is entry(net, 2, 1).
 */
export function entry(net: Network, to: number, from: number): ComplexTrace {
  checkPort(net, to);
  checkPort(net, from);
  const n = net.ports;
  const k = net.freqHz.length;
  const re = new Float64Array(k);
  const im = new Float64Array(k);
  const stride = 2 * n * n;
  let p = 2 * ((to - 1) * n + (from - 1));
  const s = net.s;
  for (let q = 0; q < k; q++, p += stride) {
    re[q] = s[p];
    im[q] = s[p + 1];
  }
  return { re, im };
}

export function checkPort(net: Network, port: number): void {
  if (!Number.isInteger(port) || port < 1 || port > net.ports) {
    throw new RangeError(`port ${port} is not a port of this ${net.ports}-port network (1…${net.ports})`);
  }
}
