// Which periods a series is expected to have: every period of the unit between its first and last, less
// the days a calendar skips on purpose — weekends (`--weekdays`, Monday–Friday) and listed dates
// (`--skip-dates`, such as holidays).
import { daysFromCivil, daysInMonth, isoWeekday, MS_PER_DAY } from '../calendar/civil.js';
import type { Calendar } from '../calendar/types.js';
import { QuernError } from '../errors.js';

/** Days a calendar skips on purpose. */
export interface SkipRules {
  /** Only Monday–Friday are expected. */
  weekdays: boolean;
  /** Day numbers (days since 1970-01-01, local dates) that are not expected. */
  skipDays: ReadonlySet<number>;
}

/** No day skipped. */
export const NO_SKIPS: SkipRules = { weekdays: false, skipDays: new Set() };

const DAY_BASED = new Set(['millisecond', 'second', 'minute', 'hour', 'day']);

/**
 * A test of whether period `k` is expected: true unless its local date (of its first instant) is a
 * weekend under `weekdays` or a listed date. Throws QuernError 'E_USAGE' when days are skipped with a
 * unit longer than a day (a week or month cannot lose a day and stay a period).
 */
export function expectedTest(cal: Calendar, toWall: (ms: number) => number, rules: SkipRules): (k: number) => boolean {
  if (!rules.weekdays && rules.skipDays.size === 0) return () => true;
  if (!DAY_BASED.has(cal.unit) || (cal.unit === 'day' && cal.step !== 1)) {
    throw new QuernError('E_USAGE', `--weekdays and --skip-dates remove days, which ${cal.unit} periods cannot lose`,
      'use --unit day or a shorter unit (hour, 15-minute slots with --step 15 --unit minute)');
  }
  return (k: number): boolean => {
    const day = Math.floor(toWall(cal.startOf(k)) / MS_PER_DAY);
    if (rules.weekdays && isoWeekday(day) > 5) return false;
    return !rules.skipDays.has(day);
  };
}

/**
 * Reads a list of dates (one `YYYY-MM-DD` a line; the first comma-, semicolon- or tab-separated field is
 * read, so a CSV of holidays with names works; a header line, blank lines and `#` comments are skipped).
 * Returns their day numbers. Throws QuernError 'E_VALUE' naming the line of a value that is not a date.
 */
export function parseSkipDates(text: string, file = 'skip-dates'): Set<number> {
  const days = new Set<number>();
  const lines = text.split(/\r\n|\n|\r/);
  let seenData = false;
  for (let i = 0; i < lines.length; i++) {
    const field = lines[i]!.split(/[,;\t]/)[0]!.trim().replace(/^"(.*)"$/, '$1');
    if (field === '' || field.startsWith('#')) continue;
    const day = isoDay(field);
    if (day === null) {
      if (!seenData && /[A-Za-z]/.test(field) && !/^\d/.test(field)) {
        seenData = true; // a header line such as "date,name"
        continue;
      }
      throw new QuernError('E_VALUE', `${file}:${i + 1}: ${JSON.stringify(field)} is not a date (YYYY-MM-DD)`, 'list one ISO 8601 date a line, e.g. 2024-12-25');
    }
    seenData = true;
    days.add(day);
  }
  return days;
}

/** Day number of an ISO 8601 calendar date `YYYY-MM-DD`, or null. */
export function isoDay(text: string): number | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return null;
  const y = Number(m[1]);
  const mo = Number(m[2]);
  const d = Number(m[3]);
  if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth(y, mo)) return null;
  return daysFromCivil(y, mo, d);
}
