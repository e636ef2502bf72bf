/**
 * A seeded pseudo-random source for the demo generator (SplitMix32 mixing of a
 * counter: small, fast, and the same sequence on every machine), with the
 * normal deviates that component tolerances need.
 */
export interface Random {
  /** Uniform in [0, 1). */
  next(): number;
  /** Normal with the given mean and standard deviation (Box–Muller). */
  normal(mean?: number, sd?: number): number;
  /** A child stream for one named purpose, independent of how much the parent was used. */
  fork(label: string): Random;
}

function hash(text: string, seed: number): number {
  let h = seed >>> 0;
  for (let i = 0; i < text.length; i++) {
    h = Math.imul(h ^ text.charCodeAt(i), 0x9e3779b1) >>> 0;
    h ^= h >>> 15;
  }
  return h >>> 0;
}

export function seeded(seed: number): Random {
  let state = seed >>> 0;
  let spare: number | null = null;
  const next = (): number => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    z = (z ^ (z >>> 16)) >>> 0;
    return z / 4294967296;
  };
  return {
    next,
    normal(mean = 0, sd = 1) {
      if (spare !== null) {
        const v = spare;
        spare = null;
        return mean + sd * v;
      }
      let u = next();
      while (u === 0) u = next();
      const v = next();
      const r = Math.sqrt(-2 * Math.log(u));
      spare = r * Math.sin(2 * Math.PI * v);
      return mean + sd * r * Math.cos(2 * Math.PI * v);
    },
    fork(label: string) {
      return seeded(hash(label, seed));
    },
  };
}
