// makeTimeParser for English month names (issue 2 §3 notations; month names and abbreviations are common practice).
import { describe, it, expect } from 'vitest';
import { read, code } from './read.js';

describe('makeTimeParser(month-name-*)', () => {
  it.each([
    ['month-name-year', 'Apr 2021', 'month', '2021-04-01', '2021-05-01'],
    ['month-name-year', 'April 2021', 'month', '2021-04-01', '2021-05-01'],
    ['month-name-year', 'SEPT 2021', 'month', '2021-09-01', '2021-10-01'],
    ['month-name-year', 'Dec 2021', 'month', '2021-12-01', '2022-01-01'],
    ['month-name-day-year', 'April 5, 2021', 'day', '2021-04-05', '2021-04-06'],
    ['month-name-day-year', 'Apr 5 2021', 'day', '2021-04-05', '2021-04-06'],
    ['month-name-day-year', 'Feb. 29, 2024', 'day', '2024-02-29', '2024-03-01'],
    ['day-month-name-year', '5 Apr 2021', 'day', '2021-04-05', '2021-04-06'],
    ['day-month-name-year', '05-Apr-2021', 'day', '2021-04-05', '2021-04-06'],
    ['day-month-name-year', '05 april 2021', 'day', '2021-04-05', '2021-04-06'],
  ])('%s reads %s', (format, text, unit, start, end) => {
    expect(read(format, text)).toEqual({ kind: 'period', unit, at: `${start}T00:00:00.000Z`, end: `${end}T00:00:00.000Z` });
  });

  it('reads 05-Apr-21 only with an explicit two-digit-year pivot (issue 2 §3)', () => {
    expect(code('day-month-name-year', '05-Apr-21')).toBe('two-digit-year');
    expect(read('day-month-name-year', '05-Apr-21', { twoDigitYearPivot: 1950 })).toMatchObject({ at: '2021-04-05T00:00:00.000Z' });
    expect(read('day-month-name-year', '05-Apr-99', { twoDigitYearPivot: 1950 })).toMatchObject({ at: '1999-04-05T00:00:00.000Z' });
  });

  it('reads a time after a named-month date', () => {
    expect(read('day-month-name-year', '5 Apr 2021 13:30')).toEqual({ kind: 'local', at: '2021-04-05T13:30:00.000Z' });
  });

  it.each([
    ['month-name-day-year', 'February 29, 2021', 'invalid-date'], // 2021 is not a leap year
    ['day-month-name-year', '31 Apr 2021', 'invalid-date'], // April has 30 days
    ['month-name-year', 'Ap 2021', 'not-recognised'],
    ['month-name-year', 'Aprill 2021', 'not-recognised'],
    ['month-name-year', 'Smarch 2021', 'not-recognised'],
    ['day-month-name-year', '5 Apr-2021', 'not-recognised'],
  ])('%s refuses %s with %s', (format, text, reason) => {
    expect(code(format, text)).toBe(reason);
  });
});
