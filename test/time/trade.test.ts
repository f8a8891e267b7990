// makeTimeParser for trade notations: quarters and halves (common practice: Q1 = January–March, H1 =
// January–June), epidemiological weeks (REFERENCES §2, CDC MMWR weeks) and fiscal years (REFERENCES §6).
import { describe, it, expect } from 'vitest';
import { read, code } from './read.js';

const period = (unit: string, start: string, end: string) => ({ kind: 'period', unit, at: `${start}T00:00:00.000Z`, end: `${end}T00:00:00.000Z` });

describe('makeTimeParser(quarter / half)', () => {
  it.each([
    ['2021-Q2', '2021-04-01', '2021-07-01'], // common practice: Q2 = April–June
    ['2021Q2', '2021-04-01', '2021-07-01'], // issue 2 notation
    ['Q2 2021', '2021-04-01', '2021-07-01'], // issue 2 notation
    ['2021 q4', '2021-10-01', '2022-01-01'], // common practice: Q4 = October–December
    ['2021-Q1', '2021-01-01', '2021-04-01'],
  ])('quarter reads %s', (text, start, end) => {
    expect(read('quarter', text)).toEqual(period('quarter', start, end));
  });

  it.each([
    ['2021-H1', '2021-01-01', '2021-07-01'], // common practice: H1 = January–June
    ['2021H2', '2021-07-01', '2022-01-01'],
    ['H2 2021', '2021-07-01', '2022-01-01'],
  ])('half reads %s', (text, start, end) => {
    expect(read('half', text)).toEqual(period('half', start, end));
  });

  it.each([
    ['quarter', '2021-Q5', 'invalid-quarter'], ['quarter', '2021-Q0', 'invalid-quarter'],
    ['half', '2021-H3', 'invalid-half'], ['quarter', '2021-Q12', 'not-recognised'], ['quarter', 'Q2', 'not-recognised'],
  ])('%s refuses %s with %s', (format, text, reason) => {
    expect(code(format, text)).toBe(reason);
  });
});

describe('makeTimeParser(epi-week) reads YYYY-EWww (REFERENCES §2)', () => {
  // Week-1 start dates of REFERENCES §2 (Computed with Temporal from the CDC rule).
  it.each([
    ['2014-EW01', '2013-12-29'], ['2015-EW01', '2015-01-04'], ['2016-EW01', '2016-01-03'], ['2017-EW01', '2017-01-01'],
    ['2018-EW01', '2017-12-31'], ['2019-EW01', '2018-12-30'], ['2020-EW01', '2019-12-29'], ['2021-EW01', '2021-01-03'],
    ['2022-EW01', '2022-01-02'], ['2023-EW01', '2023-01-01'], ['2024-EW01', '2023-12-31'], ['2025-EW01', '2024-12-29'],
    ['2026-EW01', '2026-01-04'], ['2029-EW01', '2028-12-31'], ['2030-EW01', '2029-12-30'],
  ])('%s starts on Sunday %s', (text, start) => {
    const end = new Date(Date.parse(`${start}T00:00:00Z`) + 7 * 864e5).toISOString().slice(0, 10);
    expect(read('epi-week', text)).toEqual(period('epi-week', start, end));
  });

  // Weeks published by CDC (REFERENCES §2): the week ending on the Saturday named.
  it.each([
    ['2014-EW01', '2014-01-04'], // MMWR NNDSS tables: "week ending January 4, 2014 (1st week)"
    ['2014-EW53', '2015-01-03'], // MMWR NNDSS tables: "week ending January 3, 2015 (53rd Week)"
    ['2015-EW01', '2015-01-10'], // MMWR NNDSS tables
    ['2015-EW11', '2015-03-21'], ['2015-EW16', '2015-04-25'], ['2015-EW24', '2015-06-20'], ['2015-EW43', '2015-10-31'], // MMWR NNDSS tables
    ['2014-EW43', '2014-10-25'], // MMWR NNDSS tables
    ['2019-EW37', '2019-09-14'], // CDC WONDER NNDSS
    ['2020-EW52', '2020-12-26'], ['2020-EW53', '2021-01-02'], ['2021-EW01', '2021-01-09'], // CDC COVIDView
  ])('%s ends on Saturday %s', (text, saturday) => {
    const r = read('epi-week', text);
    const endExclusive = new Date(Date.parse(`${saturday}T00:00:00Z`) + 864e5).toISOString();
    expect(r).toMatchObject({ kind: 'period', unit: 'epi-week', end: endExclusive });
  });

  it('accepts week 53 only in 53-week epidemiological years (REFERENCES §2: 2014, 2020, 2025)', () => {
    for (let y = 2014; y <= 2030; y++) {
      expect(code('epi-week', `${y}-EW53`)).toBe([2014, 2020, 2025].includes(y) ? 'ok' : 'invalid-week');
    }
  });

  it.each([['2024-W07'], ['2024-EW7'], ['2024-EW00'], ['2024EW07']])('refuses %s', (text) => {
    expect(code('epi-week', text)).not.toBe('ok');
  });
});

describe('makeTimeParser(fiscal-year) reads FY labels through the calendar engine (REFERENCES §6)', () => {
  it('reads FY2024 as 2023-10-01..2024-09-30 by default (31 U.S.C. §1102; named by the year it ends)', () => {
    expect(read('fiscal-year', 'FY2024')).toEqual(period('fiscal-year', '2023-10-01', '2024-10-01'));
    expect(read('fiscal-year', 'FY2006')).toMatchObject({ at: '2005-10-01T00:00:00.000Z' }); // US Code glossary: "FY2006 begins October 1, 2005"
  });

  it('reads other conventions given as options', () => {
    // REFERENCES §6, India: "FY 2024-25" = 2024-04-01..2025-03-31, here named by its start year.
    expect(read('fiscal-year', 'FY2024', { fiscalStart: { month: 4, day: 1 }, fiscalLabel: 'start' })).toEqual(period('fiscal-year', '2024-04-01', '2025-04-01'));
    // REFERENCES §6, UK tax year: "Tax year 2007-08" starts 6 April 2007 (Income Tax Act 2007 s.4).
    expect(read('fiscal-year', 'FY2007', { fiscalStart: { month: 4, day: 6 }, fiscalLabel: 'start' })).toEqual(period('fiscal-year', '2007-04-06', '2008-04-06'));
  });

  it('refuses what is not a fiscal-year label', () => {
    expect(code('fiscal-year', '2024')).toBe('not-recognised');
    expect(code('fiscal-year', 'FY24')).toBe('not-recognised');
  });
});
