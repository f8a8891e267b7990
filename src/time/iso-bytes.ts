// ISO 8601 from bytes: the fast lane of src/time/iso-fast.ts (YYYY-MM-DD and
// YYYY-MM-DD[T ]HH:MM:SS[.fff…][Z|±HH:MM]) read straight from a Buffer, so a hot path needs no string per
// value. Every byte of a value the lane accepts is checked to be the ASCII it expects, so it accepts
// exactly what the string lane accepts and writes the same result; anything else is decoded as UTF-8 and
// given to the string parser, which gives the same reasons.
//
// Speed: each digit is checked with one unsigned compare, and the day number of the date part is memoised
// (the rows of a log share their date with their neighbours), so most values cost three word compares
// and no calendar arithmetic for their date.
import { daysFromCivil, daysInMonth, MS_PER_DAY } from '../calendar/civil.js';
import { parseIsoInto } from './iso.js';
import { newScan, type Scan } from './scan.js';
import type { ParsedTime } from './types.js';

/**
 * The last valid date the lane read — its ten bytes as little-endian words (`a` bytes 0–3, `b` bytes 4–7,
 * `c` bytes 8–9) and its day number — and a DataView of the last buffer read. A memo belongs to one caller
 * (a parser closure, a scan): a value whose date bytes equal the memo's skips their checks and the
 * calendar arithmetic (bytes equal to checked bytes pass the same checks); every other byte is checked.
 */
export interface IsoDateMemo {
  a: number;
  b: number;
  c: number;
  days: number;
  buf: Uint8Array | null;
  view: DataView | null;
}

/** A memo that holds no date yet. */
export function newIsoDateMemo(): IsoDateMemo {
  return { a: 0, b: 0, c: -1, days: NaN, buf: null, view: null };
}

/** Day number of the date at b[s] through the memo (see IsoDateMemo), or NaN when it is not a plain valid date. */
function memoDate(b: Uint8Array, s: number, memo: IsoDateMemo): number {
  let v = memo.view;
  if (memo.buf !== b || v === null) {
    v = new DataView(b.buffer, b.byteOffset, b.byteLength);
    memo.buf = b;
    memo.view = v;
  }
  const a = v.getInt32(s, true);
  const w = v.getInt32(s + 4, true);
  const c = v.getUint16(s + 8, true);
  if (a === memo.a && w === memo.b && c === memo.c) return memo.days;
  const days = fastDate(b, s);
  if (days === days) {
    memo.a = a;
    memo.b = w;
    memo.c = c;
    memo.days = days;
  }
  return days;
}

/** Day number of YYYY-MM-DD at b[s], or NaN when it is not a plain valid date there (10 bytes are there). */
function fastDate(b: Uint8Array, s: number): number {
  if (b[s + 4] !== 45 || b[s + 7] !== 45) return NaN;
  // (c - 48) >>> 0 is 0–9 for an ASCII digit and larger for any other byte.
  const y0 = (b[s]! - 48) >>> 0;
  const y1 = (b[s + 1]! - 48) >>> 0;
  const y2 = (b[s + 2]! - 48) >>> 0;
  const y3 = (b[s + 3]! - 48) >>> 0;
  const m0 = (b[s + 5]! - 48) >>> 0;
  const m1 = (b[s + 6]! - 48) >>> 0;
  const d0 = (b[s + 8]! - 48) >>> 0;
  const d1 = (b[s + 9]! - 48) >>> 0;
  if (y0 > 9 || y1 > 9 || y2 > 9 || y3 > 9 || m0 > 9 || m1 > 9 || d0 > 9 || d1 > 9) return NaN;
  const y = y0 * 1000 + y1 * 100 + y2 * 10 + y3;
  const m = m0 * 10 + m1;
  const d = d0 * 10 + d1;
  if (m < 1 || m > 12 || d < 1) return NaN;
  if (d > 28 && d > daysInMonth(y, m)) return NaN;
  return daysFromCivil(y, m, d);
}

/** Milliseconds of [T ]HH:MM:SS at b[s] (s is the separator), or -1 when it is not a plain valid time. */
function fastClock(b: Uint8Array, s: number): number {
  const sep = b[s];
  if ((sep !== 84 && sep !== 32 && sep !== 116) || b[s + 3] !== 58 || b[s + 6] !== 58) return -1;
  const h0 = (b[s + 1]! - 48) >>> 0;
  const h1 = (b[s + 2]! - 48) >>> 0;
  const n0 = (b[s + 4]! - 48) >>> 0;
  const n1 = (b[s + 5]! - 48) >>> 0;
  const s0 = (b[s + 7]! - 48) >>> 0;
  const s1 = (b[s + 8]! - 48) >>> 0;
  // Hours 00–23, minutes and seconds 00–59: 24:00 and leap seconds go to the general scanner.
  if (h0 > 2 || h1 > 9 || n0 > 5 || n1 > 9 || s0 > 5 || s1 > 9) return -1;
  const hh = h0 * 10 + h1;
  if (hh > 23) return -1;
  return hh * 3_600_000 + (n0 * 10 + n1) * 60_000 + (s0 * 10 + s1) * 1000;
}

/** fastClock reading the separator and six digits as two little-endian words of `v` (same checks). */
function viewClock(v: DataView, b: Uint8Array, s: number): number {
  const t = v.getInt32(s, true); // separator, h0, h1, ':'
  const u = v.getInt32(s + 4, true); // n0, n1, ':', s0
  const sep = t & 255;
  if ((sep !== 84 && sep !== 32 && sep !== 116) || t >>> 24 !== 58 || ((u >>> 16) & 255) !== 58) return -1;
  const h0 = (((t >>> 8) & 255) - 48) >>> 0;
  const h1 = (((t >>> 16) & 255) - 48) >>> 0;
  const n0 = ((u & 255) - 48) >>> 0;
  const n1 = (((u >>> 8) & 255) - 48) >>> 0;
  const s0 = ((u >>> 24) - 48) >>> 0;
  const s1 = (b[s + 8]! - 48) >>> 0;
  if (h0 > 2 || h1 > 9 || n0 > 5 || n1 > 9 || s0 > 5 || s1 > 9) return -1;
  const hh = h0 * 10 + h1;
  if (hh > 23) return -1;
  return hh * 3_600_000 + (n0 * 10 + n1) * 60_000 + (s0 * 10 + s1) * 1000;
}

/** Offset in minutes of ±HH:MM at b[p] (6 bytes are there), or NaN when it is not a valid one. */
function fastOffset(b: Uint8Array, p: number, c: number): number {
  if (b[p + 3] !== 58) return NaN;
  const h0 = (b[p + 1]! - 48) >>> 0;
  const h1 = (b[p + 2]! - 48) >>> 0;
  const m0 = (b[p + 4]! - 48) >>> 0;
  const m1 = (b[p + 5]! - 48) >>> 0;
  if (h0 > 2 || h1 > 9 || m0 > 5 || m1 > 9) return NaN;
  const oh = h0 * 10 + h1;
  if (oh > 23) return NaN;
  const off = oh * 60 + m0 * 10 + m1;
  return c === 43 ? off : -off;
}

/**
 * Tries the fast lane on the bytes b[start, end). True when it read the value into `out`; false means
 * "use the general parser" (never "invalid"). Reads no byte outside [start, end). `memo`, when given,
 * remembers the day number of the last date read (see IsoDateMemo).
 */
export function fastIsoBytes(b: Uint8Array, start: number, end: number, out: ParsedTime, memo?: IsoDateMemo): boolean {
  const len = end - start;
  if (len !== 10 && len < 19) return false;
  const days = memo === undefined ? fastDate(b, start) : memoDate(b, start, memo);
  if (days !== days) return false;
  if (len === 10) {
    out.kind = 'period';
    out.unit = 'day';
    out.ms = days * MS_PER_DAY;
    out.endMs = out.ms + MS_PER_DAY;
    out.offset = NaN;
    out.leapSecond = false;
    return true;
  }
  const clock = memo === undefined ? fastClock(b, start + 10) : viewClock(memo.view!, b, start + 10);
  if (clock < 0) return false;
  let ms = clock;
  let p = start + 19;
  let c = p < end ? b[p]! : -1;
  if (c === 46 || c === 44) {
    let j = p + 1;
    while (j < end && ((b[j]! - 48) >>> 0) <= 9) j++;
    if (j === p + 1) return false;
    const n = j - p - 1;
    ms += (b[p + 1]! - 48) * 100 + (n > 1 ? b[p + 2]! - 48 : 0) * 10 + (n > 2 ? b[p + 3]! - 48 : 0);
    p = j;
    c = p < end ? b[p]! : -1;
  }
  const wall = days * MS_PER_DAY + ms;
  let offset: number;
  if (p === end) offset = NaN;
  else if ((c === 90 || c === 122) && p + 1 === end) offset = 0;
  else if ((c === 43 || c === 45) && p + 6 === end) {
    offset = fastOffset(b, p, c);
    if (offset !== offset) return false;
  } else return false;
  out.unit = null;
  out.endMs = NaN;
  out.leapSecond = false;
  if (offset === offset) {
    out.kind = 'instant';
    out.ms = wall - offset * 60_000;
    out.offset = offset;
  } else {
    out.kind = 'local';
    out.ms = wall;
    out.offset = NaN;
  }
  return true;
}

/**
 * Parses the ISO 8601 date or date-time in the UTF-8 bytes buf[start, end) into `out`, with exactly the
 * result and reason of the string parser on the same text (surrounding spaces ignored). `sc` is the
 * scratch record of the general path (made when absent, so pass one on hot paths).
 */
export function parseIsoBytes(buf: Buffer, start: number, end: number, out: ParsedTime, sc?: Scan): string | null {
  if (fastIsoBytes(buf, start, end, out)) return null;
  return parseIsoInto(buf.toString('utf8', start, end), out, sc ?? newScan());
}
