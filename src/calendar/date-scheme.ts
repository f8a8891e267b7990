// Date-based units (day and longer) as integer keys of local civil dates. Keys count whole units on one
// unbroken scale, so consecutive periods have consecutive keys:
//   day            days since 1970-01-01
//   week, iso-week, epi-week   weeks since the week (of that start day) holding 1970-01-01
//   month          year × 12 + month − 1;  quarter, half, year: that month key divided by 3, 6, 12
//   fiscal-month   months since the fiscal month starting in January of year 0 on the fiscal start day,
//                  less the start month; fiscal-quarter and fiscal-year divide it by 3 and 12, so the
//                  fiscal-year key is the calendar year in which the fiscal year starts.
// Steps group N base keys counted from the origin's base key (default key 0: 1970-01-01 for days, the week
// holding 1970-01-01 for weeks, January of year 0 for months, so month steps that divide 12 align with years).
import { civilFromDays, daysFromCivil, weekStartOnOrBefore } from './civil.js';
import type { FiscalStart, UnitName } from './types.js';

/** How a date-based unit maps local day numbers to base keys (step 1) and back. */
export interface DateScheme {
  /** Base key of the unit period holding local day number `dn`. */
  keyOfDay(dn: number): number;
  /** Local day number of the first date of base key `k`. */
  firstDayOfKey(k: number): number;
}

const scratch = [0, 0, 0];

function floorDiv(a: number, b: number): number {
  return Math.floor(a / b);
}

const dayScheme: DateScheme = {
  keyOfDay: (dn) => dn,
  firstDayOfKey: (k) => k,
};

/** Weeks starting on ISO weekday `weekStart`, counted from the week holding 1970-01-01. */
export function weekScheme(weekStart: number): DateScheme {
  const w0 = weekStartOnOrBefore(0, weekStart);
  return {
    keyOfDay: (dn) => floorDiv(dn - w0, 7),
    firstDayOfKey: (k) => w0 + 7 * k,
  };
}

/**
 * Month-grid units: periods of `size` months starting on day `day` of month `month` (calendar months:
 * month 1, day 1). The month key of a date is the month whose `day`-th it follows.
 */
export function monthScheme(size: number, month: number, day: number): DateScheme {
  return {
    keyOfDay(dn) {
      civilFromDays(dn, scratch);
      const mk = scratch[0]! * 12 + (scratch[1]! - 1) - (scratch[2]! < day ? 1 : 0) - (month - 1);
      return floorDiv(mk, size);
    },
    firstDayOfKey(k) {
      const mk = k * size + (month - 1);
      const y = floorDiv(mk, 12);
      return daysFromCivil(y, mk - y * 12 + 1, day);
    },
  };
}

/** The scheme of a date-based unit, or null for sub-day units. */
export function dateSchemeFor(unit: UnitName, weekStart: number, fiscal: FiscalStart): DateScheme | null {
  switch (unit) {
    case 'day': return dayScheme;
    case 'week': return weekScheme(weekStart);
    case 'iso-week': return weekScheme(1);
    case 'epi-week': return weekScheme(7);
    case 'month': return monthScheme(1, 1, 1);
    case 'quarter': return monthScheme(3, 1, 1);
    case 'half': return monthScheme(6, 1, 1);
    case 'year': return monthScheme(12, 1, 1);
    case 'fiscal-month': return monthScheme(1, fiscal.month, fiscal.day);
    case 'fiscal-quarter': return monthScheme(3, fiscal.month, fiscal.day);
    case 'fiscal-year': return monthScheme(12, fiscal.month, fiscal.day);
    default: return null;
  }
}

/**
 * Week-numbering year and week of a week starting on day number `start`: week 1 is the week holding
 * January 4, i.e. the first week with at least four days in the year. This is ISO 8601's rule for
 * Monday weeks and the CDC MMWR rule for Sunday weeks; quern applies it to weeks of any start day.
 */
export function weekNumberOf(start: number, weekStart: number): { year: number; week: number } {
  civilFromDays(start + 3, scratch);
  const year = scratch[0]!;
  const week1 = weekStartOnOrBefore(daysFromCivil(year, 1, 4), weekStart);
  return { year, week: (start - week1) / 7 + 1 };
}

/** Day number of the start of week `week` of week-year `year` under the week-1-holds-January-4 rule. */
export function weekStartDay(year: number, week: number, weekStart: number): number {
  return weekStartOnOrBefore(daysFromCivil(year, 1, 4), weekStart) + 7 * (week - 1);
}

/** Number of weeks (52 or 53) in week-year `year` for weeks starting on `weekStart`. */
export function weeksInWeekYear(year: number, weekStart: number): number {
  return (weekStartDay(year + 1, 1, weekStart) - weekStartDay(year, 1, weekStart)) / 7;
}
