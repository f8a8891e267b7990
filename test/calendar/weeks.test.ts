// ISO 8601 and epidemiological (CDC MMWR) weeks against published tables (REFERENCES.md §1, §2).
import { describe, expect, it } from 'vitest';
import { makeCalendar } from '../../src/calendar/index.js';

const at = (date: string) => Date.parse(`${date}T12:00:00Z`);
const day = (date: string) => Date.parse(`${date}T00:00:00Z`);

describe('makeCalendar({ unit: "iso-week" })', () => {
  const iso = makeCalendar({ unit: 'iso-week' });
  it.each([
    ['2004-12-31', '2004-W53'], // PostgreSQL docs / Computed (REFERENCES.md §1)
    ['2005-01-01', '2004-W53'], // PostgreSQL docs: "2005-01-01 is part of the 53rd week of 2004"
    ['2005-01-02', '2004-W53'], // Computed (REFERENCES.md §1)
    ['2006-01-01', '2005-W52'], // PostgreSQL docs
    ['2008-12-28', '2008-W52'], // Computed (REFERENCES.md §1)
    ['2008-12-29', '2009-W01'], // Computed; vendor function doc (REFERENCES.md §1)
    ['2009-12-31', '2009-W53'], // Computed (REFERENCES.md §1)
    ['2010-01-01', '2009-W53'], // Computed (REFERENCES.md §1)
    ['2010-01-03', '2009-W53'], // vendor doc: 2010-01-03 → (2009, 53, Sunday)
    ['2015-12-31', '2015-W53'], // Computed (REFERENCES.md §1)
    ['2016-01-03', '2015-W53'], // Computed (REFERENCES.md §1)
    ['2020-12-31', '2020-W53'], // Computed (REFERENCES.md §1)
    ['2021-01-03', '2020-W53'], // Computed (REFERENCES.md §1)
    ['2000-01-01', '1999-W52'], // Computed (REFERENCES.md §1)
    ['2000-01-03', '2000-W01'], // Computed (REFERENCES.md §1)
    ['2012-01-01', '2011-W52'], // Computed (REFERENCES.md §1)
    ['2012-01-02', '2012-W01'], // Computed (REFERENCES.md §1)
    ['2012-12-31', '2013-W01'], // PostgreSQL docs; Computed
    ['2024-12-30', '2025-W01'], // Computed; PostgreSQL list thread (REFERENCES.md §1)
    ['2024-12-31', '2025-W01'], // Computed (REFERENCES.md §1)
    ['2025-12-29', '2026-W01'], // Computed (REFERENCES.md §1)
    ['2026-12-31', '2026-W53'], // Computed (REFERENCES.md §1)
    ['2027-01-03', '2026-W53'], // Computed (REFERENCES.md §1)
  ])('label(%s) is %s', (date, label) => {
    expect(iso.label(at(date))).toBe(label);
    expect(iso.parseLabel(label).start).toBe(iso.floor(at(date)));
  });

  it('gives 53 weeks to 1998, 2004, 2009, 2015, 2020, 2026, 2032, 2037, 2043 only (REFERENCES.md §1, 1995–2045)', () => {
    const long: number[] = [];
    for (let y = 1995; y <= 2045; y++) if (iso.tryParseLabel(`${y}-W53`) !== null) long.push(y);
    expect(long).toEqual([1998, 2004, 2009, 2015, 2020, 2026, 2032, 2037, 2043]);
  });

  it('counts 71 53-week years per 400-year cycle (REFERENCES.md §1, Computed 2000–2399)', () => {
    let n = 0;
    for (let y = 2000; y < 2400; y++) if (iso.tryParseLabel(`${y}-W53`) !== null) n++;
    expect(n).toBe(71);
  });

  it('refuses 2021-W53 with E_LABEL: 2021 has 52 ISO weeks (REFERENCES.md §1)', () => {
    expect(() => iso.parseLabel('2021-W53')).toThrowError(expect.objectContaining({ code: 'E_LABEL', message: 'bad iso-week label "2021-W53": 2021 has 52 ISO weeks' }));
  });

  it('parts(2005-01-01) are year 2004, week 53 (PostgreSQL docs)', () => {
    expect(iso.parts(at('2005-01-01'))).toEqual({ year: 2004, week: 53 });
  });
});

describe('makeCalendar({ unit: "epi-week" })', () => {
  const epi = makeCalendar({ unit: 'epi-week' });
  // Week-1 start dates and year lengths (REFERENCES.md §2, Computed with Temporal from the CDC rule)
  it.each([
    [2014, '2013-12-29', 53], [2015, '2015-01-04', 52], [2016, '2016-01-03', 52], [2017, '2017-01-01', 52],
    [2018, '2017-12-31', 52], [2019, '2018-12-30', 52], [2020, '2019-12-29', 53], [2021, '2021-01-03', 52],
    [2022, '2022-01-02', 52], [2023, '2023-01-01', 52], [2024, '2023-12-31', 52], [2025, '2024-12-29', 53],
    [2026, '2026-01-04', 52], [2027, '2027-01-03', 52], [2028, '2028-01-02', 52], [2029, '2028-12-31', 52],
    [2030, '2029-12-30', 52], [2031, '2030-12-29', 53],
  ])('week 1 of %d starts %s; the year has %d weeks', (year, start, weeks) => {
    const w1 = epi.parseLabel(`${year}-EW01`);
    expect(w1.start).toBe(day(start));
    expect(w1.end - w1.start).toBe(7 * 86_400_000);
    expect(epi.label(day(start))).toBe(`${year}-EW01`);
    const last = epi.parseLabel(`${year}-EW${weeks}`);
    expect(epi.next(last.start)).toBe(epi.parseLabel(`${year + 1}-EW01`).start);
    expect(epi.tryParseLabel(`${year}-EW53`) !== null).toBe(weeks === 53);
  });

  // Week-ending (Saturday) dates published by CDC (REFERENCES.md §2)
  it.each([
    ['2014-01-04', '2014-EW01'], // MMWR NNDSS tables: "week ending January 4, 2014 (1st week)"
    ['2015-01-03', '2014-EW53'], // MMWR NNDSS tables: "week ending January 3, 2015 (53rd Week)"
    ['2015-01-10', '2015-EW01'], // MMWR NNDSS tables: "week ending January 10, 2015 (1st Week)"
    ['2015-03-21', '2015-EW11'], // MMWR NNDSS tables
    ['2015-04-25', '2015-EW16'], // MMWR NNDSS tables
    ['2015-06-20', '2015-EW24'], // MMWR NNDSS tables
    ['2015-10-31', '2015-EW43'], // MMWR NNDSS tables
    ['2014-10-25', '2014-EW43'], // MMWR NNDSS tables
    ['2019-09-14', '2019-EW37'], // CDC WONDER NNDSS
    ['2021-01-02', '2020-EW53'], // CDC COVIDView: "Week 53, ending January 2, 2021"
    ['2020-12-26', '2020-EW52'], // CDC COVIDView: "Week 52, ending December 26, 2020"
    ['2021-01-09', '2021-EW01'], // CDC COVIDView: "Week #1, ending January 9, 2021"
  ])('the week ending %s is %s', (saturday, label) => {
    expect(epi.label(at(saturday))).toBe(label);
    const p = epi.parseLabel(label);
    expect(p.end).toBe(day(saturday) + 86_400_000); // exclusive end: the Sunday after
  });

  it('2025-01-01 is in 2025-EW01 (REFERENCES.md §2: week 1 of 2025 is 2024-12-29 – 2025-01-04)', () => {
    expect(epi.label(at('2025-01-01'))).toBe('2025-EW01');
  });

  it('does not follow the "ISO week of d+1" shortcut in 2015 and 2026 (REFERENCES.md §2 pitfall)', () => {
    expect(epi.label(at('2014-12-28'))).toBe('2014-EW53');
    expect(epi.label(at('2026-01-03'))).toBe('2025-EW53');
  });

  it('never reads an ISO week label as an epidemiological week, nor the reverse', () => {
    expect(epi.tryParseLabel('2024-W07')).toBeNull();
    expect(makeCalendar({ unit: 'iso-week' }).tryParseLabel('2024-EW07')).toBeNull();
  });
});

describe('makeCalendar({ unit: "week", weekStart })', () => {
  it('labels a Sunday week as start/P1W and numbers it by the January-4 rule', () => {
    const sun = makeCalendar({ unit: 'week', weekStart: 7 });
    // 2024-03-10 is a Sunday (from memory); Sunday weeks of 2024 count from 2023-12-31 as MMWR week 1
    // does (REFERENCES.md §2), so it starts week 11: derived, 70 days after 2023-12-31.
    expect(sun.label(at('2024-03-13'))).toBe('2024-03-10/P1W');
    expect(sun.parts(at('2024-03-13'))).toEqual({ year: 2024, week: 11 });
    expect(sun.tryParseLabel('2024-03-11/P1W')).toBeNull(); // a Monday does not start a Sunday week
  });

  it.each([1, 2, 3, 4, 5, 6, 7])('weeks starting on ISO weekday %d start on that weekday', (ws) => {
    const cal = makeCalendar({ unit: 'week', weekStart: ws });
    for (let d = 0; d < 14; d++) {
      const start = cal.floor(day('2024-01-01') + d * 86_400_000 + 3_600_000);
      expect(new Date(start).getUTCDay() || 7).toBe(ws);
    }
  });
});
