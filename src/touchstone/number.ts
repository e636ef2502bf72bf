/**
 * A number scanner over ASCII bytes, straight to doubles with no string per
 * value. Decimal mantissas of up to 15 significant digits with a total power of
 * ten within ±22 are converted exactly as the decimal text reads (both factors
 * are exact doubles, so one IEEE operation rounds correctly: Clinger's fast
 * path); anything longer goes through Number() on the token's text, which is
 * also correctly rounded.
 *
 * Grammar: [+-]? (digits [. digits?] | . digits) ([eE] [+-]? digits)?
 */

const POW10 = new Float64Array(23);
for (let i = 0, p = 1; i < 23; i++, p *= 10) POW10[i] = p;

/** Where the last scan stopped (one past the number), or −1 if no number stood there. */
export let scanEnd = -1;

function isDelimiter(c: number): boolean {
  return c === 32 || c === 9 || c === 13 || c === 10 || c === 33 /* ! */ || c === 44 /* , never valid but ends a token */ || c === 11 || c === 12;
}

/**
 * Scans a number starting at `pos`, scaled by 10^extraExp (used to turn a
 * frequency in GHz into Hz without a rounding step). Sets `scanEnd` to the
 * position after the token; on a malformed token, returns NaN and sets
 * `scanEnd` to the end of the offending token (negated − 1, so callers can
 * report it: end = −scanEnd − 1).
 */
export function scanNumber(buf: Uint8Array, pos: number, end: number, extraExp = 0): number {
  let p = pos;
  let c = buf[p];
  let negative = false;
  if (c === 45) {
    negative = true;
    p++;
  } else if (c === 43) p++;
  let mant = 0;
  let sig = 0;
  let exp10 = 0;
  let digits = 0;
  let slow = false;
  while (p < end) {
    c = buf[p];
    if (c < 48 || c > 57) break;
    digits++;
    if (mant !== 0 || c !== 48) {
      if (sig < 15) {
        mant = mant * 10 + (c - 48);
        sig++;
      } else {
        slow = true;
      }
    }
    p++;
  }
  if (p < end && buf[p] === 46) {
    p++;
    while (p < end) {
      c = buf[p];
      if (c < 48 || c > 57) break;
      digits++;
      if (mant !== 0 || c !== 48) {
        if (sig < 15) {
          mant = mant * 10 + (c - 48);
          sig++;
          exp10--;
        } else {
          slow = true;
        }
      } else {
        exp10--;
      }
      p++;
    }
  }
  if (digits === 0) return fail(buf, pos, end);
  if (p < end && (buf[p] === 101 || buf[p] === 69)) {
    p++;
    let eneg = false;
    if (p < end && (buf[p] === 45 || buf[p] === 43)) {
      eneg = buf[p] === 45;
      p++;
    }
    let e = 0;
    let ed = 0;
    while (p < end) {
      c = buf[p];
      if (c < 48 || c > 57) break;
      if (e < 100000) e = e * 10 + (c - 48);
      ed++;
      p++;
    }
    if (ed === 0) return fail(buf, pos, end);
    exp10 += eneg ? -e : e;
  }
  if (p < end && !isDelimiter(buf[p])) return fail(buf, pos, end);
  scanEnd = p;
  const e = exp10 + extraExp;
  if (!slow && e >= -22 && e <= 22) {
    const v = e < 0 ? mant / POW10[-e] : mant * POW10[e];
    return negative ? -v : v;
  }
  if (!slow && mant === 0) return negative ? -0 : 0;
  return slowNumber(buf, pos, p, extraExp);
}

/**
 * The exact path: rebuilds the token as "<sign><all digits>e<exponent>" and
 * lets Number() round it once.
 */
function slowNumber(buf: Uint8Array, from: number, to: number, extraExp: number): number {
  let sign = '';
  let digits = '';
  let frac = 0;
  let inFrac = false;
  let p = from;
  if (buf[p] === 45 || buf[p] === 43) {
    if (buf[p] === 45) sign = '-';
    p++;
  }
  for (; p < to; p++) {
    const c = buf[p];
    if (c === 46) inFrac = true;
    else if (c >= 48 && c <= 57) {
      digits += String.fromCharCode(c);
      if (inFrac) frac++;
    } else break;
  }
  let exp = 0;
  if (p < to) {
    let t = '';
    for (p++; p < to; p++) t += String.fromCharCode(buf[p]);
    exp = Number(t);
  }
  return Number(`${sign}${digits}e${exp - frac + extraExp}`);
}

function fail(buf: Uint8Array, pos: number, end: number): number {
  let p = pos;
  while (p < end && !isDelimiter(buf[p])) p++;
  if (p === pos) p++;
  scanEnd = -p - 1;
  return NaN;
}

/** The text of bytes [from, to) as Latin-1 (tokens are ASCII; for messages). */
export function latin1(buf: Uint8Array, from: number, to: number): string {
  let s = '';
  for (let i = from; i < to && i - from < 200; i++) s += String.fromCharCode(buf[i]);
  return s;
}
