// makeTimeParser for numeric day-month orders under a decided order (issue 2 §3; common practice for the
// readings: 05/04/2021 is 5 April day-first and May 4 month-first).
import { describe, it, expect } from 'vitest';
import { read, code } from './read.js';
import { timeFormat, makeTimeParser, emptyParsedTime } from '../../src/time/index.js';


describe('makeTimeParser(day-month-year / month-day-year / year-month-day)', () => {
  it.each([
    ['day-month-year', '05/04/2021', '2021-04-05'], // day first: 5 April
    ['day-month-year', '05.04.2021', '2021-04-05'], // dotted separator (common practice in much of Europe)
    ['day-month-year', '05-04-2021', '2021-04-05'], // hyphen separator
    ['day-month-year', '5/4/2021', '2021-04-05'], // single-digit fields
    ['day-month-year', '29/02/2024', '2024-02-29'], // 2024 is a leap year (Gregorian rule)
    ['month-day-year', '05/04/2021', '2021-05-04'], // month first: May 4
    ['month-day-year', '12/31/2021', '2021-12-31'],
    ['year-month-day', '2021/04/05', '2021-04-05'],
    ['year-month-day', '2021.04.05', '2021-04-05'],
  ])('%s reads %s as %s', (format, text, date) => {
    const r = read(format, text);
    expect(r).toMatchObject({ kind: 'period', unit: 'day', at: `${date}T00:00:00.000Z` });
  });

  it('reads a time after the date as a local reading, and an offset as an instant', () => {
    expect(read('day-month-year', '05/04/2021 13:30')).toEqual({ kind: 'local', at: '2021-04-05T13:30:00.000Z' });
    expect(read('day-month-year', '05/04/2021 13:30:15.5')).toEqual({ kind: 'local', at: '2021-04-05T13:30:15.500Z' });
    expect(read('month-day-year', '04/05/2021 13:30+02:00')).toEqual({ kind: 'instant', at: '2021-04-05T11:30:00.000Z', offset: 120 });
  });

  it.each([
    ['day-month-year', '31/02/2021', 'invalid-date'], // February 2021 has 28 days
    ['day-month-year', '29/02/2021', 'invalid-date'], // 2021 is not a leap year
    ['day-month-year', '05/13/2021', 'invalid-date'], // month 13 read day-first: no rollover into 2022
    ['month-day-year', '13/05/2021', 'invalid-date'], // month 13 read month-first
    ['day-month-year', '00/04/2021', 'invalid-date'], // day 0
    ['day-month-year', '05/04/2021 24:01', 'invalid-time'], // ISO 8601 §4.2.3: nothing after 24:00
    ['day-month-year', '05/04/21', 'two-digit-year'], // two-digit years need an explicit pivot (issue 2 §3)
    ['day-month-year', '2021/04/05', 'not-recognised'], // a year-first value is not day-first
    ['day-month-year', '05/04-2021', 'not-recognised'], // mixed separators
    ['day-month-year', '05/04/2021x', 'not-recognised'],
    ['day-month-year', '', 'empty'],
  ])('%s refuses %s with %s', (format, text, reason) => {
    expect(code(format, text)).toBe(reason);
  });

  it('reads two-digit years in the pivot window (pivot 1950: 49 → 2049, 50 → 1950)', () => {
    expect(read('day-month-year', '05/04/49', { twoDigitYearPivot: 1950 })).toMatchObject({ at: '2049-04-05T00:00:00.000Z' });
    expect(read('day-month-year', '05/04/50', { twoDigitYearPivot: 1950 })).toMatchObject({ at: '1950-04-05T00:00:00.000Z' });
    expect(read('day-month-year', '05/04/21', { twoDigitYearPivot: 1970 })).toMatchObject({ at: '2021-04-05T00:00:00.000Z' });
  });

  it('keeps to the separator the format names', () => {
    const parse = makeTimeParser(timeFormat('day-month-year', { separator: '.' }));
    const out = emptyParsedTime();
    expect(parse('05.04.2021', out)).toBeNull();
    expect(parse('05/04/2021', out)).toMatch(/^not-recognised: .*"\." between fields/);
  });
});
