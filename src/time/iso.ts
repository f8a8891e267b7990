// The allocation-free ISO 8601 / RFC 3339 path: one value of text into a reusable ParsedTime, by char-code
// arithmetic (no regular expression, no Date, no luxon). A date names a period (day, week, month, year);
// a date-time with Z or an offset is an instant; a date-time without one is a local wall-clock reading.
import { MS_PER_DAY } from '../calendar/civil.js';
import type { ParsedTime } from './types.js';
import { DateForm, type Scan, MAX_MS, MS_PER_MINUTE, isBlank, outOfRange, resetScan, yearText, notRecognised } from './scan.js';
import { scanIsoDate } from './iso-date.js';
import { scanIsoTime, checkLeapSecond } from './iso-time.js';
import { fastIso } from './iso-fast.js';

/** Index of the first non-blank char at or after `i`. */
export function skipBlanks(s: string, i: number, end: number): number {
  while (i < end && isBlank(s.charCodeAt(i))) i++;
  return i;
}

/** Index just after the last non-blank char before `end`. */
export function trimEnd(s: string, start: number, end: number): number {
  while (end > start && isBlank(s.charCodeAt(end - 1))) end--;
  return end;
}

/**
 * Reads the ISO 8601 date or date-time in s[start, end) into `sc` (no output written). A time may follow
 * a calendar, week or ordinal date after T, t or a space (RFC 3339 §5.6 note). Returns null or a reason.
 */
export function scanIso(s: string, start: number, end: number, sc: Scan): string | null {
  resetScan(sc);
  const r = scanIsoDate(s, start, end, sc);
  if (r !== null) return r;
  if (sc.pos < end) {
    const c = s.charCodeAt(sc.pos);
    if (c !== 84 && c !== 116 && c !== 32) return notRecognised(s, 'an ISO 8601 date or date-time');
    const f = sc.dateForm;
    if (f !== DateForm.Calendar && f !== DateForm.WeekDate && f !== DateForm.Ordinal) {
      return notRecognised(s, 'an ISO 8601 date-time (a time follows a full date, not a year, month or week)');
    }
    sc.sep = c;
    const t = scanIsoTime(s, sc.pos + 1, end, sc);
    if (t !== null) return t;
    if (sc.pos !== end) return notRecognised(s, 'an ISO 8601 date-time');
    if (sc.leap) return checkLeapSecond(sc.timeMs, sc.offset);
  }
  return null;
}

/** Writes what `sc` holds into `out` (period, local or instant), checking the JavaScript date range. */
export function fillFromScan(sc: Scan, out: ParsedTime): string | null {
  out.leapSecond = sc.leap;
  if (sc.timeMs < 0) {
    const ms = sc.days * MS_PER_DAY;
    const endMs = sc.endDays * MS_PER_DAY;
    if (ms < -MAX_MS || endMs > MAX_MS) return outOfRange(`this date of year ${yearText(sc.year)}`);
    out.kind = 'period';
    out.ms = ms;
    out.endMs = endMs;
    out.unit = sc.unit;
    out.offset = NaN;
    return null;
  }
  const wall = sc.days * MS_PER_DAY + sc.timeMs;
  out.unit = null;
  out.endMs = NaN;
  if (sc.offset === sc.offset) {
    const ms = wall - sc.offset * MS_PER_MINUTE;
    if (ms < -MAX_MS || ms > MAX_MS) return outOfRange(`this date of year ${yearText(sc.year)}`);
    out.kind = 'instant';
    out.ms = ms;
    out.offset = sc.offset;
    return null;
  }
  if (wall < -MAX_MS || wall > MAX_MS) return outOfRange(`this date of year ${yearText(sc.year)}`);
  out.kind = 'local';
  out.ms = wall;
  out.offset = NaN;
  return null;
}

/**
 * Parses one ISO 8601 date or date-time (surrounding spaces ignored) into `out`, reusing `sc`.
 * Returns null on success, else a reason code and plain explanation ('invalid-date: …').
 */
export function parseIsoInto(s: string, out: ParsedTime, sc: Scan): string | null {
  if (fastIso(s, out)) return null;
  const start = skipBlanks(s, 0, s.length);
  const end = trimEnd(s, start, s.length);
  if (start === end) return 'empty: the value is empty';
  const r = scanIso(s, start, end, sc);
  if (r !== null) return r;
  return fillFromScan(sc, out);
}
