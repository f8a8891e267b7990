// Dates written with English month names: "Apr 2021" / "April 2021" (a month), "April 5, 2021" and
// "5 Apr 2021" / "05-Apr-2021" (days). Names match in any case, full or three-letter ("Sept" too), with an
// optional dot after an abbreviation. A two-digit year (05-Apr-21) is read only with an explicit pivot.
import type { ParsedTime } from './types.js';
import type { TimeParser } from './parser.js';
import { daysFromCivil } from '../calendar/civil.js';
import { countDigits, readDigits, newScan, notRecognised, resetScan, type Scan } from './scan.js';
import { skipBlanks, trimEnd, fillFromScan } from './iso.js';
import { fullYear, setCalendarDay, scanTrailingTime } from './daymonth.js';
import { setPeriod } from './trade.js';

const NAMES = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];

/** Length of the run of ASCII letters at `i`. */
function letters(s: string, i: number, end: number): number {
  let k = i;
  while (k < end) {
    const c = s.charCodeAt(k) | 32;
    if (c < 97 || c > 122) break;
    k++;
  }
  return k - i;
}

/** Month 1–12 named by the `n` letters at `i` (full name, three letters, or "sept"), or 0. */
export function monthOfName(s: string, i: number, n: number): number {
  if (n < 3) return 0;
  for (let m = 0; m < 12; m++) {
    const name = NAMES[m]!;
    if (n !== 3 && n !== name.length && !(m === 8 && n === 4)) continue;
    if (n > name.length) continue;
    let k = 0;
    while (k < n && (s.charCodeAt(i + k) | 32) === name.charCodeAt(k)) k++;
    if (k === n) return m + 1;
  }
  return 0;
}

/** Reads a month name at `i`; returns month and sets sc.pos after it (and an optional dot), or 0. */
function scanMonthName(s: string, i: number, end: number, sc: Scan): number {
  const n = letters(s, i, end);
  const m = monthOfName(s, i, n);
  if (m === 0) return 0;
  sc.pos = i + n + (s.charCodeAt(i + n) === 46 && n < 5 ? 1 : 0);
  return m;
}

function yearAt(s: string, i: number, end: number, pivot: number | undefined, sc: Scan): number | string {
  const n = countDigits(s, i, end);
  const y = fullYear(readDigits(s, i, n, end), n, pivot);
  sc.pos = i + n;
  return y;
}

function monthYearInto(s: string, out: ParsedTime, sc: Scan, pivot: number | undefined): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  const m = scanMonthName(s, i, end, sc);
  const c = s.charCodeAt(sc.pos);
  if (m === 0 || (c !== 32 && c !== 45)) return notRecognised(s, 'a month and year such as Apr 2021');
  const y = yearAt(s, skipBlanks(s, sc.pos + 1, end), end, pivot, sc);
  if (typeof y === 'string') return y;
  if (sc.pos !== end) return notRecognised(s, 'a month and year such as Apr 2021');
  return setPeriod(out, 'month', daysFromCivil(y, m, 1), m === 12 ? daysFromCivil(y + 1, 1, 1) : daysFromCivil(y, m + 1, 1));
}

/** "April 5, 2021", "Apr 5 2021", with an optional time after it. */
function monthDayYearInto(s: string, out: ParsedTime, sc: Scan, pivot: number | undefined): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  resetScan(sc);
  const m = scanMonthName(s, i, end, sc);
  if (m === 0 || s.charCodeAt(sc.pos) !== 32) return notRecognised(s, 'a date such as April 5, 2021');
  const p = skipBlanks(s, sc.pos, end);
  const nd = countDigits(s, p, end);
  if (nd === 0 || nd > 2) return notRecognised(s, 'a date such as April 5, 2021');
  const day = readDigits(s, p, nd, end);
  let q = p + nd;
  if (s.charCodeAt(q) === 44) q++;
  if (s.charCodeAt(q) !== 32) return notRecognised(s, 'a date such as April 5, 2021');
  const y = yearAt(s, skipBlanks(s, q, end), end, pivot, sc);
  if (typeof y === 'string') return y;
  return finishDay(s, end, y, m, day, out, sc);
}

/** "5 Apr 2021", "05-Apr-2021", "05-Apr-21" (pivot), with an optional time after it. */
function dayMonthYearInto(s: string, out: ParsedTime, sc: Scan, pivot: number | undefined): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  resetScan(sc);
  const nd = countDigits(s, i, end);
  const sep = s.charCodeAt(i + nd);
  if (nd === 0 || nd > 2 || (sep !== 32 && sep !== 45)) return notRecognised(s, 'a date such as 5 Apr 2021');
  const day = readDigits(s, i, nd, end);
  const m = scanMonthName(s, i + nd + 1, end, sc);
  if (m === 0 || s.charCodeAt(sc.pos) !== sep) return notRecognised(s, 'a date such as 5 Apr 2021');
  const y = yearAt(s, sc.pos + 1, end, pivot, sc);
  if (typeof y === 'string') return y;
  return finishDay(s, end, y, m, day, out, sc);
}

function finishDay(s: string, end: number, y: number, m: number, day: number, out: ParsedTime, sc: Scan): string | null {
  const pos = sc.pos;
  const r = setCalendarDay(sc, y, m, day);
  if (r !== null) return r;
  sc.pos = pos;
  const t = scanTrailingTime(s, end, sc);
  if (t !== null) return t;
  return fillFromScan(sc, out);
}

/** The parser of a month-name format id; it reads into `sc` (pass one to look at the shape of the last value read). */
export function makeMonthNameParser(
  id: 'month-name-year' | 'month-name-day-year' | 'day-month-name-year', pivot: number | undefined, sc: Scan = newScan(),
): TimeParser {
  if (id === 'month-name-year') return (t, out) => monthYearInto(t, out, sc, pivot);
  if (id === 'month-name-day-year') return (t, out) => monthDayYearInto(t, out, sc, pivot);
  return (t, out) => dayMonthYearInto(t, out, sc, pivot);
}
