/**
 * What a network analyser adds to a device's true response: a complex
 * Gaussian noise floor on every entry, set in dB below full scale (|S| = 1).
 */
import { makeNetwork, type Network } from '../network/network.js';
import type { Random } from './random.js';

export function addMeasurementNoise(net: Network, floorDb: number, rnd: Random): Network {
  const sd = Math.pow(10, floorDb / 20) / Math.SQRT2;
  const s = Float64Array.from(net.s, (v) => v + rnd.normal(0, sd));
  return makeNetwork(net.freqHz, net.z0, s, net.ports);
}
