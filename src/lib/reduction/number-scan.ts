// Number scanner for delimited log cells, straight from bytes (no strings on the fast path).
// Up to 15 significant digits and a decimal exponent within ±22, the value is mantissa × or ÷ an
// exact power of ten, one correctly rounded operation, so it equals Number(text); anything longer
// goes through the text path. Results besides the value are left in `scanned` (valid until the
// next call; the reader reads them at once).
import { parseNumberText } from './text';

/** Exact powers of ten 10⁰ … 10²² (all representable as doubles). */
const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);

/** Side results of the last scanNumber call. */
export const scanned = {
  /** index of the delimiter that ends the cell (or the line's end) */
  end: 0,
  /** the cell used a decimal comma */
  comma: false,
  /** the cell holds a double quote: use the quote-aware path */
  quoted: false,
};

/** Bytes [a, b) of buf as Latin-1 text (only ASCII reaches it from the number path). */
export function latin1(buf: Uint8Array, a: number, b: number): string {
  let s = '';
  for (let i = a; i < b; i++) s += String.fromCharCode(buf[i]!);
  return s;
}

/**
 * The number in bytes [i, …) up to `delim` or `e`: spaces around it allowed, a sign, digits with
 * one decimal point (or a decimal comma when `allowComma`), an exponent. NaN for an empty or
 * non-numeric cell. Hot: every byte read is at j < e ≤ buf.length.
 */
export function scanNumber(buf: Uint8Array, i: number, e: number, delim: number, allowComma: boolean): number {
  let j = i;
  let c = 0;
  while (j < e && (c = buf[j]!) === 32) j++;
  scanned.comma = false;
  scanned.quoted = false;
  if (c === 34 && j < e) {
    scanned.quoted = true;
    scanned.end = j;
    return NaN;
  }
  const start = j;
  let neg = false;
  if (j < e) {
    if (c === 45) {
      neg = true;
      j++;
    } else if (c === 43) j++;
  }
  let mant = 0;
  let digits = 0;
  let frac = 0;
  let sep = false;
  for (; j < e; j++) {
    c = buf[j]!;
    const d = c - 48;
    if (d >= 0 && d <= 9) {
      mant = mant * 10 + d;
      digits++;
      if (sep) frac++;
    } else if (c === 46 && !sep) sep = true;
    else if (c === 44 && allowComma && !sep) {
      sep = true;
      scanned.comma = true;
    } else break;
  }
  let ok = digits > 0;
  let exp = 0;
  if (ok && j < e && (c === 101 || c === 69)) {
    j++;
    let eneg = false;
    c = j < e ? buf[j]! : 0;
    if (c === 45 || c === 43) {
      eneg = c === 45;
      j++;
    }
    let ed = 0;
    while (j < e && (c = buf[j]!) >= 48 && c <= 57) {
      exp = exp * 10 + (c - 48);
      ed++;
      j++;
    }
    if (ed === 0) ok = false;
    if (eneg) exp = -exp;
  }
  while (j < e && buf[j] === 32) j++;
  if (j < e && buf[j] !== delim) {
    ok = false;
    while (j < e && (c = buf[j]!) !== delim) {
      if (c === 34) {
        scanned.quoted = true;
        scanned.end = j;
        return NaN;
      }
      j++;
    }
  }
  scanned.end = j;
  if (!ok) {
    scanned.comma = false;
    return NaN;
  }
  const e10 = exp - frac;
  let v: number;
  if (digits > 15 || e10 > 22 || e10 < -22) v = parseNumberText(latin1(buf, start, j), allowComma);
  else {
    v = e10 === 0 ? mant : e10 > 0 ? mant * POW10[e10]! : mant / POW10[-e10]!;
    if (neg) v = -v;
  }
  return v === v && v !== Infinity && v !== -Infinity ? v : NaN;
}

/**
 * The common cell, tried first: [-]digits[.digits] up to `delim` or `e`, at most 15 digits. Anything
 * else (spaces, a plus sign, an exponent, a decimal comma, a quote, an empty cell) sets
 * `scanned.end` to −1: call scanNumber for it. Small enough for the compiler to inline.
 */
export function scanPlainDecimal(buf: Uint8Array, i: number, e: number, delim: number): number {
  let j = i;
  let neg = false;
  if (j < e && buf[j] === 45) {
    neg = true;
    j++;
  }
  let mant = 0;
  let digits = 0;
  while (j < e) {
    const d = buf[j]! - 48;
    if (d < 0 || d > 9) break;
    mant = mant * 10 + d;
    digits++;
    j++;
  }
  let frac = 0;
  if (j < e && buf[j] === 46) {
    j++;
    while (j < e) {
      const d = buf[j]! - 48;
      if (d < 0 || d > 9) break;
      mant = mant * 10 + d;
      frac++;
      j++;
    }
  }
  digits += frac;
  if (digits === 0 || digits > 15 || (j < e && buf[j] !== delim)) {
    scanned.end = -1;
    return NaN;
  }
  scanned.end = j;
  const v = frac === 0 ? mant : mant / POW10[frac]!;
  return neg ? -v : v;
}

/** Index of the next `delim` at or after i (or e); -1 when a quote comes first. */
export function skipCell(buf: Uint8Array, i: number, e: number, delim: number): number {
  for (let j = i; j < e; j++) {
    const c = buf[j];
    if (c === delim) return j;
    if (c === 34) return -1;
  }
  return e;
}
