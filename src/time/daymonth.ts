// Numeric dates with separators: 05/04/2021, 05.04.2021, 05-04-2021 read day-first or month-first under
// the order the column decided (never guessed per value), and 2021/04/05 year first. An optional time of
// day (and offset) may follow after a space or T, read as in ISO 8601. Two-digit years are read only with
// an explicit pivot: the first year of the 100-year window (pivot 1950 reads 49 as 2049 and 50 as 1950).
import { daysFromCivil, daysInMonth } from '../calendar/civil.js';
import type { ParsedTime } from './types.js';
import { type Scan, countDigits, readDigits, badDay, badMonth, notRecognised, resetScan } from './scan.js';
import { scanIsoTime, checkLeapSecond } from './iso-time.js';
import { fillFromScan, skipBlanks, trimEnd } from './iso.js';
import { DateForm } from './scan.js';

/** Field order of a numeric date. */
export type NumericOrder = 'dmy' | 'mdy' | 'ymd';

/** The three numeric fields of a date as written, with their digit counts and separator. */
export interface NumericFields {
  f1: number;
  f2: number;
  f3: number;
  n1: number;
  n2: number;
  n3: number;
  sep: number;
  /** Index after the third field. */
  pos: number;
}

/** A fresh scratch record for numeric fields. */
export function newNumericFields(): NumericFields {
  return { f1: 0, f2: 0, f3: 0, n1: 0, n2: 0, n3: 0, sep: 0, pos: 0 };
}

function isSep(c: number): boolean {
  return c === 47 || c === 46 || c === 45;
}

/** Reads "a<sep>b<sep>c" of 1–4, 1–2 and 1–4 digits with one separator ('/', '.' or '-'); false if not that shape. */
export function scanNumericFields(s: string, i: number, end: number, f: NumericFields): boolean {
  const n1 = countDigits(s, i, end);
  if (n1 === 0 || n1 > 4) return false;
  const sep = s.charCodeAt(i + n1);
  if (!isSep(sep)) return false;
  const j = i + n1 + 1;
  const n2 = countDigits(s, j, end);
  if (n2 === 0 || n2 > 2 || s.charCodeAt(j + n2) !== sep) return false;
  const k = j + n2 + 1;
  const n3 = countDigits(s, k, end);
  if (n3 === 0 || n3 > 4) return false;
  f.f1 = readDigits(s, i, n1, end);
  f.f2 = readDigits(s, j, n2, end);
  f.f3 = readDigits(s, k, n3, end);
  f.n1 = n1;
  f.n2 = n2;
  f.n3 = n3;
  f.sep = sep;
  f.pos = k + n3;
  return true;
}

/** The year of a written year field: four digits as written; two digits only through the pivot window. */
export function fullYear(value: number, digits: number, pivot: number | undefined): number | string {
  if (digits === 4) return value;
  if (digits === 2) {
    if (pivot === undefined) return 'two-digit-year: a two-digit year needs an explicit pivot (twoDigitYearPivot)';
    const century = Math.floor(pivot / 100) * 100;
    const y = century + value;
    return y < pivot ? y + 100 : y;
  }
  return `not-recognised: a year is written with four digits (or two with a pivot), not ${digits}`;
}

/** Checks month and day and sets the scan to that date. */
export function setCalendarDay(sc: Scan, year: number, month: number, day: number): string | null {
  if (month < 1 || month > 12) return badMonth(month);
  const dim = daysInMonth(year, month);
  if (day < 1 || day > dim) return badDay(year, month, day, dim);
  sc.year = year;
  sc.days = daysFromCivil(year, month, day);
  sc.endDays = sc.days + 1;
  sc.unit = 'day';
  sc.dateForm = DateForm.Calendar;
  return null;
}

/** Reads an optional time after a date ending at sc.pos (space or T, then hh:mm[:ss[.f]] and an offset). */
export function scanTrailingTime(s: string, end: number, sc: Scan): string | null {
  if (sc.pos >= end) return null;
  const c = s.charCodeAt(sc.pos);
  if (c !== 32 && c !== 84) return notRecognised(s, 'a date (unexpected text after it)');
  sc.sep = c;
  const r = scanIsoTime(s, skipBlanks(s, sc.pos + 1, end), end, sc);
  if (r !== null) return r;
  if (sc.pos !== end) return notRecognised(s, 'a date and time');
  return sc.leap ? checkLeapSecond(sc.timeMs, sc.offset) : null;
}

/** Parses a numeric date in `order` (with optional time) into `out`; `sep` when set must match the value's separator. */
export function parseNumericDateInto(
  s: string, order: NumericOrder, pivot: number | undefined, sepCode: number, out: ParsedTime, sc: Scan, f: NumericFields,
): string | null {
  const i = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, i, s.length);
  if (i === end) return 'empty: the value is empty';
  resetScan(sc);
  const what = order === 'dmy' ? 'a day/month/year date' : order === 'mdy' ? 'a month/day/year date' : 'a year/month/day date';
  if (!scanNumericFields(s, i, end, f)) return notRecognised(s, what);
  if (sepCode !== 0 && f.sep !== sepCode) return notRecognised(s, `${what} with "${String.fromCharCode(sepCode)}" between fields`);
  let y: number | string;
  let month: number;
  let day: number;
  if (order === 'ymd') {
    if (f.n1 !== 4 || f.n3 > 2) return notRecognised(s, what);
    y = f.f1; month = f.f2; day = f.f3;
  } else {
    if (f.n1 > 2) return notRecognised(s, what);
    y = fullYear(f.f3, f.n3, pivot);
    month = order === 'dmy' ? f.f2 : f.f1;
    day = order === 'dmy' ? f.f1 : f.f2;
  }
  if (typeof y === 'string') return y;
  const r = setCalendarDay(sc, y, month, day);
  if (r !== null) return r;
  sc.pos = f.pos;
  const t = scanTrailingTime(s, end, sc);
  if (t !== null) return t;
  return fillFromScan(sc, out);
}
