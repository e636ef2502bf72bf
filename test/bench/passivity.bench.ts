/**
 * Benchmark (npm run bench:passivity): the passivity check — the largest
 * singular value of S at every frequency — against numpy's batched SVD
 * (numpy.linalg.svd(compute_uv=False) over a (K, N, N) array, the way a
 * numpy user computes it), on the same matrices, at 4, 8 and 16 ports.
 * Prints times and their ratio; asserts nothing.
 */
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { makeNetwork } from '../../src/network/network.js';
import { singularValues } from '../../src/network/linalg.js';
import { passivity } from '../../src/network/quality.js';

const K = 2000;
for (const n of [4, 8, 16]) {
  let seed = 11;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
  const s = Float64Array.from({ length: 2 * n * n * K }, () => rnd() * 0.3);
  const net = makeNetwork(
    Float64Array.from({ length: K }, (_, k) => 1e9 + k * 1e6),
    50,
    s,
    n,
  );
  const time = (f: () => void) => {
    let best = Infinity;
    for (let r = 0; r < 5; r++) {
      const t = performance.now();
      f();
      best = Math.min(best, performance.now() - t);
    }
    return best;
  };
  const ours = time(() => passivity(net));
  const jacobi = time(() => {
    const work = new Float64Array(2 * n * n);
    for (let q = 0; q < K; q++) singularValues(s, 2 * n * n * q, n, work);
  });
  const file = join(tmpdir(), `scatterbook-passivity-${n}.f64`);
  writeFileSync(file, s);
  const numpy = Number(
    execFileSync('/usr/bin/python3', [
      '-c',
      `import time, numpy as np
a = np.fromfile(${JSON.stringify(file)}, dtype=np.float64)
m = (a[0::2] + 1j * a[1::2]).reshape(${K}, ${n}, ${n})
best = 1e9
for _ in range(5):
    t = time.perf_counter(); np.linalg.svd(m, compute_uv=False).max(axis=1); best = min(best, time.perf_counter() - t)
print(best * 1000)`,
    ]).toString(),
  );
  process.stdout.write(
    `${n} ports × ${K} frequencies: passivity ${ours.toFixed(1)} ms, the Jacobi route ${jacobi.toFixed(1)} ms, numpy svd ${numpy.toFixed(1)} ms — ${(ours / numpy).toFixed(2)}× numpy\n`,
  );
}
