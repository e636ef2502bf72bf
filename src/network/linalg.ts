/**
 * Small dense complex linear algebra on interleaved Float64Array storage.
 *
 * A complex n×n matrix is stored row-major as re/im pairs: element (i, j)
 * lives at `off + 2 * (i * n + j)` (re) and the next slot (im). Every routine
 * takes an offset so that one frequency's matrix can be read straight out of a
 * network's data array without copying.
 */

/** dst = a · b (dst must not alias a or b). */
export function cmatMul(a: Float64Array, aOff: number, b: Float64Array, bOff: number, n: number, dst: Float64Array, dstOff: number): void {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let re = 0;
      let im = 0;
      for (let k = 0; k < n; k++) {
        const ai = aOff + 2 * (i * n + k);
        const bi = bOff + 2 * (k * n + j);
        const ar = a[ai],
          aim = a[ai + 1],
          br = b[bi],
          bim = b[bi + 1];
        re += ar * br - aim * bim;
        im += ar * bim + aim * br;
      }
      const d = dstOff + 2 * (i * n + j);
      dst[d] = re;
      dst[d + 1] = im;
    }
  }
}

/**
 * Inverts an n×n complex matrix by Gauss–Jordan elimination with partial
 * pivoting. `work` must hold at least 2·n·n values; it is overwritten.
 * Returns false (and leaves dst undefined) when the matrix is singular to
 * working precision.
 */
export function cmatInv(
  src: Float64Array,
  srcOff: number,
  n: number,
  dst: Float64Array,
  dstOff: number,
  work: Float64Array = new Float64Array(2 * n * n),
): boolean {
  const m = work;
  m.set(src.subarray(srcOff, srcOff + 2 * n * n), 0);
  // dst starts as the identity
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const d = dstOff + 2 * (i * n + j);
      dst[d] = i === j ? 1 : 0;
      dst[d + 1] = 0;
    }
  }
  let scale = 0;
  for (let i = 0; i < 2 * n * n; i++) scale = Math.max(scale, Math.abs(m[i]));
  const tiny = (scale || 1) * 1e-14;
  for (let col = 0; col < n; col++) {
    let piv = col;
    let best = -1;
    for (let r = col; r < n; r++) {
      const p = 2 * (r * n + col);
      const mag = Math.hypot(m[p], m[p + 1]);
      if (mag > best) {
        best = mag;
        piv = r;
      }
    }
    if (!(best > tiny)) return false;
    if (piv !== col) {
      for (let j = 0; j < n; j++) {
        swap(m, 2 * (col * n + j), 2 * (piv * n + j));
        swap(dst, dstOff + 2 * (col * n + j), dstOff + 2 * (piv * n + j));
      }
    }
    const pp = 2 * (col * n + col);
    const pr = m[pp],
      pi = m[pp + 1];
    const den = pr * pr + pi * pi;
    const ir = pr / den,
      ii = -pi / den;
    for (let j = 0; j < n; j++) {
      const a = 2 * (col * n + j);
      mulInPlace(m, a, ir, ii);
      mulInPlace(dst, dstOff + a, ir, ii);
    }
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const f = 2 * (r * n + col);
      const fr = m[f],
        fi = m[f + 1];
      if (fr === 0 && fi === 0) continue;
      for (let j = 0; j < n; j++) {
        const t = 2 * (r * n + j);
        const s = 2 * (col * n + j);
        m[t] -= fr * m[s] - fi * m[s + 1];
        m[t + 1] -= fr * m[s + 1] + fi * m[s];
        const dt = dstOff + t,
          ds = dstOff + s;
        const sr = dst[ds],
          si = dst[ds + 1];
        dst[dt] -= fr * sr - fi * si;
        dst[dt + 1] -= fr * si + fi * sr;
      }
    }
  }
  return true;
}

function swap(a: Float64Array, i: number, j: number): void {
  const r = a[i],
    im = a[i + 1];
  a[i] = a[j];
  a[i + 1] = a[j + 1];
  a[j] = r;
  a[j + 1] = im;
}

function mulInPlace(a: Float64Array, i: number, br: number, bi: number): void {
  const ar = a[i],
    ai = a[i + 1];
  a[i] = ar * br - ai * bi;
  a[i + 1] = ar * bi + ai * br;
}

/**
 * Eigenvalues of a Hermitian n×n matrix (interleaved re/im, overwritten) by
 * the cyclic complex Jacobi method, descending. Each step first turns the
 * pivot A[p][q] real by a phase on row and column q, then applies the real
 * Jacobi rotation that zeroes it.
 */
export function hermitianEigenvalues(a: Float64Array, n: number): Float64Array {
  const re = (i: number, j: number) => 2 * (i * n + j);
  for (let sweep = 0; sweep < 60; sweep++) {
    let off = 0,
      diag = 0;
    for (let i = 0; i < n; i++) {
      diag += a[re(i, i)] * a[re(i, i)];
      for (let j = i + 1; j < n; j++) off += a[re(i, j)] ** 2 + a[re(i, j) + 1] ** 2;
    }
    if (off <= 1e-32 * (diag || 1)) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        const zr = a[re(p, q)],
          zi = a[re(p, q) + 1];
        const r = Math.hypot(zr, zi);
        if (r === 0) continue;
        // phase: column q times e^(−iφ), row q times e^(iφ), where z = r·e^(iφ)
        const er = zr / r,
          ei = zi / r;
        for (let k = 0; k < n; k++) {
          if (k !== q) {
            const c0 = re(k, q),
              c1 = c0 + 1; // A[k][q] · conj(e)
            const xr = a[c0],
              xi = a[c1];
            a[c0] = xr * er + xi * ei;
            a[c1] = xi * er - xr * ei;
            const r0 = re(q, k),
              r1 = r0 + 1; // A[q][k] · e
            const yr = a[r0],
              yi = a[r1];
            a[r0] = yr * er - yi * ei;
            a[r1] = yr * ei + yi * er;
          }
        }
        // now A[p][q] = A[q][p] = r (real); the real rotation that zeroes it
        const app = a[re(p, p)],
          aqq = a[re(q, q)];
        const theta = (aqq - app) / (2 * r);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const sn = t * c;
        for (let k = 0; k < n; k++) {
          for (let part = 0; part < 2; part++) {
            const kp = re(k, p) + part,
              kq = re(k, q) + part;
            const x = a[kp],
              y = a[kq];
            a[kp] = c * x - sn * y;
            a[kq] = sn * x + c * y;
          }
        }
        for (let k = 0; k < n; k++) {
          for (let part = 0; part < 2; part++) {
            const pk = re(p, k) + part,
              qk = re(q, k) + part;
            const x = a[pk],
              y = a[qk];
            a[pk] = c * x - sn * y;
            a[qk] = sn * x + c * y;
          }
        }
      }
    }
  }
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = a[re(i, i)];
  return out.sort().reverse();
}

/** SᴴS of the complex n×n matrix at `src[off…]`, into `h`. */
function gram(src: Float64Array, off: number, n: number, h: Float64Array): void {
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      let re = 0,
        im = 0;
      for (let k = 0; k < n; k++) {
        const a = off + 2 * (k * n + i); // conj(S[k][i])
        const b = off + 2 * (k * n + j);
        const ar = src[a],
          ai = -src[a + 1],
          br = src[b],
          bi = src[b + 1];
        re += ar * br - ai * bi;
        im += ar * bi + ai * br;
      }
      h[2 * (i * n + j)] = re;
      h[2 * (i * n + j) + 1] = im;
      h[2 * (j * n + i)] = re;
      h[2 * (j * n + i) + 1] = -im;
    }
  }
}

/**
 * Singular values of the complex n×n matrix at `src[off…]`, descending: the
 * square roots of the eigenvalues of the Hermitian matrix SᴴS.
 */
export function singularValues(src: Float64Array, off: number, n: number, work: Float64Array = new Float64Array(2 * n * n)): Float64Array {
  gram(src, off, n, work);
  const ev = hermitianEigenvalues(work, n);
  return ev.map((v) => Math.sqrt(Math.max(0, v)));
}

/**
 * Largest singular value (the spectral norm) of the complex n×n matrix at
 * `src[off…]`. A 2×2 has it in closed form: λmax of SᴴS = (tr + √(tr² − 4·det))/2 = (a + d + √((a − d)² + 4|b|²))/2.
 */
export function spectralNorm(src: Float64Array, off: number, n: number, work: Float64Array = new Float64Array(2 * n * n)): number {
  if (n === 1) return Math.hypot(src[off], src[off + 1]);
  if (n === 2) {
    gram(src, off, 2, work);
    const a = work[0],
      d = work[6],
      br = work[2],
      bi = work[3];
    // tr² − 4·det written as (a − d)² + 4|b|²: no cancellation when the two singular values are close
    return Math.sqrt((a + d + Math.hypot(a - d, 2 * Math.hypot(br, bi))) / 2);
  }
  gram(src, off, n, work);
  return Math.sqrt(Math.max(0, largestHermitianEigenvalue(work, n)));
}

/** Work vectors of largestHermitianEigenvalue, one set per size: it runs once per frequency. */
const scratch = new Map<number, { d: Float64Array; e: Float64Array; v: Float64Array; p: Float64Array }>();
function scratchFor(n: number) {
  let s = scratch.get(n);
  if (!s) scratch.set(n, (s = { d: new Float64Array(n), e: new Float64Array(Math.max(0, n - 1)), v: new Float64Array(2 * n), p: new Float64Array(2 * n) }));
  return s;
}

/**
 * The largest eigenvalue of a Hermitian n×n matrix (interleaved re/im,
 * overwritten): Householder reduction to a tridiagonal matrix with the same
 * eigenvalues (Golub & Van Loan, Matrix Computations §8.3, from memory), whose
 * off-diagonal magnitudes give a real symmetric tridiagonal one, then
 * bisection on its Sturm sequence counts (§8.4) to the last bit. About
 * (4/3)n³ complex multiply-adds, against the several n³ of each sweep of the
 * Jacobi method that finds every eigenvalue.
 */
export function largestHermitianEigenvalue(a: Float64Array, n: number): number {
  const { d, e, v, p } = scratchFor(n);
  const at = (i: number, j: number) => 2 * (i * n + j);
  for (let k = 0; k < n - 2; k++) {
    // x = A[k+1…n−1][k]; reflect it onto e1: v = x − α·e1, α = −e^{i·arg x0}·‖x‖
    let norm2 = 0;
    for (let i = k + 1; i < n; i++) norm2 += a[at(i, k)] ** 2 + a[at(i, k) + 1] ** 2;
    const norm = Math.sqrt(norm2);
    const x0r = a[at(k + 1, k)],
      x0i = a[at(k + 1, k) + 1];
    const x0 = Math.hypot(x0r, x0i);
    e[k] = norm;
    if (norm === 0) continue;
    const ur = x0 === 0 ? 1 : x0r / x0,
      ui = x0 === 0 ? 0 : x0i / x0;
    // v0 = x0 + e^{iθ}‖x‖ (α = −e^{iθ}‖x‖); the rest of v is x
    for (let i = 0; i < 2 * n; i++) v[i] = 0;
    v[2 * (k + 1)] = x0r + ur * norm;
    v[2 * (k + 1) + 1] = x0i + ui * norm;
    let vn = v[2 * (k + 1)] ** 2 + v[2 * (k + 1) + 1] ** 2;
    for (let i = k + 2; i < n; i++) {
      v[2 * i] = a[at(i, k)];
      v[2 * i + 1] = a[at(i, k) + 1];
      vn += v[2 * i] ** 2 + v[2 * i + 1] ** 2;
    }
    const inv = 1 / Math.sqrt(vn);
    for (let i = k + 1; i < n; i++) {
      v[2 * i] *= inv;
      v[2 * i + 1] *= inv;
    }
    // p = A v over the trailing block, K = vᴴ p (real), w = p − K v; A ← A − 2(v wᴴ + w vᴴ)
    let kr = 0;
    for (let i = k + 1; i < n; i++) {
      let re = 0,
        im = 0;
      for (let j = k + 1; j < n; j++) {
        const ar = a[at(i, j)],
          ai = a[at(i, j) + 1],
          br = v[2 * j],
          bi = v[2 * j + 1];
        re += ar * br - ai * bi;
        im += ar * bi + ai * br;
      }
      p[2 * i] = re;
      p[2 * i + 1] = im;
      kr += v[2 * i] * re + v[2 * i + 1] * im; // Re(conj(v_i)·p_i)
    }
    for (let i = k + 1; i < n; i++) {
      p[2 * i] -= kr * v[2 * i];
      p[2 * i + 1] -= kr * v[2 * i + 1];
    }
    for (let i = k + 1; i < n; i++) {
      const vr = v[2 * i],
        vi = v[2 * i + 1],
        wr = p[2 * i],
        wi = p[2 * i + 1];
      for (let j = k + 1; j < n; j++) {
        // v_i·conj(w_j) + w_i·conj(v_j)
        const vjr = v[2 * j],
          vji = v[2 * j + 1],
          wjr = p[2 * j],
          wji = p[2 * j + 1];
        a[at(i, j)] -= 2 * (vr * wjr + vi * wji + wr * vjr + wi * vji);
        a[at(i, j) + 1] -= 2 * (vi * wjr - vr * wji + wi * vjr - wr * vji);
      }
    }
  }
  for (let i = 0; i < n; i++) d[i] = a[at(i, i)];
  if (n >= 2) e[n - 2] = Math.hypot(a[at(n - 1, n - 2)], a[at(n - 1, n - 2) + 1]);
  // bisection for the largest eigenvalue of the symmetric tridiagonal (d, e)
  let lo = Infinity,
    hi = -Infinity;
  for (let i = 0; i < n; i++) {
    const r = (i > 0 ? e[i - 1] : 0) + (i < n - 1 ? e[i] : 0);
    lo = Math.min(lo, d[i] - r);
    hi = Math.max(hi, d[i] + r);
  }
  /** How many eigenvalues are below x (the negative pivots of T − xI). */
  const below = (x: number) => {
    let count = 0,
      q = 1;
    for (let i = 0; i < n; i++) {
      q = d[i] - x - (i > 0 ? (e[i - 1] * e[i - 1]) / q : 0);
      if (q === 0) q = -Number.EPSILON * (Math.abs(x) + 1); // a zero pivot counts as just below
      if (q < 0) count++;
    }
    return count;
  };
  for (let it = 0; it < 200 && hi - lo > 2 * Number.EPSILON * Math.max(Math.abs(lo), Math.abs(hi)); it++) {
    const mid = (lo + hi) / 2;
    if (mid <= lo || mid >= hi) break;
    if (below(mid) === n) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}
