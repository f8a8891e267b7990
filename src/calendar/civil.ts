// Proleptic Gregorian civil-date arithmetic on day numbers (days since 1970-01-01), without allocation.
// The algorithms are the "days from civil" and "civil from days" of H. Hinnant's chrono-compatible
// date algorithms (public domain), valid for every year JavaScript dates can hold.

export const MS_PER_DAY = 86_400_000;

/** Day number (days since 1970-01-01) of a proleptic Gregorian date; month 1–12. */
export function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468;
}

/** Civil year of a day number. */
export function yearOfDays(days: number): number {
  const z = days + 719_468;
  const era = Math.floor(z / 146_097);
  const doe = z - era * 146_097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const month = mp < 10 ? mp + 3 : mp - 9;
  return yoe + era * 400 + (month <= 2 ? 1 : 0);
}

/** Civil date of a day number, written into `out` as [year, month, day] to avoid allocation. */
export function civilFromDays(days: number, out: number[] = [0, 0, 0]): number[] {
  const z = days + 719_468;
  const era = Math.floor(z / 146_097);
  const doe = z - era * 146_097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  out[0] = yoe + era * 400 + (month <= 2 ? 1 : 0);
  out[1] = month;
  out[2] = day;
  return out;
}

/** ISO weekday of a day number: Monday 1 … Sunday 7 (1970-01-01 was a Thursday). */
export function isoWeekday(days: number): number {
  const w = (((days + 3) % 7) + 7) % 7; // 0 = Monday
  return w + 1;
}

/** True for Gregorian leap years. */
export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

/** Number of days in a month of a year. */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/** Day number of the first day of the week (starting on ISO weekday `weekStart`) that holds `days`. */
export function weekStartOnOrBefore(days: number, weekStart: number): number {
  const back = (isoWeekday(days) - weekStart + 7) % 7;
  return days - back;
}

/** Day number of Monday of ISO week 1 of ISO week-year `year`: week 1 holds January 4 (ISO 8601). */
export function isoWeekYearStart(year: number): number {
  return weekStartOnOrBefore(daysFromCivil(year, 1, 4), 1);
}

/**
 * Day number of Sunday of epidemiological week 1 of `year`: weeks run Sunday–Saturday and week 1 is the first
 * with at least four days in the calendar year, i.e. the week holding January 4 (CDC MMWR week definition).
 */
export function epiWeekYearStart(year: number): number {
  return weekStartOnOrBefore(daysFromCivil(year, 1, 4), 7);
}

/** Number of ISO weeks (52 or 53) in ISO week-year `year`. */
export function isoWeeksInYear(year: number): number {
  return (isoWeekYearStart(year + 1) - isoWeekYearStart(year)) / 7;
}

/** Number of epidemiological weeks (52 or 53) in epi year `year`. */
export function epiWeeksInYear(year: number): number {
  return (epiWeekYearStart(year + 1) - epiWeekYearStart(year)) / 7;
}
