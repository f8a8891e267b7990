// Spreadsheet serial day numbers, ECMA-376 1st ed. Part 4 "Date Representation":
// - 1900 date system (backward-compatibility base): 1900-01-01 = 1, 9999-12-31 = 2 958 465, and the
//   fictitious 1900-02-29 = 60 that the standard keeps for compatibility — serial 60 names no real date,
//   so it is invalid with a reason (MS-XLSB §2.5.30: serial 60 "no date is specified");
// - 1904 date system: 1904-01-01 = 0, 9999-12-31 = 2 957 003.
// The fraction is the time of day. It is read at the precision its digits carry: when the written
// fraction is not a whole second, the reading is the roundest time (whole hour, then minute, then second)
// inside the interval the digits stand for (± half a unit of the last digit), else the nearest millisecond.
// So 42580.3333 (±4.3 s) reads 08:00:00 and 0.3333333333 reads 08:00:00, while 0.1 reads 02:24:00 exactly.
// Serials carry no zone: the result is a local wall-clock reading.
import { daysFromCivil, MS_PER_DAY } from '../calendar/civil.js';
import type { ParsedTime } from './types.js';
import { countDigits, notRecognised } from './scan.js';
import { skipBlanks, trimEnd } from './iso.js';

export type SerialSystem = '1900' | '1904';

const BASE_1900_LOW = daysFromCivil(1899, 12, 31); // serial 1 = 1900-01-01 (serials 1–59)
const BASE_1900_HIGH = daysFromCivil(1899, 12, 30); // serial 61 = 1900-03-01 (serials above 60)
const BASE_1904 = daysFromCivil(1904, 1, 1);
const MAX_1900 = 2_958_465;
const MAX_1904 = 2_957_003;
const SNAP = [3_600_000, 60_000, 1000];

/** Milliseconds into the day of a fraction of `digits` decimal digits with value `q`, read at its precision. */
export function serialFractionMs(q: number, digits: number): number {
  if (digits === 0) return 0;
  const scale = 10 ** digits;
  const x = (q / scale) * MS_PER_DAY;
  const wholeSecond = Math.round(x / 1000) * 1000;
  if (Math.abs(wholeSecond - x) < 1e-6) return wholeSecond;
  const half = MS_PER_DAY / scale / 2;
  for (const g of SNAP) {
    const r = Math.round(x / g) * g;
    if (Math.abs(r - x) <= half) return r;
  }
  return Math.round(x);
}

/** Day number of a whole serial in a date system, or a reason when the serial names no date. */
function serialDays(n: number, system: SerialSystem): number | string {
  if (system === '1904') {
    if (n > MAX_1904) return 'out-of-range: 1904-system serials end at 2957003 (9999-12-31)';
    return BASE_1904 + n;
  }
  if (n === 0) return 'invalid-date: serial 0 would be 1900-01-00, which does not exist; the 1900 system starts at 1 (1900-01-01)';
  if (n === 60) return 'invalid-date: serial 60 is the fictitious 1900-02-29 of the 1900 date system (1900 was not a leap year)';
  if (n > MAX_1900) return 'out-of-range: 1900-system serials end at 2958465 (9999-12-31)';
  return n < 60 ? BASE_1900_LOW + n : BASE_1900_HIGH + n;
}

/** Parses a spreadsheet serial day number (digits, optional fraction) into `out` as a local reading. */
export function parseSerialInto(s: string, system: SerialSystem, out: ParsedTime): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  if (s.charCodeAt(i) === 45) return `out-of-range: negative serials have no date in the ${system} date system`;
  const n = countDigits(s, i, end);
  if (n === 0 || n > 7) return n > 7 ? `out-of-range: serial beyond 9999-12-31` : notRecognised(s, 'a serial day number');
  let whole = 0;
  for (let k = i; k < i + n; k++) whole = whole * 10 + (s.charCodeAt(k) - 48);
  let q = 0;
  let digits = 0;
  if (i + n < end) {
    if (s.charCodeAt(i + n) !== 46) return notRecognised(s, 'a serial day number');
    digits = countDigits(s, i + n + 1, end);
    if (digits === 0 || i + n + 1 + digits !== end) return notRecognised(s, 'a serial day number');
    const kept = digits < 15 ? digits : 15;
    for (let k = 0; k < kept; k++) q = q * 10 + (s.charCodeAt(i + n + 1 + k) - 48);
    digits = kept;
  }
  const days = serialDays(whole, system);
  if (typeof days === 'string') return days;
  out.kind = 'local';
  out.ms = days * MS_PER_DAY + serialFractionMs(q, digits);
  out.offset = NaN;
  out.unit = null;
  out.endMs = NaN;
  out.leapSecond = false;
  return null;
}
