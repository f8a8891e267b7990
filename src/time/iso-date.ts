// The date part of ISO 8601 (ISO 8601-1:2019 §5.2): calendar dates, week dates, ordinal dates, year-month
// and year, in extended (2021-04-05) and basic (20210405) notation, with ±YYYYYY expanded years.
// Read by char codes into a reusable Scan; no allocation on success.
import { daysFromCivil, daysInMonth, isLeapYear, isoWeekYearStart, isoWeeksInYear } from '../calendar/civil.js';
import { DateForm, type Scan, readDigits, countDigits, badDay, badMonth, yearText, notRecognised } from './scan.js';

const WHAT = 'an ISO 8601 date';

/** Reads the year at `i` (YYYY, or ±YYYYYY expanded as RFC 3339/ISO 8601 §4.1.2.4 allow); sets sc.year and sc.pos. */
function scanYear(s: string, i: number, end: number, sc: Scan): string | null {
  const c = s.charCodeAt(i);
  if (c === 43 || c === 45 || c === 0x2212) {
    const y = readDigits(s, i + 1, 6, end);
    if (y < 0) return notRecognised(s, `${WHAT} (an expanded year is a sign and six digits)`);
    if (y === 0 && c !== 43) return 'invalid-date: year -000000 is not allowed; write year zero as 0000 or +000000';
    sc.year = c === 43 ? y : -y;
    sc.pos = i + 7;
    return null;
  }
  const y = readDigits(s, i, 4, end);
  if (y < 0) return notRecognised(s, WHAT);
  const n = countDigits(s, i, end);
  if (n > 4 && n < 9 && s.charCodeAt(i + n) === 45) {
    return `not-recognised: ${JSON.stringify(s.slice(i, i + n))} is a year of ${n} digits; ISO 8601 writes years beyond 9999 with a sign and six digits, as +${s.slice(i, i + n).padStart(6, '0')}`;
  }
  sc.year = y;
  sc.pos = i + 4;
  return null;
}

function setDay(sc: Scan, days: number, form: DateForm): null {
  sc.days = days;
  sc.endDays = days + 1;
  sc.dateForm = form;
  sc.unit = 'day';
  return null;
}

function calendarDate(sc: Scan, month: number, day: number): string | null {
  if (month < 1 || month > 12) return badMonth(month);
  const dim = daysInMonth(sc.year, month);
  if (day < 1 || day > dim) return badDay(sc.year, month, day, dim);
  return setDay(sc, daysFromCivil(sc.year, month, day), DateForm.Calendar);
}

function yearMonth(sc: Scan, month: number): string | null {
  if (month < 1 || month > 12) return badMonth(month);
  sc.days = daysFromCivil(sc.year, month, 1);
  sc.endDays = month === 12 ? daysFromCivil(sc.year + 1, 1, 1) : daysFromCivil(sc.year, month + 1, 1);
  sc.dateForm = DateForm.YearMonth;
  sc.unit = 'month';
  return null;
}

function ordinalDate(sc: Scan, ordinal: number): string | null {
  const len = isLeapYear(sc.year) ? 366 : 365;
  if (ordinal < 1 || ordinal > len) {
    return `invalid-date: day ${String(ordinal).padStart(3, '0')} of ${yearText(sc.year)} does not exist; it has ${len} days`;
  }
  return setDay(sc, daysFromCivil(sc.year, 1, 1) + ordinal - 1, DateForm.Ordinal);
}

/** Week date: weeks 01–52/53 of the ISO week-year (week 1 holds January 4), weekday 1 = Monday … 7 = Sunday. */
function weekDate(sc: Scan, week: number, weekday: number): string | null {
  const weeks = isoWeeksInYear(sc.year);
  if (week < 1 || week > weeks) {
    return `invalid-week: ${yearText(sc.year)} has ${weeks} ISO weeks, so week ${String(week).padStart(2, '0')} does not exist`;
  }
  const monday = isoWeekYearStart(sc.year) + (week - 1) * 7;
  if (weekday === -1) {
    sc.days = monday;
    sc.endDays = monday + 7;
    sc.dateForm = DateForm.Week;
    sc.unit = 'iso-week';
    return null;
  }
  if (weekday < 1 || weekday > 7) return `invalid-week: weekday ${weekday} does not exist; ISO weekdays run 1 (Monday) to 7 (Sunday)`;
  return setDay(sc, monday + weekday - 1, DateForm.WeekDate);
}

function yearOnly(sc: Scan): null {
  sc.days = daysFromCivil(sc.year, 1, 1);
  sc.endDays = daysFromCivil(sc.year + 1, 1, 1);
  sc.dateForm = DateForm.Year;
  sc.unit = 'year';
  return null;
}

/** True when the char at `i` ends the date part (end of text, T/t or space before a time, or '/' of an interval). */
function dateEnds(s: string, i: number, end: number): boolean {
  if (i >= end) return true;
  const c = s.charCodeAt(i);
  return c === 84 || c === 116 || c === 32;
}

function extendedWeek(s: string, i: number, end: number, sc: Scan): string | null {
  const week = readDigits(s, i, 2, end);
  if (week < 0) return notRecognised(s, `${WHAT} (a week is W and two digits)`);
  sc.pos = i + 2;
  if (sc.pos < end && s.charCodeAt(sc.pos) === 45) {
    const d = readDigits(s, sc.pos + 1, 1, end);
    if (d < 0) return notRecognised(s, WHAT);
    sc.pos += 2;
    return weekDate(sc, week, d);
  }
  return weekDate(sc, week, -1);
}

function extendedDate(s: string, i: number, end: number, sc: Scan): string | null {
  if (s.charCodeAt(i) === 87) return extendedWeek(s, i + 1, end, sc);
  const n = countDigits(s, i, end);
  if (n === 3) {
    sc.pos = i + 3;
    return ordinalDate(sc, readDigits(s, i, 3, end));
  }
  if (n !== 2) return notRecognised(s, WHAT);
  const month = readDigits(s, i, 2, end);
  sc.pos = i + 2;
  if (sc.pos < end && s.charCodeAt(sc.pos) === 45) {
    if (countDigits(s, sc.pos + 1, end) !== 2) return notRecognised(s, WHAT);
    const day = readDigits(s, sc.pos + 1, 2, end);
    sc.pos += 3;
    return calendarDate(sc, month, day);
  }
  return yearMonth(sc, month);
}

function basicDate(s: string, i: number, end: number, sc: Scan): string | null {
  sc.basic = true;
  if (s.charCodeAt(i) === 87) {
    const week = readDigits(s, i + 1, 2, end);
    if (week < 0) return notRecognised(s, WHAT);
    sc.pos = i + 3;
    if (sc.pos < end && countDigits(s, sc.pos, end) === 1) {
      const d = s.charCodeAt(sc.pos) - 48;
      sc.pos += 1;
      return weekDate(sc, week, d);
    }
    return weekDate(sc, week, -1);
  }
  const n = countDigits(s, i, end);
  if (n === 4) {
    sc.pos = i + 4;
    return calendarDate(sc, readDigits(s, i, 2, end), readDigits(s, i + 2, 2, end));
  }
  if (n === 3) {
    sc.pos = i + 3;
    return ordinalDate(sc, readDigits(s, i, 3, end));
  }
  return notRecognised(s, `${WHAT} (basic notation is YYYYMMDD, YYYYDDD or YYYYWwwD; YYYYMM is not allowed)`);
}

/**
 * Reads an ISO 8601 date at `i`..`end` into `sc` (days, endDays, unit, dateForm, basic, pos).
 * Returns null on success or a reason ('invalid-date: …', 'invalid-week: …', 'not-recognised: …').
 */
export function scanIsoDate(s: string, i: number, end: number, sc: Scan): string | null {
  const r = scanYear(s, i, end, sc);
  if (r !== null) return r;
  const p = sc.pos;
  sc.basic = false;
  if (dateEnds(s, p, end)) return yearOnly(sc);
  const c = s.charCodeAt(p);
  if (c === 45) return extendedDate(s, p + 1, end, sc);
  if (c === 87 || (c >= 48 && c <= 57)) return basicDate(s, p, end, sc);
  return notRecognised(s, WHAT);
}
