// Shared low-level pieces of the value parsers: digit reading by char codes, the JavaScript date range,
// and the scratch record a parser fills while it reads one value (made once per parser, never per value).
import type { UnitName } from '../calendar/types.js';

/** Largest wall-clock or epoch millisecond value a JavaScript Date can hold (ECMA-262 §21.4.1.1: ±8.64e15). */
export const MAX_MS = 8.64e15;

export const MS_PER_MINUTE = 60_000;
export const MS_PER_HOUR = 3_600_000;

/** Form of the date part read by the ISO scanner. */
export const DateForm = { Year: 1, YearMonth: 2, Calendar: 3, Week: 4, WeekDate: 5, Ordinal: 6 } as const;
export type DateForm = (typeof DateForm)[keyof typeof DateForm];

/** Scratch state of one scan; the fields describe the last value read (its shape feeds format inference). */
export interface Scan {
  pos: number;
  /** Day number (days since 1970-01-01) of the first day the date part names. */
  days: number;
  /** Day number just after the period the date part names. */
  endDays: number;
  year: number;
  dateForm: DateForm;
  /** What the date part names alone: day, month, year, iso-week. */
  unit: UnitName;
  basic: boolean;
  /** Milliseconds into the day, or -1 when there is no time part. */
  timeMs: number;
  /** 0 no time, 1 hours, 2 minutes, 3 seconds. */
  precision: number;
  fracDigits: number;
  /** Char code between date and time (T, t or space); 0 when none. */
  sep: number;
  /** Offset minutes, NaN when none was written. */
  offset: number;
  /** 0 none, 1 Z, 2 ±hh, 3 ±hh:mm or ±hhmm. */
  offsetForm: number;
  leap: boolean;
}

/** A fresh scratch record; parsers make one and reuse it. */
export function newScan(): Scan {
  return {
    pos: 0, days: 0, endDays: 0, year: 0, dateForm: DateForm.Calendar, unit: 'day', basic: false,
    timeMs: -1, precision: 0, fracDigits: 0, sep: 0, offset: NaN, offsetForm: 0, leap: false,
  };
}

/** Resets the time and offset fields before a scan. */
export function resetScan(sc: Scan): void {
  sc.timeMs = -1;
  sc.precision = 0;
  sc.fracDigits = 0;
  sc.sep = 0;
  sc.offset = NaN;
  sc.offsetForm = 0;
  sc.leap = false;
  sc.basic = false;
}

/** Value of the `n` ASCII digits at `i`, or -1 when any of them is not a digit or the text is too short. */
export function readDigits(s: string, i: number, n: number, end: number): number {
  if (i + n > end) return -1;
  let v = 0;
  for (let k = 0; k < n; k++) {
    const c = s.charCodeAt(i + k) - 48;
    if (c < 0 || c > 9) return -1;
    v = v * 10 + c;
  }
  return v;
}

/** Number of consecutive ASCII digits from `i` (stopping at `end`). */
export function countDigits(s: string, i: number, end: number): number {
  let k = i;
  while (k < end) {
    const c = s.charCodeAt(k);
    if (c < 48 || c > 57) break;
    k++;
  }
  return k - i;
}

/** True for ASCII space and tab. */
export function isBlank(c: number): boolean {
  return c === 32 || c === 9;
}

/** Two-digit rendering for messages. */
export function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

/** Four-digit (or signed expanded) year rendering for messages. */
export function yearText(y: number): string {
  if (y >= 0 && y <= 9999) return String(y).padStart(4, '0');
  return (y < 0 ? '-' : '+') + String(Math.abs(y)).padStart(6, '0');
}

/** The reason for a value outside the JavaScript date range. */
export function outOfRange(what: string): string {
  return `out-of-range: ${what} lies outside the dates JavaScript can hold (-271821-04-20 to +275760-09-13)`;
}

/** A plain reason for text that does not match a format; quotes at most 40 characters of it. */
export function notRecognised(s: string, what: string): string {
  const shown = s.length > 40 ? `${s.slice(0, 39)}…` : s;
  return `not-recognised: ${JSON.stringify(shown)} is not ${what}`;
}

/** Month names for messages. */
export const MONTH_NAMES = [
  'January', 'February', 'March', 'April', 'May', 'June',
  'July', 'August', 'September', 'October', 'November', 'December',
] as const;

/** Reason for a day number beyond the month's length, in plain words. */
export function badDay(year: number, month: number, day: number, dim: number): string {
  if (day === 0) return 'invalid-date: day 0 does not exist; days are numbered from 1';
  if (month === 2 && day === 29) return `invalid-date: ${yearText(year)} is not a leap year, so February has 28 days`;
  return `invalid-date: ${MONTH_NAMES[month - 1]} ${yearText(year)} has ${dim} days, not ${day}`;
}

/** Reason for a month number outside 1–12. */
export function badMonth(month: number): string {
  return `invalid-date: month ${pad2(month)} does not exist; months run 01 to 12`;
}
