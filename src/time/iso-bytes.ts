// ISO 8601 from bytes: the fast lane of src/time/iso-fast.ts (YYYY-MM-DD and
// YYYY-MM-DD[T ]HH:MM:SS[.fff…][Z|±HH:MM]) read straight from a Buffer, so a hot path needs no string per
// value. Every byte of a value the lane accepts is checked to be the ASCII it expects, so it accepts
// exactly what the string lane accepts and writes the same result; anything else is decoded as UTF-8 and
// given to the string parser, which gives the same reasons.
import { daysFromCivil, daysInMonth, MS_PER_DAY } from '../calendar/civil.js';
import { parseIsoInto } from './iso.js';
import { newScan, type Scan } from './scan.js';
import type { ParsedTime } from './types.js';

/** Value of the two ASCII digits at b[i], b[i + 1], or -1. */
function two(b: Uint8Array, i: number): number {
  const x = b[i]! - 48;
  const y = b[i + 1]! - 48;
  if (x < 0 || x > 9 || y < 0 || y > 9) return -1;
  return x * 10 + y;
}

/** Day number of YYYY-MM-DD at b[s], or NaN when it is not a plain valid date there (10 bytes are there). */
function fastDate(b: Uint8Array, s: number): number {
  if (b[s + 4] !== 45 || b[s + 7] !== 45) return NaN;
  const hi = two(b, s);
  const lo = two(b, s + 2);
  const m = two(b, s + 5);
  const d = two(b, s + 8);
  if (hi < 0 || lo < 0 || m < 1 || m > 12 || d < 1) return NaN;
  const y = hi * 100 + lo;
  if (d > 28 && d > daysInMonth(y, m)) return NaN;
  return daysFromCivil(y, m, d);
}

/**
 * Tries the fast lane on the bytes b[start, end). True when it read the value into `out`; false means
 * "use the general parser" (never "invalid"). Reads no byte outside [start, end).
 */
export function fastIsoBytes(b: Uint8Array, start: number, end: number, out: ParsedTime): boolean {
  const len = end - start;
  if (len !== 10 && len < 19) return false;
  const days = fastDate(b, start);
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
  const sep = b[start + 10];
  if ((sep !== 84 && sep !== 32 && sep !== 116) || b[start + 13] !== 58 || b[start + 16] !== 58) return false;
  const hh = two(b, start + 11);
  const mm = two(b, start + 14);
  const ss = two(b, start + 17);
  if (hh < 0 || hh > 23 || mm < 0 || mm > 59 || ss < 0 || ss > 59) return false;
  let ms = 0;
  let p = start + 19;
  let c = p < end ? b[p]! : -1;
  if (c === 46 || c === 44) {
    let j = p + 1;
    while (j < end && b[j]! >= 48 && b[j]! <= 57) j++;
    if (j === p + 1) return false;
    const n = j - p - 1;
    ms = (b[p + 1]! - 48) * 100 + (n > 1 ? b[p + 2]! - 48 : 0) * 10 + (n > 2 ? b[p + 3]! - 48 : 0);
    p = j;
    c = p < end ? b[p]! : -1;
  }
  const wall = days * MS_PER_DAY + hh * 3_600_000 + mm * 60_000 + ss * 1000 + ms;
  let offset = NaN;
  if (p === end) offset = NaN;
  else if ((c === 90 || c === 122) && p + 1 === end) offset = 0;
  else if ((c === 43 || c === 45) && p + 6 === end && b[p + 3] === 58) {
    const oh = two(b, p + 1);
    const om = two(b, p + 4);
    if (oh < 0 || oh > 23 || om < 0 || om > 59) return false;
    offset = (c === 43 ? 1 : -1) * (oh * 60 + om);
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
