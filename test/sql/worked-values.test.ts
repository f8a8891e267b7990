// periodSql in DuckDB and PostgreSQL against published values: the ISO and epidemiological weeks 53 and the
// local days that broke other tools (a skipped midnight, a repeated midnight, southern-hemisphere daylight
// saving, a +05:45 zone), and fiscal years named as their statutes name them. Sources beside each row
// (from the shared REFERENCES.md, as cited there). Expected values are written out, never computed by quern.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CalendarOptions } from '../../src/calendar/index.js';
import { periodSql } from '../../src/sql/period.js';
import { loadEvents, openEngines, runExpressions, type Engines } from './engines.js';

let engines: Engines;
beforeAll(async () => { engines = await openEngines(); }, 120_000);
afterAll(async () => { await engines?.close(); });

const H = 3_600_000;

async function periodIn(which: 'duck' | 'pg', options: CalendarOptions, instant: string) {
  await loadEvents(engines, 'one_row', [Date.parse(instant)]);
  const p = periodSql({ ...options, column: 'ts', dialect: which === 'duck' ? 'duckdb' : 'postgres' });
  const [row] = await runExpressions(engines, which, `SELECT ts, ${p.label}, ${p.start}, ${p.end} FROM one_row`);
  return row!;
}

describe.each(['duck', 'pg'] as const)('periodSql labels in %s', (which) => {
  it.each([
    // [unit, instant (UTC noon of the date), expected label, source]
    ['iso-week', '2005-01-01T12:00:00Z', '2004-W53'], // PostgreSQL docs: "2005-01-01 is part of the 53rd week of 2004"
    ['iso-week', '2006-01-01T12:00:00Z', '2005-W52'], // PostgreSQL docs (2006-01-01 = 2005-W52-7)
    ['iso-week', '2012-12-31T12:00:00Z', '2013-W01'], // PostgreSQL docs (2012-12-31 = 2013-W01-1)
    ['iso-week', '2020-12-31T12:00:00Z', '2020-W53'], // REFERENCES §1, Computed with Temporal
    ['iso-week', '2021-01-03T12:00:00Z', '2020-W53'], // REFERENCES §1, Computed with Temporal
    ['iso-week', '2024-12-30T12:00:00Z', '2025-W01'], // REFERENCES §1, Computed; PostgreSQL list thread
    ['iso-week', '2026-12-31T12:00:00Z', '2026-W53'], // REFERENCES §1, Computed with Temporal
    ['epi-week', '2014-01-04T12:00:00Z', '2014-EW01'], // CDC MMWR NNDSS tables: "week ending January 4, 2014 (1st week)"
    ['epi-week', '2015-01-03T12:00:00Z', '2014-EW53'], // CDC MMWR NNDSS tables: "week ending January 3, 2015 (53rd Week)"
    ['epi-week', '2015-01-10T12:00:00Z', '2015-EW01'], // CDC MMWR NNDSS tables: "week ending January 10, 2015 (1st Week)"
    ['epi-week', '2015-03-21T12:00:00Z', '2015-EW11'], // CDC MMWR NNDSS tables: week ending 2015-03-21 = week 11
    ['epi-week', '2015-10-31T12:00:00Z', '2015-EW43'], // CDC MMWR NNDSS tables: week ending 2015-10-31 = week 43
    ['epi-week', '2019-09-14T12:00:00Z', '2019-EW37'], // CDC WONDER NNDSS: week ending 2019-09-14 = week 37
    ['epi-week', '2020-12-26T12:00:00Z', '2020-EW52'], // CDC COVIDView: "Week 52, ending December 26, 2020"
    ['epi-week', '2021-01-02T12:00:00Z', '2020-EW53'], // CDC COVIDView: "Week 53, ending January 2, 2021"
    ['epi-week', '2021-01-09T12:00:00Z', '2021-EW01'], // CDC COVIDView: "Week #1, ending January 9, 2021"
    ['epi-week', '2026-01-01T12:00:00Z', '2025-EW53'], // REFERENCES §2: MMWR 2025 has 53 weeks, 2026 week 1 starts 2026-01-04
    ['epi-week', '2026-01-04T12:00:00Z', '2026-EW01'], // REFERENCES §2: MMWR 2026 week 1 = 2026-01-04 – 2026-01-10
  ] as const)('%s of %s is %s', async (unit, instant, label) => {
    const row = await periodIn(which, { unit, zone: 'UTC' }, instant);
    expect(row.period).toBe(label);
  });

  it.each([
    // [zone, local date (an instant inside it), start of the day (UTC), length in hours, source]
    ['America/Sao_Paulo', '2018-11-04T12:00:00Z', '2018-11-04T03:00:00Z', 23], // REFERENCES §5: midnight skipped, day starts 01:00 (Brazil 2018 Nov Sun>=1 0:00)
    ['America/Havana', '2024-11-03T12:00:00Z', '2024-11-03T04:00:00Z', 25], // REFERENCES §5: midnight occurs twice; Temporal's earlier start, 25 h
    ['America/Havana', '2024-03-10T12:00:00Z', '2024-03-10T05:00:00Z', 23], // REFERENCES §5: midnight skipped, day starts 01:00 (Cuba Mar Sun>=8 0:00s)
    ['Australia/Sydney', '2024-04-07T03:00:00Z', '2024-04-06T13:00:00Z', 25], // REFERENCES §5: AN Apr Sun>=1 2:00s, 25 h
    ['Australia/Sydney', '2024-10-06T03:00:00Z', '2024-10-05T14:00:00Z', 23], // REFERENCES §5: AN Oct Sun>=1 2:00s, 23 h
    ['America/New_York', '2024-03-10T12:00:00Z', '2024-03-10T05:00:00Z', 23], // REFERENCES §5: US 2007+ Mar Sun>=8 2:00
    ['America/New_York', '2024-11-03T12:00:00Z', '2024-11-03T04:00:00Z', 25], // REFERENCES §5: US Nov Sun>=1 2:00
    ['Asia/Kathmandu', '2024-03-10T06:00:00Z', '2024-03-09T18:15:00Z', 24], // REFERENCES §5: +05:45
  ] as const)('a day in %s holding %s starts at %s and lasts %d h', async (zone, instant, start, hours) => {
    const row = await periodIn(which, { unit: 'day', zone }, instant);
    expect(new Date(row.start).toISOString()).toBe(new Date(start).toISOString());
    expect((row.end - row.start) / H).toBe(hours);
  });

  it.each([
    // [options, instant, label, first day (local), source]
    [{ unit: 'fiscal-year', zone: 'America/New_York' }, '2023-10-01T12:00:00Z', 'FY2024', '2023-10-01T04:00:00Z'], // 31 U.S.C. §1102; FY2024 = 2023-10-01..2024-09-30
    [{ unit: 'fiscal-year', zone: 'America/New_York' }, '2024-09-30T12:00:00Z', 'FY2024', '2023-10-01T04:00:00Z'], // 31 U.S.C. §1102
    [{ unit: 'fiscal-year', zone: 'Asia/Tokyo', fiscalStart: { month: 4, day: 1 }, fiscalLabel: 'start' }, '2012-03-31T00:00:00Z', 'FY2011', '2011-03-31T15:00:00Z'], // Public Finance Act Art. 11: Apr 2011 – Mar 2012 named 2011
    [{ unit: 'fiscal-year', zone: 'Europe/London', fiscalStart: { month: 4, day: 6 }, fiscalLabel: 'start' }, '2024-04-05T12:00:00Z', 'FY2023', '2023-04-05T23:00:00Z'], // Income Tax Act 2007 s.4: tax year 2023-24 starts 6 April 2023
    [{ unit: 'fiscal-year', zone: 'Europe/London', fiscalStart: { month: 4, day: 6 }, fiscalLabel: 'start' }, '2024-04-06T12:00:00Z', 'FY2024', '2024-04-05T23:00:00Z'], // Income Tax Act 2007 s.4
    [{ unit: 'fiscal-quarter', zone: 'America/New_York' }, '2023-12-31T12:00:00Z', 'FY2024-Q1', '2023-10-01T04:00:00Z'], // 31 U.S.C. §1102: Q1 of FY2024 is Oct–Dec 2023
  ] as const)('%o holding %s is %s starting %s', async (options, instant, label, start) => {
    const row = await periodIn(which, options as CalendarOptions, instant);
    expect(row.period).toBe(label);
    expect(new Date(row.start).toISOString()).toBe(new Date(start).toISOString());
  });
});
