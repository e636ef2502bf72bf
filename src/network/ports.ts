/**
 * Port subsets and reordering. `ports` lists 1-based port numbers of the
 * source network in the order the result should have them: [3, 1] makes a
 * 2-port whose port 1 is the old port 3 and whose port 2 is the old port 1.
 * The ports left out are taken as terminated in their own reference
 * impedance (which is what dropping rows and columns of S means).
 */
import { checkPort, makeNetwork, type Network } from './network.js';

export function selectPorts(net: Network, ports: readonly number[]): Network {
  if (ports.length === 0) throw new RangeError('select at least one port');
  const seen = new Set<number>();
  for (const p of ports) {
    checkPort(net, p);
    if (seen.has(p)) throw new RangeError(`port ${p} is listed twice`);
    seen.add(p);
  }
  const n = net.ports;
  const m = ports.length;
  const k = net.freqHz.length;
  const out = new Float64Array(k * m * m * 2);
  for (let q = 0; q < k; q++) {
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < m; j++) {
        const src = 2 * ((q * n + ports[i] - 1) * n + ports[j] - 1);
        const dst = 2 * ((q * m + i) * m + j);
        out[dst] = net.s[src];
        out[dst + 1] = net.s[src + 1];
      }
    }
  }
  const z0 = Float64Array.from(ports, (p) => net.z0[p - 1]);
  return makeNetwork(net.freqHz, z0, out, m);
}
