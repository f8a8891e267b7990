// The fast lane of the ISO 8601 path: the shapes that fill real columns — YYYY-MM-DD and
// YYYY-MM-DD[T ]HH:MM:SS[.fff…][Z|±HH:MM] — read at fixed positions. Anything else, and anything unusual
// within these shapes (24:00, a leap second, out-of-range fields), falls back to the general scanner,
// which gives the exact reason; so the fast lane never decides a value is invalid.
import { daysFromCivil, daysInMonth, MS_PER_DAY } from '../calendar/civil.js';
import type { ParsedTime } from './types.js';

/** Value of two digits at `i`, or -1. */
function two(s: string, i: number): number {
  const a = s.charCodeAt(i) - 48;
  const b = s.charCodeAt(i + 1) - 48;
  if (a < 0 || a > 9 || b < 0 || b > 9) return -1;
  return a * 10 + b;
}

/** Day number of YYYY-MM-DD at the start of `s`, or NaN when it is not a plain valid date there. */
function fastDate(s: string): number {
  if (s.charCodeAt(4) !== 45 || s.charCodeAt(7) !== 45) return NaN;
  const hi = two(s, 0);
  const lo = two(s, 2);
  const m = two(s, 5);
  const d = two(s, 8);
  if (hi < 0 || lo < 0 || m < 1 || m > 12 || d < 1) return NaN;
  const y = hi * 100 + lo;
  if (d > 28 && d > daysInMonth(y, m)) return NaN;
  return daysFromCivil(y, m, d);
}

/** Index after the run of ASCII digits starting at `i`. */
function digitsEnd(s: string, i: number, end: number): number {
  while (i < end) {
    const c = s.charCodeAt(i) - 48;
    if (c < 0 || c > 9) break;
    i++;
  }
  return i;
}

/** Milliseconds of the fraction digits s[i, j) (truncated to three). */
function fractionMs(s: string, i: number, j: number): number {
  const n = j - i;
  const a = s.charCodeAt(i) - 48;
  const b = n > 1 ? s.charCodeAt(i + 1) - 48 : 0;
  const c = n > 2 ? s.charCodeAt(i + 2) - 48 : 0;
  return a * 100 + b * 10 + c;
}

/**
 * Tries the fast lane on the whole of `s` (no surrounding blanks). Returns true when it read the value into
 * `out`; false means "use the general scanner" (not "invalid").
 */
export function fastIso(s: string, out: ParsedTime): boolean {
  const len = s.length;
  if (len !== 10 && len < 19) return false;
  const days = fastDate(s);
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
  const sep = s.charCodeAt(10);
  if ((sep !== 84 && sep !== 32 && sep !== 116) || s.charCodeAt(13) !== 58 || s.charCodeAt(16) !== 58) return false;
  const hh = two(s, 11);
  const mm = two(s, 14);
  const ss = two(s, 17);
  if (hh < 0 || hh > 23 || mm < 0 || mm > 59 || ss < 0 || ss > 59) return false;
  let ms = 0;
  let p = 19;
  let c = s.charCodeAt(p);
  if (c === 46 || c === 44) {
    const j = digitsEnd(s, p + 1, len);
    if (j === p + 1) return false;
    ms = fractionMs(s, p + 1, j);
    p = j;
    c = s.charCodeAt(p);
  }
  const wall = days * MS_PER_DAY + hh * 3_600_000 + mm * 60_000 + ss * 1000 + ms;
  let offset = NaN;
  if (p === len) offset = NaN;
  else if ((c === 90 || c === 122) && p + 1 === len) offset = 0;
  else if ((c === 43 || c === 45) && p + 6 === len && s.charCodeAt(p + 3) === 58) {
    const oh = two(s, p + 1);
    const om = two(s, p + 4);
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
